/**
 * A cable run's records on the real server and database: the checklist's cable items through the API (read,
 * ticked with the tensiometer reading in the note, a wrong item refused) and in the PDF, which share one
 * generator, and the hardware list's cable, terminal, turnbuckle, pulley and fairlead lines on the page's API
 * and in the CSV. The linkage is the demo's yaw run (shared/demo-rudder.ts, invented data).
 */
import { spawnSync } from "node:child_process";
import { mkdirSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoRudderLinkage, DEMO_RUDDER_FAULT_PART } from "@/shared/demo-rudder";
import { analyze } from "@/shared/analysis";
import { CAUTION_TEXT } from "@/shared/caution";
import { makeBuild, makeUser, snapshot, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { exportFile } from "../support/exports";

const ARTIFACTS = path.resolve(__dirname, "../artifacts/records");
mkdirSync(ARTIFACTS, { recursive: true });

let owner: Client, reviewer: Client, viewer: Client, outsider: Client;
let buildId: string, linkageId: string;
const B = () => `/api/builds/${buildId}`;
const L = () => `${B()}/linkages/${linkageId}`;
type Item = { jointId: string; subject: string; code: string; where: string; text: string; note: string; tickedBy: string | null };
type Line = { key: string; kind: string; description: string; quantity: number; usedInCount: number };

beforeAll(async () => {
  const [o, r, v, x] = await Promise.all([makeUser("cab-owner"), makeUser("cab-reviewer"), makeUser("cab-viewer"), makeUser("cab-outsider")]);
  ({ buildId, linkageId } = await makeBuild({ owner: o, reviewer: r, viewer: v }));
  const graph = demoRudderLinkage();
  await testDb("linkages").where({ id: linkageId }).update({ name: graph.name, system: "yaw" });
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 })
    .update({ graph: JSON.stringify(graph), analysis: JSON.stringify(analyze(graph)) });
  [owner, reviewer, viewer, outsider] = await Promise.all([signIn(o.email), signIn(r.email), signIn(v.email), signIn(x.email)]);
});
afterAll(() => testDb.destroy());

describe("checklist of a cable run", () => {
  it("lists each cable's, turnbuckle's, pulley's and fairlead's items by the part's name", async () => {
    const res = await viewer.request("GET", `${L()}/checklist`);
    expect(res.status).toBe(200);
    const parts = (res.body.items as Item[]).filter((i) => i.subject === "part");
    const codes = (id: string) => parts.filter((i) => i.jointId === id).map((i) => i.code);
    for (const c of ["rd-cable-left", "rd-cable-right"]) expect(codes(c)).toEqual(["cable-tension", "cable-terminals", "cable-wear"]);
    for (const t of ["rd-tb-left", DEMO_RUDDER_FAULT_PART]) expect(codes(t)).toEqual(["turnbuckle-safety", "turnbuckle-free"]);
    expect(codes("rd-pulley")).toEqual(["pulley-guards"]);
    expect(codes("rd-fairlead")).toEqual(["fairlead-turn"]);
    expect(parts).toHaveLength(2 * 3 + 2 * 2 + 1 + 1);
    const left = parts.find((i) => i.jointId === "rd-cable-left" && i.code === "cable-tension")!;
    expect(left.where).toBe("Left rudder cable");
    // The demo's invented range and the reading on the left cable's card (30 lbf at 68 °F).
    expect(left.text).toContain("25 to 35 lbf at 70 °F");
    expect(left.text).toContain("On the cable's card: 30 lbf at 68 °F.");
    expect((await outsider.request("GET", `${L()}/checklist`)).status).toBe(404);
  });

  it("ticks a cable's tension with the tensiometer reading in the note; refuses an item the part does not have", async () => {
    const note = "Tensiometer reading 21 on the 1/8 in riser = 31 lbf, hangar at 66 °F.";
    const t = await reviewer.request("PUT", `${L()}/checklist`, { revision: 1, jointId: "rd-cable-left", code: "cable-tension", ticked: true, note });
    expect(t.status, JSON.stringify(t.body)).toBe(200);
    expect(t.body.item).toMatchObject({ jointId: "rd-cable-left", code: "cable-tension", tickedBy: "Test cab-reviewer", note });
    const before = await snapshot();
    const wrong = await reviewer.request("PUT", `${L()}/checklist`, { revision: 1, jointId: "rd-cable-left", code: "turnbuckle-safety", ticked: true });
    expect([wrong.status, wrong.body.error.fields]).toEqual([400, { code: "not on this checklist" }]);
    const viewerTick = await viewer.request("PUT", `${L()}/checklist`, { revision: 1, jointId: "rd-pulley", code: "pulley-guards", ticked: true });
    expect(viewerTick.status).toBe(403);
    expect(await snapshot()).toEqual(before);
    const items = (await viewer.request("GET", `${L()}/checklist`)).body.items as Item[];
    expect(items.find((i) => i.jointId === "rd-cable-left" && i.code === "cable-tension")).toMatchObject({ tickedBy: "Test cab-reviewer", note });
  });

  it("prints the same items, the note and the caution in the PDF", async () => {
    const total = ((await viewer.request("GET", `${L()}/checklist`)).body.items as Item[]).length;
    const pdf = await exportFile(viewer, buildId, "checklist-pdf", { linkageId });
    const text = squash(pdfText(pdf.bytes));
    expect(text).toContain(`1 of ${total} items ticked`);
    for (const s of ["Left rudder cable", "Right turnbuckle", "Pulley at the seat frame", "Fairlead at the rear bulkhead",
      "Rigging tension measured with a tensiometer", "no more than 3 threads showing", "Tensiometer reading 21 on the 1/8 in riser"])
      expect(text).toContain(squash(s));
    expect(text).toContain(squash(CAUTION_TEXT));
  });
});

describe("hardware list of a cable run", () => {
  it("has the cables, their terminals, the turnbuckles, the pulley and the fairlead on the page's API", async () => {
    const lines = (await viewer.request("GET", `${B()}/hardware`)).body.lines as Line[];
    const of = (kind: string) => lines.filter((l) => l.kind === kind).map((l) => [l.description, l.quantity]);
    expect(of("cable")).toEqual([["Control cable 1/8 in 7×19 carbon steel, 118 in terminal to terminal", 2]]);
    expect(of("cableTerminal")).toEqual([["Swaged terminal for 1/8 in cable", 4]]);
    expect(of("turnbuckle")).toEqual([["Turnbuckle for 1/8 in cable, with two locking clips", 2]]);
    expect(of("pulley")).toEqual([["Pulley 3 in, ball bearing, groove for 1/8 in cable", 1]]);
    expect(of("fairlead")).toEqual([["Fairlead", 1]]);
  });

  it("writes the same lines, with every place, to the CSV", async () => {
    const csv = (await exportFile(viewer, buildId, "hardware-csv")).bytes.toString("utf8");
    const name = demoRudderLinkage().name;
    expect(csv).toContain(`cable,"Control cable 1/8 in 7×19 carbon steel, 118 in terminal to terminal",,2,To order,${name}: Left rudder cable | ${name}: Right rudder cable`);
    expect(csv).toContain("cableTerminal,Swaged terminal for 1/8 in cable,,4,To order,");
    expect(csv).toContain(`turnbuckle,"Turnbuckle for 1/8 in cable, with two locking clips",,2,To order,${name}: Left turnbuckle | ${name}: Right turnbuckle`);
    expect(csv).toContain(`pulley,"Pulley 3 in, ball bearing, groove for 1/8 in cable",,1,To order,${name}: Pulley at the seat frame`);
    expect(csv).toContain(`fairlead,Fairlead,,1,To order,${name}: Fairlead at the rear bulkhead`);
  });
});

function pdfText(bytes: Buffer): string {
  const f = path.join(ARTIFACTS, `cable-text-${Date.now()}.pdf`);
  writeFileSync(f, bytes);
  const r = spawnSync("/usr/bin/pdftotext", ["-layout", f, "-"], { encoding: "utf8" });
  rmSync(f);
  return r.stdout;
}
const squash = (s: string) => s.replace(/\s+/g, " ").replace(/—/g, "-").trim();
