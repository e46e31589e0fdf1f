/**
 * Long lists are read a page at a time, newest first, with the total: every entry is reached exactly
 * once, filters and hour totals cover every entry (not one page), and a bad cursor or page size is a 400.
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";

let owner: Client, outsider: Client;
let buildId: string, ownerId: string;
const B = () => `/api/builds/${buildId}`;
const N = 130;

/** 130 entries over 130 days (two on some days, written at the same instant: the id breaks the tie). */
beforeAll(async () => {
  const [o, x] = await Promise.all([makeUser("page-owner"), makeUser("page-outsider")]);
  ownerId = o.id;
  ({ buildId } = await makeBuild({ owner: o }));
  const day = (i: number) => new Date(Date.UTC(2020, 0, 1) + Math.floor(i * 0.8) * 86_400_000).toISOString().slice(0, 10);
  await testDb("log_entries").insert(Array.from({ length: N }, (_, i) => ({
    build_id: buildId, date: day(i), hours: 0.25 + (i % 4) * 0.25, title: `Entry ${String(i).padStart(3, "0")}${i % 10 === 0 ? " rivet" : ""}`, systems: i % 3 === 0 ? ["pitch", "roll"] : i % 3 === 1 ? ["yaw"] : [], author_id: ownerId,
  })));
  const files = Array.from({ length: 75 }, (_, i) => ({ id: randomUUID(), build_id: buildId, key: `builds/${buildId}/files/p${i}.png`, kind: i % 5 === 0 ? "pdf" : "photo", content_type: "image/png", size: 10, name: `f${i}.png`, created_at: new Date(Date.UTC(2021, 0, 1) + i * 1000) }));
  await testDb("files").insert(files);
  await testDb("audit_events").insert(Array.from({ length: 60 }, () => ({ build_id: buildId, user_id: ownerId, action: "log.create", detail: "{}" })));
  [owner, outsider] = await Promise.all([signIn(o.email), signIn(x.email)]);
});
afterAll(() => testDb.destroy());

async function readAll(path: string, name: string, limit: number) {
  const pages: { items: { id: string }[]; total: number }[] = [];
  let cursor: string | null = null;
  do {
    const r = await owner.request("GET", `${path}${path.includes("?") ? "&" : "?"}limit=${limit}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ""}`);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    pages.push({ items: r.body[name], total: r.body.total });
    cursor = r.body.nextCursor;
    expect(pages.length).toBeLessThan(100);
  } while (cursor);
  return pages;
}

describe("the build log, paged", () => {
  it("reaches every entry exactly once, newest first, with the total on every page", async () => {
    const pages = await readAll(`${B()}/log`, "entries", 50);
    expect(pages.map((p) => p.items.length)).toEqual([50, 50, 30]);
    expect(new Set(pages.map((p) => p.total))).toEqual(new Set([N]));
    const all = pages.flatMap((p) => p.items) as unknown as { id: string; date: string; title: string }[];
    expect(new Set(all.map((e) => e.id)).size).toBe(N);
    const dates = all.map((e) => e.date);
    expect(dates).toEqual([...dates].sort().reverse());
    // The oldest day (two entries written at the same instant) comes last.
    expect(all.slice(-2).map((e) => e.title).sort()).toEqual(["Entry 000 rivet", "Entry 001"]);
  });

  it("filters and totals hours in the database over every entry, not one page", async () => {
    const r = await owner.request("GET", `${B()}/log?limit=5`);
    const expected = Array.from({ length: N }, (_, i) => 0.25 + (i % 4) * 0.25).reduce((a, b) => a + b, 0);
    expect(r.body.totals.total).toBe(expected);
    expect(r.body.totals.bySystem.unassigned).toBe(Array.from({ length: N }, (_, i) => i).filter((i) => i % 3 === 2).reduce((a, i) => a + 0.25 + (i % 4) * 0.25, 0));
    const months = r.body.totals.byMonth as { month: string; total: number }[];
    expect(months[0].month).toBe("2020-01");
    const search = await readAll(`${B()}/log?q=RIVET`, "entries", 4);
    expect(search.flatMap((p) => p.items).length).toBe(13);
    expect(search[0].total).toBe(13);
    const yaw = await owner.request("GET", `${B()}/log?system=yaw&limit=1`);
    expect(yaw.body.total).toBe(Math.floor((N + 1) / 3));
    // Later pages carry no totals (the first page has them).
    expect((await owner.request("GET", `${B()}/log?limit=5&cursor=${encodeURIComponent(r.body.nextCursor)}`)).body.totals).toBeUndefined();
  });

  it("refuses a bad cursor or page size with a 400 naming it", async () => {
    for (const [q, field] of [["limit=0", "limit"], ["limit=201", "limit"], ["limit=ten", "limit"], ["cursor=nonsense", "cursor"], [`cursor=${Buffer.from(JSON.stringify(["2020-01-01", "x", "y"])).toString("base64url")}`, "cursor"], [`cursor=${Buffer.from(JSON.stringify(["1"])).toString("base64url")}`, "cursor"]]) {
      const r = await owner.request("GET", `${B()}/log?${q}`);
      expect([r.status, Object.keys(r.body.error.fields)], q).toEqual([400, [field]]);
    }
    expect((await outsider.request("GET", `${B()}/log?limit=5`)).status).toBe(404);
  });
});

describe("files, activity and parts, paged", () => {
  it("the files list reaches the first upload, and a kind filter counts only its kind", async () => {
    const pages = await readAll(`${B()}/files`, "files", 20);
    const all = pages.flatMap((p) => p.items) as unknown as { name: string }[];
    expect([all.length, pages[0].total]).toEqual([75, 75]);
    expect(all[all.length - 1].name).toBe("f0.png");
    const pdfs = await readAll(`${B()}/files?kind=pdf`, "files", 50);
    expect(pdfs[0].total).toBe(15);
    expect((await owner.request("GET", `${B()}/files?kind=zip`)).status).toBe(400);
  });

  it("activity pages through every event", async () => {
    const pages = await readAll(`${B()}/activity`, "activity", 25);
    const all = pages.flatMap((p) => p.items);
    expect(all.length).toBe(pages[0].total);
    expect(all.length).toBeGreaterThanOrEqual(60);
    expect(new Set(all.map((a) => a.id)).size).toBe(all.length);
  });

  it("a parts library pages and searches in the database", async () => {
    await testDb("parts").insert(Array.from({ length: 45 }, (_, i) => ({ build_id: buildId, kind: i % 2 ? "bolt" : "rodEnd", part_number: `PN-${i}`, description: i % 9 === 0 ? "stainless" : "", spec: "{}" })));
    const pages = await readAll(`${B()}/parts`, "parts", 20);
    expect(pages.map((p) => p.items.length)).toEqual([20, 20, 5]);
    const found = await owner.request("GET", `${B()}/parts?q=STAINLESS&limit=2`);
    expect([found.body.total, found.body.parts.length]).toEqual([5, 2]);
    expect((await owner.request("GET", `${B()}/parts?kind=bolt`)).body.total).toBe(22);
    expect((await owner.request("GET", `${B()}/parts?kind=rivet`)).status).toBe(400);
  });
});

describe("review threads, paged", () => {
  it("pages threads newest first, each with its replies, and counts open threads over all of them", async () => {
    const linkageId = (await testDb("linkages").where({ build_id: buildId }).first("id")).id as string;
    const roots = Array.from({ length: 60 }, (_, i) => ({ id: randomUUID(), build_id: buildId, linkage_id: linkageId, subject_type: "joint", subject_id: i % 2 ? "j-a" : "j-b", author_id: ownerId, body: `thread ${i}`, revision: 1, created_at: new Date(Date.UTC(2022, 0, 1) + i * 60_000), resolved_at: i % 3 ? null : new Date() }));
    await testDb("comments").insert(roots);
    await testDb("comments").insert(roots.map((r, i) => ({ build_id: buildId, linkage_id: linkageId, subject_type: r.subject_type, subject_id: r.subject_id, parent_id: r.id, author_id: ownerId, body: `reply to ${i}`, revision: 1, created_at: new Date(r.created_at.getTime() + 1000) })));
    const L = `${B()}/linkages/${linkageId}/comments`;
    const pages = await readAll(L, "comments", 25);
    expect(pages.map((p) => p.items.length)).toEqual([50, 50, 20]); // 25, 25 and 10 threads, each with its reply
    expect(pages[0].total).toBe(60);
    const all = pages.flatMap((p) => p.items) as unknown as { body: string; parentId: string | null }[];
    const threadOrder = all.filter((c) => !c.parentId).map((c) => Number(c.body.split(" ")[1]));
    expect(threadOrder).toEqual(Array.from({ length: 60 }, (_, i) => 59 - i));
    expect(all.filter((c) => c.parentId).length).toBe(60);
    const one = await owner.request("GET", `${L}?subjectType=joint&subjectId=j-a&limit=5`);
    expect([one.body.total, one.body.comments.length]).toEqual([30, 10]);
    expect(one.body.unresolved).toEqual({ "joint:j-a": 20, "joint:j-b": 20 });
  });
});
