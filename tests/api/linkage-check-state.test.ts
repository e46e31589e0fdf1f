/**
 * "Not checked" never reads as "passes", on a real server and database: the linkage list carries each current
 * revision's part count beside its stored summary, the overview names the linkages with nothing drawn or no stored
 * check instead of counting them as zeros, and a linkage's checklist page shows the open hazards of the current
 * revision's stored report (read, not computed again) beside the items of their joint.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { addRevision } from "../support/review";
import { analyze } from "@/shared/analysis";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";
import { emptyGraph, type LinkageGraph } from "@/shared/linkage/schema";
import { fingerprint } from "@/shared/review/fingerprint";
import type { Linkage } from "@/shared/schemas/linkages";

let owner: Client, viewer: Client;
let buildId = "";
let reviewerId = "";
/** never: made by makeBuild, revision 1 an empty graph saved without a report. */
const L = { never: "", emptyZeros: "", demo: "", demoNoReport: "" };

async function linkageWith(name: string, graph: LinkageGraph, withReport: boolean) {
  const [l] = await testDb("linkages").insert({ build_id: buildId, name, system: graph.system, current_revision: 1 }).returning("id");
  await testDb("linkage_revisions").insert({ linkage_id: l.id, revision: 1, graph: JSON.stringify(graph), analysis: withReport ? JSON.stringify(analyze(graph)) : null });
  return l.id as string;
}

/** A page's visible words: tags and React's text separators taken out. */
const words = (html: string) => html.replace(/<script[\s\S]*?<\/script>/g, "").replace(/<!-- -->/g, "").replace(/<[^>]+>/g, " ").replace(/&#x27;|&apos;/g, "'").replace(/\s+/g, " ");

beforeAll(async () => {
  const [o, r, v] = await Promise.all([makeUser("check-owner"), makeUser("check-reviewer"), makeUser("check-viewer")]);
  reviewerId = r.id;
  const ids = await makeBuild({ owner: o, reviewer: r, viewer: v });
  buildId = ids.buildId;
  L.never = ids.linkageId;
  L.emptyZeros = await linkageWith("Drawn and rubbed out", emptyGraph("Drawn and rubbed out", "roll"), true);
  L.demoNoReport = await linkageWith("Saved before the check", demoPitchLinkage(), false);
  L.demo = await linkageWith("Demo pitch", emptyGraph("Demo pitch", "pitch"), false);
  await addRevision(L.demo, demoPitchLinkage(), o.id); // revision 2, with its report
  [owner, viewer] = await Promise.all([signIn(o.email), signIn(v.email)]);
});
afterAll(() => testDb.destroy());

describe("the linkage list", () => {
  it("carries each current revision's part count beside its stored summary", async () => {
    const res = await viewer.request("GET", `/api/builds/${buildId}/linkages`);
    expect(res.status).toBe(200);
    const by = new Map((res.body.linkages as Linkage[]).map((l) => [l.id, l]));
    expect(by.get(L.never)).toMatchObject({ parts: 0, summary: null });
    // An empty drawing's stored report counts nothing: only the part count tells it from a clean check.
    expect(by.get(L.emptyZeros)).toMatchObject({ parts: 0, summary: { hazard: 0, caution: 0 } });
    expect(by.get(L.demoNoReport)).toMatchObject({ parts: demoPitchLinkage().nodes.length, summary: null });
    expect(by.get(L.demo)).toMatchObject({ revision: 2, parts: demoPitchLinkage().nodes.length, summary: { hazard: 2 } }); // the demo's wrong joint
  });

  it("a new linkage answers with its part count", async () => {
    const res = await owner.request("POST", `/api/builds/${buildId}/linkages`, { name: "Made here", system: "pitch", graph: demoPitchLinkage() });
    expect(res.status).toBe(201);
    expect(res.body.linkage.parts).toBe(demoPitchLinkage().nodes.length);
    await owner.request("DELETE", `/api/builds/${buildId}/linkages/${res.body.linkage.id}`);
  });
});

describe("the build overview", () => {
  it("shows nothing drawn and not checked in neutral words, never 'none open', and leaves them out of the open findings", async () => {
    const res = await viewer.request("GET", `/builds/${buildId}`);
    expect(res.status).toBe(200);
    const text = words(res.body);
    expect(text).not.toMatch(/none open/);
    expect(text.match(/nothing drawn yet/g)?.length).toBeGreaterThanOrEqual(2);
    expect(text).toMatch(/not checked yet/);
    expect(text).toMatch(/In 1 checked linkage; not counted: 1 linkage not checked yet and 2 with nothing drawn yet\./);
    expect(res.body).toMatch(/data-state="nothing-drawn"/);
  });
});

describe("a linkage's checklist page", () => {
  const page = async (id: string) => {
    const res = await viewer.request("GET", `/builds/${buildId}/checklist/${id}`);
    expect(res.status).toBe(200);
    return { html: res.body as string, text: words(res.body) };
  };

  it("shows the current revision's open hazards by name, with a link to each in the editor", async () => {
    const { html, text } = await page(L.demo);
    expect(html).toMatch(/data-testid="checklist-findings"[^>]*data-hazards="2"/);
    expect(text).toMatch(/2 open hazards and \d+ cautions? in the check of revision 2/);
    expect(text).toMatch(/Hazard: Jam nut missing — Aft pushrod B ↔ Elevator horn, attach/);
    expect(text).toMatch(/Hazard: Retaining washer small/);
    expect(html).toContain(`/builds/${buildId}/linkages/${L.demo}?select=${DEMO_WRONG_JOINT}`);
    expect(text).not.toMatch(/jam-nut-missing/); // a person's words, not the code
    expect(text).toMatch(/Caution\./); // the standing caution wherever results show
  });

  it("reads the stored report: a hazard acknowledged for this hardware is no longer open", async () => {
    const graph = demoPitchLinkage();
    const subject = { type: "joint" as const, id: DEMO_WRONG_JOINT };
    const [ack] = await testDb("finding_acknowledgements")
      .insert({ linkage_id: L.demo, code: "jam-nut-missing", subject_type: "joint", subject_id: DEMO_WRONG_JOINT, reason: "Jam nut fitted, not recorded", user_id: reviewerId, revision: 2, fingerprint: fingerprint(graph, subject) })
      .returning("id");
    try {
      const { html, text } = await page(L.demo);
      expect(html).toMatch(/data-hazards="1"/);
      expect(text).not.toMatch(/Hazard: Jam nut missing/);
      expect(text).toMatch(/1 other finding was acknowledged/);
    } finally {
      await testDb("finding_acknowledgements").where({ id: ack.id }).del();
    }
  });

  it("takes the hazards from the report stored with the revision, not from a new run of the engine", async () => {
    const row = await testDb("linkage_revisions").where({ linkage_id: L.demo, revision: 2 }).first("analysis");
    const stored = typeof row.analysis === "string" ? JSON.parse(row.analysis) : row.analysis;
    const cleared = { ...stored, findings: [], summary: { ...stored.summary, hazard: 0, caution: 0, advisory: 0 } };
    await testDb("linkage_revisions").where({ linkage_id: L.demo, revision: 2 }).update({ analysis: JSON.stringify(cleared), summary: JSON.stringify(cleared.summary) });
    try {
      const { html, text } = await page(L.demo);
      expect(html).toMatch(/data-hazards="0"/);
      expect(text).toMatch(/No open hazards or cautions in the check of revision 2/);
    } finally {
      await testDb("linkage_revisions").where({ linkage_id: L.demo, revision: 2 }).update({ analysis: JSON.stringify(stored), summary: JSON.stringify(stored.summary) });
    }
  });

  it("says so when the revision was saved without a check, or has nothing drawn, instead of showing no hazards", async () => {
    const unchecked = await page(L.demoNoReport);
    expect(unchecked.html).toMatch(/data-hazards="unknown"/);
    expect(unchecked.text).toMatch(/The check of revision 1 is not stored/);
    const empty = await page(L.never);
    expect(empty.text).toMatch(/Nothing is drawn in revision 1 yet/);
    const zeros = await page(L.emptyZeros);
    expect(zeros.text).toMatch(/Nothing is drawn in revision 1 yet/);
    expect(zeros.text).not.toMatch(/No open hazards/);
  });
});
