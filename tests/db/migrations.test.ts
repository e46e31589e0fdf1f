import { spawnSync } from "node:child_process";
import path from "node:path";
import knex from "knex";
import { afterAll, describe, expect, it } from "vitest";
import { testClusterUrl } from "../support/env";

const ROOT = path.resolve(__dirname, "../..");
const DB = "linkwright_migrations_test";
const url = testClusterUrl(DB);

function cli(args: string[]) {
  const r = spawnSync(process.execPath, ["--import", "tsx", "node_modules/knex/bin/cli.js", ...args], { cwd: ROOT, encoding: "utf8", env: { ...process.env, DATABASE_URL: url } });
  expect(r.status, r.stderr + r.stdout).toBe(0);
  return r.stdout;
}

const conn = knex({ client: "pg", connection: url });
afterAll(() => conn.destroy());

const tables = async () =>
  ((await conn.raw("select tablename from pg_tables where schemaname='public' and tablename not like 'knex_%' order by 1")).rows as { tablename: string }[]).map((r) => r.tablename);

describe("migrations", () => {
  it("go up to latest, down to nothing, and up again", async () => {
    const reset = spawnSync(process.execPath, ["--import", "tsx", "scripts/reset-db.ts", DB], { cwd: ROOT, encoding: "utf8" });
    expect(reset.status, reset.stderr).toBe(0);
    cli(["migrate:latest"]);
    const first = await tables();
    for (const t of ["users", "builds", "memberships", "invitations", "linkages", "linkage_revisions", "audit_events"]) expect(first).toContain(t);
    cli(["migrate:rollback", "--all"]);
    expect(await tables()).toEqual([]);
    cli(["migrate:latest"]);
    expect(await tables()).toEqual(first);
  });

  it("keep the revision number unique per linkage", async () => {
    const [u] = await conn("users").insert({ email: "m@tests.linkwright.test", name: "M", password_hash: "x" }).returning("id");
    const [b] = await conn("builds").insert({ name: "B" }).returning("id");
    const [l] = await conn("linkages").insert({ build_id: b.id, name: "L", system: "pitch" }).returning("id");
    await conn("linkage_revisions").insert({ linkage_id: l.id, revision: 1, graph: "{}", author_id: u.id });
    await expect(conn("linkage_revisions").insert({ linkage_id: l.id, revision: 1, graph: "{}", author_id: u.id })).rejects.toThrow(/unique/);
  });
});
