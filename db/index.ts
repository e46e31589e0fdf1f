import "server-only";
import knex, { type Knex } from "knex";
import config from "../knexfile";

const g = globalThis as unknown as { __lwKnex?: Knex };

/** One Knex instance per process, kept on globalThis across hot reloads. */
export const db: Knex = g.__lwKnex ?? knex(config);
if (process.env.NODE_ENV !== "production") g.__lwKnex = db;
