/**
 * A revision row's content id (migration 20261204000900) is new whenever its graph or report changes and only
 * then: the app's cache of revisions' text (db/revision-content.ts) relies on an id never naming two contents.
 */
import { afterAll, describe, expect, it, vi } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { emptyGraph } from "@/shared/linkage/schema";
import { cacheBytes, revisionContent } from "@/db/revision-content";

// The app's Knex instance is the tests' own connection to the same test database (db/index.ts reads the
// knexfile, which only the app's bundler loads).
vi.mock("@/db/index", async () => ({ db: (await import("../support/db")).testDb }));

afterAll(() => testDb.destroy());

describe("linkage_revisions.content_id", () => {
  it("changes with the graph or the report, not with anything else, and differs between rows", async () => {
    const u = await makeUser("content-id");
    const { linkageId } = await makeBuild({ owner: u });
    const row = () => testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).first("id", "content_id", "summary");
    const first = await row();
    expect(first.content_id).toMatch(/^[0-9a-f-]{36}$/);
    await testDb("linkage_revisions").where({ id: first.id }).update({ author_id: null });
    expect((await row()).content_id).toBe(first.content_id);
    await testDb("linkage_revisions").where({ id: first.id }).update({ analysis: JSON.stringify({ summary: { hazard: 0, caution: 0, advisory: 0 } }) });
    const afterReport = (await row()).content_id;
    expect(afterReport).not.toBe(first.content_id);
    await testDb("linkage_revisions").where({ id: first.id }).update({ graph: JSON.stringify(emptyGraph("Renamed", "pitch")) });
    expect((await row()).content_id).not.toBe(afterReport);
    await testDb("linkage_revisions").insert({ linkage_id: linkageId, revision: 2, graph: JSON.stringify(emptyGraph("Two", "pitch")), author_id: u.id });
    const two = await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 2 }).first("content_id", "summary");
    expect(two.content_id).not.toBe((await row()).content_id);
    expect(two.summary).toBeNull(); // no report, no summary
    expect((await row()).summary).toEqual({ hazard: 0, caution: 0, advisory: 0 }); // the report's summary, kept by PostgreSQL
  });
});

describe("the revision text cache (db/revision-content.ts)", () => {
  it("reads a revision's text by its row and what it is a revision of, and keeps each text under its own content id", async () => {
    const u = await makeUser("content-cache");
    const { linkageId } = await makeBuild({ owner: u });
    const row = async () => testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).first("id", "content_id");
    const first = await row();
    const ref = { id: String(first.id), linkageId, revision: 1, contentId: first.content_id };
    const before = await revisionContent(ref);
    expect(JSON.parse(before!.graph).name).toBe("Pitch run");
    await testDb("linkage_revisions").where({ id: first.id }).update({ graph: JSON.stringify(emptyGraph("Renamed run", "pitch")) });
    // The id read before the change still names the text it named (a request that read it gets that text) ...
    expect(JSON.parse((await revisionContent(ref))!.graph).name).toBe("Pitch run");
    // ... and the new id, which every later access reads, names the new text.
    expect(JSON.parse((await revisionContent({ ...ref, contentId: (await row()).content_id }))!.graph).name).toBe("Renamed run");
    // A row id that is not this linkage's revision reads nothing (a row id may be given again after a restore).
    expect(await revisionContent({ ...ref, revision: 2, contentId: "00000000-0000-4000-8000-000000000000" })).toBeNull();
  });

  it("takes its size in whole bytes, and the default for a setting that is no size", () => {
    expect(cacheBytes(undefined)).toBe(64 * 1024 * 1024);
    expect(cacheBytes("0")).toBe(0);
    expect(cacheBytes("0.1")).toBe(104857);
    for (const bad of ["lots", "-1", "Infinity"]) expect(cacheBytes(bad)).toBe(64 * 1024 * 1024);
  });
});
