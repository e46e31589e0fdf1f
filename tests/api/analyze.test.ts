/** The engine behind the API: POST /api/analyze answers without storing; a save stores the report with its revision. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, snapshot, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { demoPitchLinkage } from "@/shared/demo";
import { analyze } from "@/shared/analysis";
import { parseLinkageFile } from "@/shared/linkage/io";
import { APP_URL } from "../support/env";

let owner: Client;
let ids: { buildId: string; linkageId: string };
beforeAll(async () => {
  const u = await makeUser("analyst");
  owner = await signIn(u.email);
  ids = await makeBuild({ owner: u });
});
afterAll(() => testDb.destroy());

const codes = (r: { findings: { code: string; subject: { id: string } }[] }) => r.findings.map((f) => `${f.code}@${f.subject.id}`).sort();

describe("analysis over the API", () => {
  it("POST /api/analyze returns the same report the engine gives, and stores nothing", async () => {
    const graph = demoPitchLinkage();
    const before = await snapshot();
    const res = await owner.request("POST", "/api/analyze", { graph });
    expect(res.status).toBe(200);
    expect(codes(res.body.report)).toEqual(codes(analyze(graph)));
    expect(res.body.report.findings.some((f: { code: string }) => f.code === "jam-nut-missing")).toBe(true);
    expect(await snapshot()).toEqual(before);
  });

  it("takes the build's settings in the request: a doubled pilot force doubles every pushrod load", async () => {
    const graph = demoPitchLinkage();
    const base = (await owner.request("POST", "/api/analyze", { graph })).body.report;
    const doubled = (await owner.request("POST", "/api/analyze", { graph, settings: { pilotForce: { pitchStick: 334, rollStick: 67, yawPedal: 200, other: 100 } } })).body.report;
    expect(base.pushrods.length).toBeGreaterThan(0);
    base.pushrods.forEach((p: { nodeId: string; limitAxial: number }, i: number) => {
      expect(doubled.pushrods[i].nodeId).toBe(p.nodeId);
      expect(doubled.pushrods[i].limitAxial).toBeCloseTo(2 * p.limitAxial, 6);
    });
  });

  it("a save stores the analysis with the revision and returns it", async () => {
    const graph = demoPitchLinkage();
    const url = `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`;
    const res = await owner.request("PUT", url, { baseRevision: 1, graph });
    expect(res.status).toBe(200);
    const stored = await testDb("linkage_revisions").where({ linkage_id: ids.linkageId, revision: res.body.revision }).first();
    expect(stored.analysis.summary).toEqual(res.body.analysis.summary);
    expect(codes(stored.analysis)).toEqual(codes(analyze(graph)));
    const got = await owner.request("GET", url);
    expect(got.body.analysis.summary.hazard).toBe(res.body.analysis.summary.hazard);
    expect(got.body.analysis.summary.hazard).toBeGreaterThan(0);
  });

  it("a save asked with Prefer: return=minimal (RFC 7240) answers the summary alone and stores the whole report", async () => {
    const graph = demoPitchLinkage();
    const url = `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`;
    const base = (await owner.request("GET", url)).body.revision;
    const res = await fetch(`${APP_URL}${url}`, {
      method: "PUT",
      headers: { cookie: owner.cookie, "content-type": "application/json", prefer: "respond-async, Return = minimal" },
      body: JSON.stringify({ baseRevision: base, graph }),
    });
    expect(res.status).toBe(200);
    expect(res.headers.get("preference-applied")).toBe("return=minimal");
    const body = await res.json();
    expect(Object.keys(body).sort()).toEqual(["createdAt", "revision", "summary"]);
    const stored = await testDb("linkage_revisions").where({ linkage_id: ids.linkageId, revision: body.revision }).first();
    expect(body.summary).toEqual(stored.analysis.summary);
    expect(body.summary.hazard).toBeGreaterThan(0);
    expect(codes(stored.analysis)).toEqual(codes(analyze(graph)));
    // Any other preference is the full answer.
    const full = await fetch(`${APP_URL}${url}`, {
      method: "PUT",
      headers: { cookie: owner.cookie, "content-type": "application/json", prefer: "return=representation" },
      body: JSON.stringify({ baseRevision: body.revision, graph }),
    });
    expect(full.headers.get("preference-applied")).toBeNull();
    expect(codes((await full.json()).analysis)).toEqual(codes(analyze(graph)));
  });

  it("uses the build's own factors when it saves", async () => {
    await testDb("builds").where({ id: ids.buildId }).update({ analysis_settings: JSON.stringify({ ultimateFactor: 3 }) });
    const url = `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`;
    const cur = (await owner.request("GET", url)).body;
    const res = await owner.request("PUT", url, { baseRevision: cur.revision, graph: demoPitchLinkage() });
    expect(res.body.analysis.settings.ultimateFactor).toBe(3);
    const p0 = res.body.analysis.pushrods[0];
    expect(p0.ultimateAxial).toBeCloseTo(p0.limitAxial * 3, 6); // ultimate = limit × the build's factor (14 CFR 23.303 default 1.5)
  });
});

describe("linkage files", () => {
  it("a linkage exported as a file imports as a new linkage with the same parts, joints and findings", async () => {
    const url = `/api/builds/${ids.buildId}/linkages/${ids.linkageId}`;
    const res = await fetch(`${APP_URL}${url}/file`, { headers: { cookie: owner.cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(/attachment; filename="pitch-run-rev\d+\.linkage\.json"/);
    const text = await res.text();
    const parsed = parseLinkageFile(text);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const created = await owner.request("POST", `/api/builds/${ids.buildId}/linkages`, { name: "Imported copy", system: "pitch", graph: parsed.graph });
    expect(created.status).toBe(201);
    const copy = (await owner.request("GET", `/api/builds/${ids.buildId}/linkages/${created.body.linkage.id}/graph`)).body;
    const original = (await owner.request("GET", `${url}/graph`)).body;
    expect(copy.graph.nodes).toEqual(original.graph.nodes);
    expect(copy.graph.joints).toEqual(original.graph.joints);
    expect(codes(copy.analysis)).toEqual(codes(original.analysis));
  });
});
