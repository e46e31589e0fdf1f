/**
 * One name per part and joint (shared/linkage/names.ts): the label or the kind's name, and a joint as its two
 * ends with the ports' names. The findings, the checklist, the hardware list and the review use the same one.
 */
import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import { DEMO_WRONG_JOINT, demoPitchLinkage } from "@/shared/demo";
import { endName, jointName, partName, portName, subjectName, subjectPhrase } from "@/shared/linkage/names";
import { checklistFor } from "@/shared/records/checklist";
import { hardwareList } from "@/shared/records/hardware";
import { findingStates } from "@/shared/review/hazards";

const WRONG = { type: "joint", id: DEMO_WRONG_JOINT } as const;
const WRONG_NAME = "Aft pushrod B ↔ Elevator horn, attach";

describe("names", () => {
  it("names a part by its label, or by its kind when it has none", () => {
    expect(partName({ kind: "bellcrank", label: "Bellcrank under the seat" })).toBe("Bellcrank under the seat");
    expect(partName({ kind: "bellcrank", label: "" })).toBe("Bellcrank");
    expect(partName({ kind: "travelStop", label: "   " })).toBe("Travel stop");
  });

  it("names ports by their display name; a lettered end follows the part, others after a comma", () => {
    expect(portName("pushrod", "b")).toBe("B");
    expect(portName("controlHorn", "attach")).toBe("attach");
    expect(endName({ kind: "pushrod", label: "Aft pushrod" }, "b")).toBe("Aft pushrod B");
    expect(endName({ kind: "controlHorn", label: "Elevator horn" }, "attach")).toBe("Elevator horn, attach");
    expect(endName(undefined, "a")).toBe("a part no longer in the drawing");
  });

  it("names a joint by its two ends, never by an id", () => {
    const g = demoPitchLinkage();
    const j = g.joints.find((x) => x.id === DEMO_WRONG_JOINT)!;
    expect(jointName(j, g.nodes)).toBe(WRONG_NAME);
    expect(jointName(j, new Map(g.nodes.map((n) => [n.id, n])))).toBe(WRONG_NAME);
    expect(subjectName(g, WRONG)).toBe(WRONG_NAME);
    expect(subjectPhrase(g, WRONG)).toBe(`the joint ${WRONG_NAME}`);
    expect(subjectName(g, { type: "node", id: "horn" })).toBe("Elevator horn");
    expect(subjectPhrase(g, { type: "linkage", id: "x" })).toBe("the linkage");
    for (const jt of g.joints) expect(jointName(jt, g.nodes)).not.toContain(jt.id);
  });

  it("is the same name in the findings, the review, the checklist and the hardware list", () => {
    const g = demoPitchLinkage();
    const report = analyze(g);
    const onWrong = report.findings.filter((f) => f.subject.type === "joint" && f.subject.id === DEMO_WRONG_JOINT);
    expect(onWrong.length).toBeGreaterThan(0);
    for (const f of onWrong) expect(f.message).toContain(WRONG_NAME);
    // No message names a part or joint by its id.
    const ids = [...g.nodes.map((n) => n.id), ...g.joints.map((j) => j.id)].filter((id) => id.includes("-"));
    for (const f of report.findings) for (const id of ids) expect(f.message).not.toContain(id);
    for (const f of findingStates(report, g, [])) if (f.subject.type === "joint" && f.subject.id === DEMO_WRONG_JOINT) expect(f.subjectName).toBe(WRONG_NAME);
    expect(checklistFor(g).filter((i) => i.jointId === DEMO_WRONG_JOINT).map((i) => i.where)).toContain(WRONG_NAME);
    const used = hardwareList([{ id: "l", name: "Pitch", graph: g }]).flatMap((l) => l.usedIn).filter((u) => u.jointId === DEMO_WRONG_JOINT);
    expect(used.length).toBeGreaterThan(0);
    for (const u of used) expect(u.where).toBe(WRONG_NAME);
  });
});
