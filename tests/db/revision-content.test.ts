/**
 * A revision row's content id (migration 20261204000900) is new whenever its graph or report changes and only
 * then: the app's cache of revisions' text (db/revision-content.ts) relies on an id never naming two contents.
 */
import { afterAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { emptyGraph } from "@/shared/linkage/schema";

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
