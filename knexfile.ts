import type { Knex } from "knex";
import path from "node:path";
import { localDbUrl } from "./db/local-cluster.cjs";

// DATABASE_URL, else the app database on the local app cluster (db/local-cluster.cjs: port and password).
const url = process.env.DATABASE_URL || localDbUrl(process.env.LW_APP_DB || "linkwright", "app");

const config: Knex.Config = {
  client: "pg",
  // A database host that does not answer at all is given up on after 5 s (the request then answers 503), not Knex's 60 s.
  connection: { connectionString: url, connectionTimeoutMillis: 5_000 },
  acquireConnectionTimeout: 10_000,
  pool: { min: 0, max: Number(process.env.LW_PG_POOL || 10) },
  migrations: { directory: process.env.LW_MIGRATIONS_DIR || path.join(__dirname, "db/migrations"), extension: "ts", tableName: "knex_migrations" },
  seeds: { directory: path.join(__dirname, "db/seeds"), extension: "ts" },
};

export default config;
module.exports = config;
