/** The pure review helpers: the revision diff, subject fingerprints, and which hazards block a sign-off. */
import { describe, expect, it } from "vitest";
import { diffFields, diffGraphs, showValue } from "@/shared/review/diff";
import { fingerprint, stableStringify } from "@/shared/review/fingerprint";
import { unacknowledgedHazards } from "@/shared/review/hazards";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";
import { analyze } from "@/shared/analysis";
import type { LinkageGraph } from "@/shared/linkage/schema";

const clone = (g: LinkageGraph): LinkageGraph => JSON.parse(JSON.stringify(g));
const J = { type: "joint", id: DEMO_WRONG_JOINT } as const;

describe("diffGraphs", () => {
  it("is empty for the same graph, and ignores moves except to count them", () => {
    const a = demoPitchLinkage();
    const b = clone(a);
    b.nodes[0].position = { x: 999, y: 5 };
    const d = diffGraphs(a, b);
    expect(d.same).toBe(true);
    expect(d.nodes.moved).toBe(1);
  });

  it("names added, removed and changed parts and joints with old → new values", () => {
    const a = demoPitchLinkage();
    const b = clone(a);
    b.nodes = b.nodes.filter((n) => n.id !== "mount-tail");
    b.joints = b.joints.filter((j) => j.id !== "j-elevator-hinge");
    b.nodes.push({ id: "stop-1", kind: "travelStop", label: "Aft stop", position: { x: 0, y: 0 }, props: { stopAt: 14 } });
    const bc = b.nodes.find((n) => n.id === "bellcrank")!;
    (bc.props as { outputArm: number }).outputArm = 4.5;
    bc.label = "Bellcrank";
    const w = b.joints.find((j) => j.id === DEMO_WRONG_JOINT)!;
    w.hardware.shear = "double";
    w.hardware.jamNut = { fitted: true, tightened: false };
    delete w.hardware.torque;
    w.to.port = "surface";
    b.name = "Pitch, revised";

    const d = diffGraphs(a, b);
    expect(d.same).toBe(false);
    expect(d.linkage).toEqual([{ path: "name", before: "Larkspur LX-2 pitch", after: "Pitch, revised" }]);
    expect(d.nodes.added).toEqual([{ id: "stop-1", name: "Aft stop", kind: "travelStop", label: "Aft stop" }]);
    expect(d.nodes.removed).toEqual([{ id: "mount-tail", name: "Stabilizer rear spar", kind: "structureMount", label: "Stabilizer rear spar" }]);
    expect(d.nodes.changed).toEqual([
      { id: "bellcrank", name: "Bellcrank", kind: "bellcrank", label: "Bellcrank", fields: [
        { path: "label", before: "Bellcrank under the seat", after: "Bellcrank" },
        { path: "props.outputArm", before: 4, after: 4.5 },
      ] },
    ]);
    expect(d.joints.removed.map((j) => j.id)).toEqual(["j-elevator-hinge"]);
    expect(d.joints.removed[0].name).toBe("Elevator, hinge ↔ Stabilizer rear spar, mount"); // named from the graph it was in
    expect(d.joints.changed).toHaveLength(1);
    expect(d.joints.changed[0].name).toBe("Aft pushrod B ↔ Elevator horn, surface");
    expect(d.joints.changed[0].fields).toEqual([
      { path: "to", before: "Elevator horn, attach", after: "Elevator horn, surface" }, // ends by name, compared by id
      { path: "hardware.jamNut.fitted", before: undefined, after: true },
      { path: "hardware.jamNut.tightened", before: undefined, after: false },
      { path: "hardware.shear", before: "single", after: "double" },
      { path: "hardware.torque", before: 60, after: undefined },
    ]);
  });

  it("compares arrays whole and shows values plainly", () => {
    expect(diffFields({ photos: ["a"] }, { photos: ["a", "b"] })).toEqual([{ path: "photos", before: ["a"], after: ["a", "b"] }]);
    expect([showValue(undefined), showValue(true), showValue(""), showValue(0.25)]).toEqual(["(not set)", "yes", "(empty)", "0.25"]);
  });
});

describe("fingerprint", () => {
  it("does not depend on key order", () => {
    expect(stableStringify({ b: 1, a: { d: 2, c: 3 } })).toBe(stableStringify({ a: { c: 3, d: 2 }, b: 1 }));
  });
  it("changes with the joint's hardware, not with its note, photos or other joints", () => {
    const a = demoPitchLinkage();
    const fp = fingerprint(a, J);
    const note = clone(a);
    note.joints.find((j) => j.id === DEMO_WRONG_JOINT)!.hardware.note = "ordered a bigger washer";
    note.joints.find((j) => j.id === DEMO_WRONG_JOINT)!.hardware.photos = ["p1"];
    note.joints.find((j) => j.id === "j-stick-fwd")!.hardware.torque = 1;
    expect(fingerprint(note, J)).toBe(fp);
    const hw = clone(a);
    hw.joints.find((j) => j.id === DEMO_WRONG_JOINT)!.hardware.torque = 61;
    expect(fingerprint(hw, J)).not.toBe(fp);
    expect(fingerprint(a, { type: "joint", id: "nope" })).toBeNull();
  });
  it("changes with a node's props but not its label or position", () => {
    const a = demoPitchLinkage();
    const s = { type: "node", id: "bellcrank" } as const;
    const b = clone(a);
    b.nodes.find((n) => n.id === "bellcrank")!.label = "renamed";
    b.nodes.find((n) => n.id === "bellcrank")!.position = { x: 1, y: 1 };
    expect(fingerprint(b, s)).toBe(fingerprint(a, s));
    (b.nodes.find((n) => n.id === "bellcrank")!.props as { inputArm: number }).inputArm = 3.1;
    expect(fingerprint(b, s)).not.toBe(fingerprint(a, s));
  });
});

describe("unacknowledgedHazards", () => {
  it("lists the demo's hazards until each is acknowledged for the same hardware", () => {
    const g = demoPitchLinkage();
    const report = analyze(g);
    expect(unacknowledgedHazards(report, g, []).map((h) => h.code).sort()).toEqual(["jam-nut-missing", "retaining-washer-small"]);
    const ack = (code: string, fp: string) => ({ id: code, code, subject: J, fingerprint: fp, createdAt: "2026-01-01T00:00:00Z" });
    const fp = fingerprint(g, J)!;
    expect(unacknowledgedHazards(report, g, [ack("jam-nut-missing", fp)]).map((h) => h.code)).toEqual(["retaining-washer-small"]);
    const lapsed = unacknowledgedHazards(report, g, [ack("jam-nut-missing", "old"), ack("retaining-washer-small", fp)]);
    expect(lapsed.map((h) => [h.code, h.lapsed?.id])).toEqual([["jam-nut-missing", "jam-nut-missing"]]);
  });
});

describe("diffGraphs names without comparing names", () => {
  it("a relabelled part changes its joints' names, not the joints", () => {
    const a = demoPitchLinkage();
    const b = clone(a);
    b.nodes.find((n) => n.id === "horn")!.label = "Left elevator horn";
    const d = diffGraphs(a, b);
    expect(d.nodes.changed.map((n) => n.name)).toEqual(["Left elevator horn"]);
    expect(d.joints.changed).toEqual([]);
  });
});

describe("starting values in review", () => {
  const marked = (): LinkageGraph => ({ ...demoPitchLinkage(), nodes: demoPitchLinkage().nodes.map((n) => (n.id === "stick" ? { ...n, unentered: ["gripArm", "attachArm"] } : n)) } as LinkageGraph);
  it("confirming a starting value changes the part's and the linkage's fingerprint (a sign-off before it is stale)", () => {
    const before = marked();
    const after = demoPitchLinkage();
    expect(fingerprint(before, { type: "node", id: "stick" })).not.toBe(fingerprint(after, { type: "node", id: "stick" }));
    expect(fingerprint(before, { type: "linkage", id: "x" })).not.toBe(fingerprint(after, { type: "linkage", id: "x" }));
    // Another part's fingerprint is untouched, and a graph without the field keeps its fingerprint (old revisions).
    expect(fingerprint(before, { type: "node", id: "bellcrank" })).toBe(fingerprint(after, { type: "node", id: "bellcrank" }));
  });
  it("the diff shows the confirmation in words", () => {
    const d = diffGraphs(marked(), demoPitchLinkage());
    const stick = d.nodes.changed.find((c) => c.id === "stick")!;
    expect(stick.fields).toEqual([{ path: "starting values", before: "grip arm and attach arm", after: undefined }]);
    expect(d.same).toBe(false);
    expect(diffGraphs(demoPitchLinkage(), demoPitchLinkage()).same).toBe(true);
  });
});
