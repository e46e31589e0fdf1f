/**
 * The log's monthly hours (log_month_hours, kept by a trigger on log_entries) always equal the sums
 * over the entries themselves: after a long random run of inserts, edits (hours, date across months,
 * systems, moved to another build) and deletes, after writers of one build at the same time, and after a
 * build is deleted. The API reads its unfiltered totals and counts from these rows (db/log.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import knex from "knex";
import { makeBuild, makeUser, testDb } from "../support/db";
import { TEST_DB_URL } from "../support/env";

let a: string, b: string, author: string;
beforeAll(async () => {
  const u = await makeUser("log-hours");
  author = u.id;
  [{ buildId: a }, { buildId: b }] = await Promise.all([makeBuild({ owner: u }), makeBuild({ owner: u })]);
});
afterAll(() => testDb.destroy());

/** What the trigger keeps, as "month system" → [hours, entries] (rows at zero left out). */
async function kept(buildId: string) {
  const rows = await testDb("log_month_hours").where({ build_id: buildId }).where("entries", ">", 0).orderBy(["month", "system"]);
  return Object.fromEntries(rows.map((r) => [`${r.month} ${r.system}`, [Number(r.hours), r.entries]]));
}

/** The same sums computed from the entries now. */
async function computed(buildId: string) {
  const rows = (await testDb.raw(`
    select to_char(e.date, 'YYYY-MM') as month, s.system, sum(e.hours) as hours, count(*)::int as entries
      from log_entries e
      cross join lateral unnest(array['*']::text[] || case when cardinality(e.systems) = 0 then array['unassigned']::text[] else e.systems end) as s(system)
     where e.build_id = ? group by 1, 2 order by 1, 2`, [buildId])).rows as { month: string; system: string; hours: string; entries: number }[];
  return Object.fromEntries(rows.map((r) => [`${r.month} ${r.system}`, [Number(r.hours), r.entries]]));
}

/** A small deterministic generator (mulberry32), so a failure repeats. */
function rng(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const SYSTEMS = [[], ["pitch"], ["roll"], ["yaw"], ["pitch", "roll"], ["trim", "flap", "pitch"]];

describe("the log's monthly hours", () => {
  it("count a known handful exactly: an entry with two systems once toward its month's total", async () => {
    const { buildId } = await makeBuild({ owner: { id: author } });
    await testDb("log_entries").insert([
      { build_id: buildId, date: "2026-10-03", hours: 3.5, title: "a", systems: ["pitch"], author_id: author },
      { build_id: buildId, date: "2026-10-20", hours: 2, title: "b", systems: [], author_id: author },
      { build_id: buildId, date: "2026-11-02", hours: 1.25, title: "c", systems: ["pitch", "roll"], author_id: author },
    ]);
    expect(await kept(buildId)).toEqual({
      "2026-10 *": [5.5, 2], "2026-10 pitch": [3.5, 1], "2026-10 unassigned": [2, 1],
      "2026-11 *": [1.25, 1], "2026-11 pitch": [1.25, 1], "2026-11 roll": [1.25, 1],
    });
    // An edit that moves the entry to another month and drops a system moves its hours with it.
    await testDb("log_entries").where({ build_id: buildId, title: "c" }).update({ date: "2026-10-30", systems: ["roll"], hours: 1 });
    expect(await kept(buildId)).toEqual({ "2026-10 *": [6.5, 3], "2026-10 pitch": [3.5, 1], "2026-10 unassigned": [2, 1], "2026-10 roll": [1, 1] });
    // A change the trigger did not see would show: with it off, an insert leaves the kept sums behind.
    await testDb.raw("alter table log_entries disable trigger log_month_hours");
    try {
      await testDb("log_entries").insert({ build_id: buildId, date: "2026-12-01", hours: 1, title: "unseen", systems: [], author_id: author });
      expect(await kept(buildId)).not.toEqual(await computed(buildId));
    } finally {
      await testDb.raw("alter table log_entries enable trigger log_month_hours");
    }
  });

  it("stay equal to the entries' sums through 400 random inserts, edits and deletes over two builds", async () => {
    const next = rng(20261204);
    const pick = <T,>(xs: T[]) => xs[Math.floor(next() * xs.length)];
    const day = () => `202${Math.floor(next() * 3)}-${String(1 + Math.floor(next() * 12)).padStart(2, "0")}-${String(1 + Math.floor(next() * 28)).padStart(2, "0")}`;
    const hours = () => Math.round(next() * 40) / 4;
    const ids: string[] = [];
    for (let i = 0; i < 400; i++) {
      const op = ids.length < 20 ? 0 : Math.floor(next() * 6);
      if (op <= 1) {
        const [r] = await testDb("log_entries").insert({ build_id: pick([a, b]), date: day(), hours: hours(), title: `e${i}`, systems: pick(SYSTEMS), author_id: author }).returning("id");
        ids.push(r.id);
      } else if (op === 2) await testDb("log_entries").where({ id: pick(ids) }).update({ hours: hours() });
      else if (op === 3) await testDb("log_entries").where({ id: pick(ids) }).update({ date: day(), systems: pick(SYSTEMS) });
      else if (op === 4) await testDb("log_entries").where({ id: pick(ids) }).update({ build_id: pick([a, b]), title: `moved ${i}` });
      else {
        const id = ids.splice(Math.floor(next() * ids.length), 1)[0];
        await testDb("log_entries").where({ id }).delete();
      }
    }
    // A title-only edit does not touch the sums (the trigger fires on date, systems, hours and build only).
    await testDb("log_entries").whereIn("id", ids.slice(0, 10)).update({ title: "retitled" });
    for (const id of [a, b]) {
      const expected = await computed(id);
      expect(Object.keys(expected).length).toBeGreaterThan(20);
      expect(await kept(id)).toEqual(expected);
    }
  });

  it("lose no hours when several writers add to one month at the same time", async () => {
    const { buildId } = await makeBuild({ owner: { id: author } });
    const conns = Array.from({ length: 6 }, () => knex({ client: "pg", connection: TEST_DB_URL, pool: { min: 1, max: 1 } }));
    try {
      await Promise.all(conns.map((c, k) => c.transaction(async (t) => {
        for (let i = 0; i < 25; i++) await t("log_entries").insert({ build_id: buildId, date: "2026-11-15", hours: 0.5, title: `w${k}-${i}`, systems: ["pitch"], author_id: author });
      })));
    } finally {
      await Promise.all(conns.map((c) => c.destroy()));
    }
    expect(await kept(buildId)).toEqual({ "2026-11 *": [75, 150], "2026-11 pitch": [75, 150] });
  });

  it("go with their build when it is deleted", async () => {
    const { buildId } = await makeBuild({ owner: { id: author } });
    await testDb("log_entries").insert({ build_id: buildId, date: "2026-11-15", hours: 2, title: "x", systems: ["yaw"], author_id: author });
    expect(Object.keys(await kept(buildId))).toHaveLength(2);
    await testDb("builds").where({ id: buildId }).delete();
    expect(await testDb("log_month_hours").where({ build_id: buildId })).toEqual([]);
  });
});
