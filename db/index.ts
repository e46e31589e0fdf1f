import "server-only";
import knex, { type Knex } from "knex";
import config from "../knexfile";
import { stampUnavailable } from "./unavailable";

const g = globalThis as unknown as { __lwKnex?: Knex };

/** One Knex instance per process, kept on globalThis across hot reloads. */
export const db: Knex = g.__lwKnex ?? watchConnections(knex(config));
if (process.env.NODE_ENV !== "production") g.__lwKnex = db;

/**
 * Marks the errors that mean the database is not answering (db/unavailable.ts), where they arise: getting
 * a connection from the pool (refused, timed out, starting up) and a query cut off (shutdown). The API
 * answers them 503 and a page's error boundary recognises them by the mark.
 */
function watchConnections(k: Knex): Knex {
  const client = k.client as { acquireConnection: () => Promise<unknown> };
  const acquire = client.acquireConnection.bind(client);
  client.acquireConnection = () => acquire().catch((e: unknown) => Promise.reject(stampUnavailable(e)));
  k.on("query-error", (e: unknown) => stampUnavailable(e));
  return k;
}
