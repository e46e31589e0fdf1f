/**
 * An upgrade whose migration fails keeps the schema and the data as they were, and `npm start` says
 * which migration failed and stops before building or serving. The migrations folder is a copy of the
 * real one plus two new migrations (one that works, one that fails on purpose), in tests/artifacts/.
 */
import { spawnSync } from "node:child_process";
import { cpSync, mkdirSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import knex from "knex";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testClusterUrl } from "../support/env";

const ROOT = path.resolve(__dirname, "../..");
const DB = "linkwright_upgrade_test";
const url = testClusterUrl(DB);
const dir = path.join(ROOT, "tests/artifacts", `migrations-${process.pid}`);
const conn = knex({ client: "pg", connection: url, pool: { min: 0, max: 2 } });

function node(args: string[], env: Record<string, string> = {}) {
  return spawnSync(process.execPath, args, { cwd: ROOT, encoding: "utf8", env: { ...process.env, ...env }, timeout: 120_000 });
}

/** Every column of every table, and every row of every table (count and digest). */
async function state() {
  const columns = (await conn.raw("select table_name, column_name, data_type, is_nullable from information_schema.columns where table_schema = 'public' order by 1, 2")).rows;
  const tables = (await conn.raw("select tablename from pg_tables where schemaname = 'public' order by 1")).rows as { tablename: string }[];
  const rows: Record<string, string> = {};
  for (const { tablename } of tables) {
    const r = await conn.raw(`select count(*)::int as n, coalesce(md5(string_agg(t::text, '|' order by t::text)), '') as h from "${tablename}" t`);
    rows[tablename] = `${r.rows[0].n}:${r.rows[0].h}`;
  }
  return { columns, rows };
}

beforeAll(() => {
  const reset = node(["--import", "tsx", "scripts/reset-db.ts", DB]);
  expect(reset.status, reset.stderr).toBe(0);
  const first = node(["--import", "tsx", "scripts/migrate.ts", "--seed"], { DATABASE_URL: url });
  expect(first.status, first.stderr + first.stdout).toBe(0);
  mkdirSync(dir, { recursive: true });
  cpSync(path.join(ROOT, "db/migrations"), dir, { recursive: true });
  writeFileSync(
    path.join(dir, "20991231000100_adds_a_column.ts"),
    `export async function up(knex) {
  await knex.schema.alterTable("users", (t) => t.text("nickname"));
  await knex("users").update({ nickname: "x", name: knex.raw("upper(name)") });
}
export async function down(knex) { await knex.schema.alterTable("users", (t) => t.dropColumn("nickname")); }
`,
  );
  writeFileSync(
    path.join(dir, "20991231000200_fails_on_purpose.ts"),
    `export async function up(knex) {
  await knex.schema.createTable("half_done", (t) => t.integer("id"));
  await knex("builds").del();
  await knex.raw("select 1 / 0");
}
export async function down() {}
`,
  );
});

afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  await conn.destroy();
});

describe("a migration that fails", () => {
  it("leaves schema and data as they were, and npm start names it and stops", async () => {
    const before = await state();
    expect(Object.keys(before.rows)).toContain("builds");
    expect(before.rows.builds).not.toMatch(/^0:/);

    const r = node(["scripts/start.mjs"], { DATABASE_URL: url, LW_MIGRATIONS_DIR: dir, PORT: String(Number(process.env.LW_TEST_PORT || 3100) + 7) });
    const out = r.stdout + r.stderr;
    expect(r.status, out).toBe(1);
    expect(out).toContain("Migration 20991231000200_fails_on_purpose.ts failed: select 1 / 0 - division by zero");
    expect(out).toMatch(/None of the 2 pending migrations was kept/);
    expect(out).not.toContain("Building the app");

    const after = await state();
    expect(after.columns).toEqual(before.columns);
    expect(after.rows).toEqual(before.rows);

    // With the failing one fixed, the same folder migrates (the working migration was not half-applied).
    rmSync(path.join(dir, "20991231000200_fails_on_purpose.ts"));
    const ok = node(["--import", "tsx", "scripts/migrate.ts"], { DATABASE_URL: url, LW_MIGRATIONS_DIR: dir });
    expect(ok.status, ok.stderr + ok.stdout).toBe(0);
    expect((await conn("users").whereNot({ nickname: "x" }).count<{ count: string }[]>("* as count"))[0].count).toBe("0");
  });
});
