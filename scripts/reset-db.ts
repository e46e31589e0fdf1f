/** Drops and recreates one database of the local cluster (tests start from nothing). */
import { spawnSync } from "node:child_process";
import { up, PG_PORT } from "../db/pg";

const name = process.argv[2];
if (!name || !/^[a-z_][a-z0-9_]*_test$|^linkwright_[a-z0-9_]+$/.test(name)) {
  console.error("usage: reset-db.ts <name ending in _test>");
  process.exit(2);
}
const psql = (sql: string) => {
  const args = ["-h", "127.0.0.1", "-p", String(PG_PORT), "-U", "postgres", "-d", "postgres", "-v", "ON_ERROR_STOP=1", "-qc", sql];
  const r = process.getuid?.() === 0 ? spawnSync("runuser", ["-u", "postgres", "--", "psql", ...args], { encoding: "utf8" }) : spawnSync("psql", args, { encoding: "utf8" });
  if (r.status !== 0) throw new Error(r.stderr);
};
psql(`drop database if exists ${name} with (force)`);
up([name]);
