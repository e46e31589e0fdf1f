/** The open hazards and cautions a checklist shows beside its items, and when a list may be called complete. Pure. */
import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";
import { emptyGraph } from "@/shared/linkage/schema";
import { checklistFor } from "@/shared/records/checklist";
import { checklistFindings, checklistStatus, hazardsByItem, itemKeyOf } from "@/shared/records/checklist-findings";
import { fingerprint } from "@/shared/review/fingerprint";
import { findingStates, type AckLike } from "@/shared/review/hazards";

const graph = demoPitchLinkage();
const report = analyze(graph);
const states = (acks: AckLike[] = []) => findingStates(report, graph, acks);

describe("a checklist's open findings", () => {
  it("the demo pitch run: its two hazards on the wrong joint, by name, beside that joint's items (its jam nut and washer)", () => {
    const f = checklistFindings(3, graph.nodes.length, states());
    expect(f).toMatchObject({ revision: 3, drawn: true, checked: true, acknowledged: 0 });
    const hazards = f.open.filter((o) => o.severity === "hazard");
    expect(hazards.map((h) => h.title).sort()).toEqual(["Jam nut missing", "Retaining washer small"]); // the seeded wrong joint (shared/demo.ts)
    expect(hazards.every((h) => h.subject.type === "joint" && h.subject.id === DEMO_WRONG_JOINT)).toBe(true);
    expect(hazards[0].where).toBe("Aft pushrod B ↔ Elevator horn, attach");
    expect(f.open.map((o) => o.severity)).toEqual([...hazards.map(() => "hazard"), ...f.open.slice(hazards.length).map(() => "caution")]); // hazards first
    for (const o of f.open) expect(o.title).not.toMatch(/-/); // a person's words, never the code
    // Beside the items of that joint, and only there.
    const by = hazardsByItem(f);
    expect([...by.keys()]).toEqual([DEMO_WRONG_JOINT]);
    const items = checklistFor(graph, report).filter((i) => by.has(i.jointId)).map((i) => i.code);
    expect(items).toEqual(expect.arrayContaining(["jam-nut", "retaining-washer"]));
  });
  it("an acknowledged hazard (for this exact hardware) is not open; an acknowledgement that lapsed leaves it open", () => {
    const jam = report.findings.find((x) => x.code === "jam-nut-missing")!;
    const ack = (fp: string): AckLike => ({ id: "a1", code: jam.code, subject: jam.subject, fingerprint: fp, createdAt: "2026-12-05T00:00:00.000Z" });
    const covered = checklistFindings(3, graph.nodes.length, states([ack(fingerprint(graph, jam.subject)!)]));
    expect(covered.acknowledged).toBe(1);
    expect(covered.open.some((o) => o.title === "Jam nut missing")).toBe(false);
    expect(hazardsByItem(covered).get(DEMO_WRONG_JOINT)).toEqual(["Retaining washer small"]);
    const lapsed = checklistFindings(3, graph.nodes.length, states([ack("an earlier fingerprint")]));
    expect(lapsed.open.some((o) => o.title === "Jam nut missing")).toBe(true);
  });
  it("a finding of the whole linkage stands beside the whole-linkage items", () => {
    expect(itemKeyOf({ type: "linkage", id: "any" })).toBe("");
    expect(itemKeyOf({ type: "joint", id: "j1" })).toBe("j1");
    expect(itemKeyOf({ type: "node", id: "n1" })).toBe("n1");
  });
});

describe("when a checklist is complete", () => {
  const clean = { revision: 2, drawn: true, checked: true, open: [], acknowledged: 0 };
  it("never while a hazard is open, even with every item ticked", () => {
    const f = checklistFindings(3, graph.nodes.length, states());
    expect(checklistStatus(46, 46, f)).toEqual({ complete: false, why: "hazards", hazards: 2 });
    expect(checklistStatus(0, 46, f)).toEqual({ complete: false, why: "hazards", hazards: 2 });
  });
  it("not without a stored check, and not with nothing drawn", () => {
    expect(checklistStatus(5, 5, checklistFindings(1, 4, null))).toMatchObject({ complete: false, why: "not-checked" });
    const empty = emptyGraph("Empty", "pitch");
    const f = checklistFindings(1, empty.nodes.length, findingStates(analyze(empty), empty, []));
    expect(f).toMatchObject({ drawn: false });
    expect(checklistStatus(2, 2, f)).toMatchObject({ complete: false, why: "nothing-drawn" });
  });
  it("only once every item is ticked and nothing is open", () => {
    expect(checklistStatus(4, 5, clean)).toMatchObject({ complete: false, why: "unticked" });
    expect(checklistStatus(5, 5, clean)).toEqual({ complete: true });
    // Cautions do not stop a list being complete: they are listed, and a not-checked joint has its own item.
    expect(checklistStatus(5, 5, { ...clean, open: [{ severity: "caution", title: "Rod end single shear", message: "", subject: { type: "joint", id: "j" }, where: "" }] })).toEqual({ complete: true });
  });
});
