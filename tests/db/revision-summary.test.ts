/**
 * A revision's summary (migration 20261205000100): the app writes it beside the report, from the same engine
 * run; a writer that gives a report without it still gets it, filled from the report by PostgreSQL, on insert
 * and on an update that changes the report alone. Linkage lists, revision lists and the build log read it.
 */
import { afterAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { demoPitchLinkage } from "@/shared/demo";
import { emptyGraph } from "@/shared/linkage/schema";
import { analyze } from "@/shared/analysis";

afterAll(() => testDb.destroy());

const report = (hazard: number, caution: number) => JSON.stringify({ engineVersion: "test", summary: { hazard, caution, advisory: 0 } });

describe("linkage_revisions.summary", () => {
  it("is what the writer gives; missing, it is read from the report; on an update, it follows the report", async () => {
    const u = await makeUser("summary");
    const { linkageId } = await makeBuild({ owner: u });
    const graph = JSON.stringify(emptyGraph("Pitch run", "pitch"));
    const summaryOf = async (revision: number) => (await testDb("linkage_revisions").where({ linkage_id: linkageId, revision }).first("summary")).summary;

    // Given: kept as given (the save passes the summary of the report it stores).
    await testDb("linkage_revisions").insert({ linkage_id: linkageId, revision: 2, graph, analysis: report(1, 2), summary: JSON.stringify({ hazard: 1, caution: 2, advisory: 0 }), author_id: u.id });
    expect(await summaryOf(2)).toEqual({ hazard: 1, caution: 2, advisory: 0 });
    // Not given: read from the report.
    await testDb("linkage_revisions").insert({ linkage_id: linkageId, revision: 3, graph, analysis: report(3, 4), author_id: u.id });
    expect(await summaryOf(3)).toEqual({ hazard: 3, caution: 4, advisory: 0 });
    // No report: no summary.
    await testDb("linkage_revisions").insert({ linkage_id: linkageId, revision: 4, graph, author_id: u.id });
    expect(await summaryOf(4)).toBeNull();

    // The report changed alone: the summary follows it.
    await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 3 }).update({ analysis: report(5, 6) });
    expect(await summaryOf(3)).toEqual({ hazard: 5, caution: 6, advisory: 0 });
    await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 4 }).update({ analysis: report(0, 1) });
    expect(await summaryOf(4)).toEqual({ hazard: 0, caution: 1, advisory: 0 });
    // Both changed: the writer's summary stands.
    await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 2 }).update({ analysis: report(7, 8), summary: JSON.stringify({ hazard: 7, caution: 8, advisory: 0 }) });
    expect(await summaryOf(2)).toEqual({ hazard: 7, caution: 8, advisory: 0 });
    // Anything else changed: the summary stays.
    await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 2 }).update({ graph: JSON.stringify(emptyGraph("Renamed", "pitch")) });
    expect(await summaryOf(2)).toEqual({ hazard: 7, caution: 8, advisory: 0 });
  });

  it("of a real report is that report's summary", async () => {
    const u = await makeUser("summary-real");
    const { linkageId } = await makeBuild({ owner: u });
    const r = analyze(demoPitchLinkage());
    expect(r.summary.hazard).toBeGreaterThan(0); // the demo run's planted faults
    await testDb("linkage_revisions").insert({ linkage_id: linkageId, revision: 2, graph: JSON.stringify(demoPitchLinkage()), analysis: JSON.stringify(r), author_id: u.id });
    expect((await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 2 }).first("summary")).summary).toEqual(r.summary);
  });
});
