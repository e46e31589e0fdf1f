/** "Suggest a part" ordering on a known library, and the checklist of the demo pitch linkage. Pure. */
import { describe, expect, it } from "vitest";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";
import { demoRudderLinkage } from "@/shared/demo-rudder";
import { analyze } from "@/shared/analysis";
import type { JointResult } from "@/shared/analysis/types";
import { suggestParts } from "@/shared/records/suggest";
import { checklistFor, travelText } from "@/shared/records/checklist";
import { hardwareList } from "@/shared/records/hardware";
import type { Part } from "@/shared/records/parts";

const at = "2026-12-01T00:00:00.000Z";
const rodEnd = (pn: string, thread: string, hand: "RH" | "LH", ballBore: number, ratedUltimate: number): Part => ({
  id: pn, kind: "rodEnd", partNumber: pn, description: "", createdAt: at, updatedAt: at,
  spec: { thread: thread as "1/4-28", hand, shank: "male", ballBore, ratedUltimate, hasWitnessHole: true },
});
const bolt = (pn: string, size: "AN3" | "AN4", material: "steel" | "aluminium"): Part => ({
  id: pn, kind: "bolt", partNumber: pn, description: "", createdAt: at, updatedAt: at, spec: { size, material },
});

// Ratings are invented library values for the test. // common practice, no source
const LIBRARY: Part[] = [
  rodEnd("A-4200", "1/4-28", "LH", 0.25, 4200),
  rodEnd("B-6000", "1/4-28", "LH", 0.25, 6000),
  rodEnd("C-RH", "1/4-28", "RH", 0.25, 9000),
  rodEnd("D-516", "5/16-24", "LH", 0.3125, 9000),
  rodEnd("E-weak", "1/4-28", "LH", 0.25, 100),
  rodEnd("F-bore", "1/4-28", "LH", 0.3125, 9000),
  bolt("AN3-st", "AN3", "steel"),
  bolt("AN4-st", "AN4", "steel"),
  bolt("AN4-al", "AN4", "aluminium"),
];

describe("suggest a part", () => {
  const graph = demoPitchLinkage();
  const joint = graph.joints.find((j) => j.id === DEMO_WRONG_JOINT)!; // 1/4-28 LH rod end, bore 0.25 in, single shear

  it("orders fitting parts by margin against a known required load, and says why the others miss", () => {
    const result = { jointId: joint.id, radialUltimate: 2000 } as JointResult; // 2000 lbf: a round test value, no source
    const s = suggestParts(joint, result, LIBRARY);
    expect(s.required).toBe(2000);
    expect(s.rodEnds.map((x) => [x.part.partNumber, Number(x.margin.toFixed(3))])).toEqual([["B-6000", 2], ["A-4200", 1.1]]);
    // AN4 steel, single shear: 75 ksi · π · 0.25² / 4 = 3681.6 lbf (shared/hardware/bolts.ts, from memory) → margin 0.841
    expect(s.bolts.map((x) => [x.part.partNumber, Number(x.margin.toFixed(3))])).toEqual([["AN4-st", 0.841]]);
    const misses = Object.fromEntries(s.nearMisses.map((m) => [m.part.partNumber, m.reason]));
    expect(Object.keys(misses).sort()).toEqual(["AN4-al", "C-RH", "E-weak", "F-bore"]); // D-516 does not share the thread: not named
    expect(misses["C-RH"]).toBe("RH thread, the joint needs LH");
    expect(misses["E-weak"]).toMatch(/rated 100 lbf, below the 2000 lbf required/);
    expect(misses["F-bore"]).toBe("bore 0.3125 in, the joint needs 0.25 in");
  });

  it("does not refuse a rod end for its hand where the joint's hand is not recorded", () => {
    const result = { jointId: joint.id, radialUltimate: 2000 } as JointResult;
    const noHand = { ...joint, hardware: { ...joint.hardware, rodEnd: { ...joint.hardware.rodEnd!, hand: undefined } } };
    const s = suggestParts(noHand, result, LIBRARY);
    expect(s.rodEnds.map((x) => x.part.partNumber)).toEqual(["C-RH", "B-6000", "A-4200"]);
    expect(s.nearMisses.map((m) => m.reason).join(" ")).not.toMatch(/thread, the joint needs/);
  });

  it("rates bolts in single shear where the joint's shear planes are not entered, and in double where they are", () => {
    const result = { jointId: joint.id, radialUltimate: 2000 } as JointResult;
    const unset = suggestParts({ ...joint, hardware: { ...joint.hardware, shear: undefined } }, result, LIBRARY);
    expect(unset.planes).toBe(1);
    expect(unset.planesEntered).toBe(false);
    expect(unset.bolts.find((b) => b.part.partNumber === "AN4-st")!.capacity).toBeCloseTo(3681.6, 1); // single shear, as above
    const dbl = suggestParts({ ...joint, hardware: { ...joint.hardware, shear: "double" } }, result, LIBRARY);
    expect(dbl.planes).toBe(2);
    expect(dbl.bolts.find((b) => b.part.partNumber === "AN4-st")!.capacity).toBeCloseTo(7363.1, 1); // two planes: twice 3681.55
  });

  it("rates a library AN bolt with no material as steel, and does not rate a custom one", () => {
    const custom: Part = { id: "C-1", kind: "bolt", partNumber: "C-1", description: "", createdAt: at, updatedAt: at, spec: { size: "custom", diameter: 0.25 } };
    const an: Part = { id: "AN4-x", kind: "bolt", partNumber: "AN4-x", description: "", createdAt: at, updatedAt: at, spec: { size: "AN4" } };
    const s = suggestParts(joint, { jointId: joint.id, radialUltimate: 2000 } as JointResult, [custom, an]);
    expect(s.bolts.map((b) => b.part.partNumber)).toEqual(["AN4-x"]);
    expect(s.bolts[0].capacity).toBeCloseTo(3681.6, 1); // steel, single shear (the demo joint), as above
    expect(s.nearMisses.find((m) => m.part.partNumber === "C-1")!.reason).toBe("a custom bolt with no material recorded: its strength is not known");
  });

  it("ranks by no load where the joint's load rests on starting values", () => {
    const g = { ...graph, nodes: graph.nodes.map((n) => (n.id === "stick" ? { ...n, unentered: ["gripArm"] } : n)) } as typeof graph;
    const r = analyze(g).joints.find((j) => j.jointId === joint.id)!;
    expect(r.loadKnown).toBe(false);
    expect(r.radialUltimate).toBeGreaterThan(0); // computed from the starting value, so not to be used
    const s = suggestParts(joint, r, LIBRARY);
    expect(s.required).toBeNull();
    expect(s.rodEnds.every((x) => x.margin === Infinity)).toBe(true);
  });

  it("uses the engine's required load for the demo joint", () => {
    const report = analyze(graph);
    const r = report.joints.find((j) => j.jointId === joint.id)!;
    expect(r.radialUltimate).toBeGreaterThan(0);
    const s = suggestParts(joint, r, LIBRARY);
    expect(s.required).toBeCloseTo(r.radialUltimate, 6);
    const margins = s.rodEnds.map((x) => x.margin);
    expect([...margins].sort((a, b) => b - a)).toEqual(margins);
    for (const x of s.rodEnds) expect(x.margin).toBeCloseTo(x.capacity / r.radialUltimate - 1, 9);
  });
});

describe("inspection checklist", () => {
  it("asks for the retaining washer where a rod end's shear planes are not recorded, and not where it is in double shear", () => {
    const g = demoPitchLinkage();
    const id = "j-stick-fwd"; // a double-shear rod end in the demo
    const codesAt = (graph: typeof g) => checklistFor(graph).filter((i) => i.jointId === id).map((i) => i.code);
    expect(codesAt(g)).not.toContain("retaining-washer");
    const unset = { ...g, joints: g.joints.map((j) => (j.id === id ? { ...j, hardware: { ...j.hardware, shear: undefined } } : j)) };
    expect(codesAt(unset)).toContain("retaining-washer");
    expect(checklistFor(unset).find((i) => i.jointId === id && i.code === "retaining-washer")!.text).toMatch(/^If the rod end is in single shear \(not recorded\)/);
  });
  it("lists, for the demo pitch linkage, exactly the checks each joint's hardware calls for", () => {
    const items = checklistFor(demoPitchLinkage());
    const byJoint: Record<string, string[]> = {};
    for (const i of items) (byJoint[i.jointId] ??= []).push(i.code);
    // Every nut: its locking and a full thread past it (AC 43.13-1B 7-37); a torqued nut: the torque and its stripe.
    const locked = ["nut-locking", "thread-protrusion", "torque", "torque-stripe"];
    const rodEndJoint = ["jam-nut", "witness-hole", ...locked];
    expect(byJoint).toEqual({
      "j-stick-pivot": ["cotter-pin", "thread-protrusion"], // castellated nut on a bushing: snugged, pinned, not torqued
      "j-stick-fwd": rodEndJoint,
      "j-fwd-bellcrank": rodEndJoint,
      "j-bellcrank-pivot": locked,
      "j-bellcrank-aft": rodEndJoint,
      // the seeded wrong joint: single shear, so the retaining washer is checked; the jam nut is checked though none is recorded
      [DEMO_WRONG_JOINT]: ["jam-nut", "witness-hole", "retaining-washer", ...locked],
      "j-horn-elevator": locked,
      "j-elevator-hinge": locked,
      "j-stick-stop": locked,
      "": ["control-sense", "full-free-travel", "stops-before-limits"],
    });
    const washer = items.find((i) => i.jointId === DEMO_WRONG_JOINT && i.code === "retaining-washer")!;
    expect(washer.text).toContain("over 0.5 in"); // the demo rod end's housing bore, 0.500 in (shared/demo.ts, invented part)
    expect(washer.where).toBe("Aft pushrod B ↔ Elevator horn, attach"); // the joint's one name (shared/linkage/names.ts)
    expect(items.find((i) => i.jointId === "j-bellcrank-pivot" && i.code === "torque")!.text).toContain("120 in·lbf"); // demo value
    expect(items.find((i) => i.code === "stops-before-limits")!.text).toContain("Elevator 25° up / 20° down"); // demo travel
    // The stops set the designed travel; they do not stop the surface short of it.
    expect(items.find((i) => i.code === "stops-before-limits")!.text).toMatch(/contact at the designer's travel — .*within the drawing's tolerance/);
    expect(items.find((i) => i.code === "stops-before-limits")!.text).not.toMatch(/before the surface reaches/);
    for (const i of items) expect(i.source.text.length).toBeGreaterThan(0);
  });
  it("words a surface's travel by the axis it moves about: a rudder left and right, elevators and ailerons up and down", () => {
    const stops = (graph: ReturnType<typeof demoPitchLinkage>) => checklistFor(graph).find((i) => i.code === "stops-before-limits")!.text;
    // The demo rudder: 25° each way (shared/demo-rudder.ts, invented figures).
    const yaw = stops(demoRudderLinkage());
    expect(yaw).toContain("Rudder 25° left / 25° right");
    expect(yaw).not.toMatch(/° up|° down/);
    // A rudder's card "up" is its trailing edge to the right (shared/linkage/geometry.ts surfaceUp), "down" to the left.
    const lopsided = demoRudderLinkage();
    lopsided.nodes = lopsided.nodes.map((n) => (n.kind === "controlSurface" ? { ...n, props: { ...n.props, travelUp: 30, travelDown: 20 } } : n));
    expect(stops(lopsided)).toContain("Rudder 20° left / 30° right");
    expect(travelText("yaw", 30, 20)).toBe("20° left / 30° right");
    // Pitch, roll, flaps and trim move up and down.
    expect(stops(demoPitchLinkage())).toContain("Elevator 25° up / 20° down");
    expect(stops({ ...demoPitchLinkage(), system: "roll" })).toContain("25° up / 20° down");
    for (const system of ["pitch", "roll", "flap", "trim", "other"] as const) expect(travelText(system, 25, 20)).toBe("25° up / 20° down");
  });
  it("asks for the control sense of every run, in the words of its system (14 CFR 23.779 table)", () => {
    const g = demoPitchLinkage();
    const sense = (graph: typeof g) => checklistFor(graph).filter((i) => i.code === "control-sense");
    const pitch = sense(g);
    expect(pitch).toHaveLength(1);
    expect(pitch[0].jointId).toBe("");
    expect(pitch[0].text).toMatch(/^Control sense: stick back raises the nose — the elevator's trailing edge goes up \(on a canard, down\)/);
    expect(pitch[0].source).toMatchObject({ kind: "published", text: expect.stringContaining("aileron right (clockwise) for right wing down") });
    expect(sense({ ...g, system: "roll" })[0].text).toMatch(/stick to the right — right aileron's trailing edge up, left aileron's down/);
    expect(sense({ ...g, system: "yaw" })[0].text).toMatch(/right pedal forward — rudder's trailing edge to the right/);
    expect(sense({ ...g, system: "trim" })[0].text).toMatch(/trailing edge up to trim nose down/);
    // A wheel instead of a stick is named as such.
    const wheel = { ...g, nodes: g.nodes.map((n) => (n.kind === "stick" ? ({ ...n, kind: "controlWheel" } as unknown as (typeof g.nodes)[number]) : n)) };
    expect(sense(wheel)[0].text).toMatch(/^Control sense: wheel back raises the nose/);
  });
  it("torque items: the table range with the drag, asked for when not recorded; a castellated nut on a clamped bolt is torqued, on a bushing snugged", () => {
    const g = demoPitchLinkage();
    const at = (graph: typeof g, id: string, code: string) => checklistFor(graph).find((i) => i.jointId === id && i.code === code)?.text;
    // AC 43.13-1B table 7-1: 1/4-28 tension nut 50–70 in·lbf; demo drag 8 in·lbf (invented)
    expect(at(g, "j-stick-fwd", "torque")).toBe("AN4 nut torqued to 60 in·lbf — table 7-1: 50–70 in·lbf for a tension nut plus the measured 8 in·lbf drag.");
    const patch = (id: string, f: (h: (typeof g.joints)[number]["hardware"]) => (typeof g.joints)[number]["hardware"]) =>
      ({ ...g, joints: g.joints.map((j) => (j.id === id ? { ...j, hardware: f(j.hardware) } : j)) });
    const noTorque = patch("j-stick-fwd", (h) => ({ ...h, torque: undefined, nut: { ...h.nut!, dragTorque: undefined } }));
    expect(at(noTorque, "j-stick-fwd", "torque")).toBe("AN4 nut torqued within table 7-1: 50–70 in·lbf for a tension nut plus the nut's drag torque (measure it and record it), and the torque recorded on the joint card (none is recorded).");
    const castleClamped = patch("j-stick-fwd", (h) => ({ ...h, nut: { type: "castellatedCotter", pattern: "tension", cotterPinNew: true } }));
    // AC 43.13-1B 7-40f: the slot is lined up within the range; a washer or nut is changed rather than going past it.
    expect(at(castleClamped, "j-stick-fwd", "torque")).toMatch(/50–70 in·lbf for a tension nut; the cotter-pin slot lined up within that range, starting at its minimum \(if it does not line up, a different washer or nut, not more torque\)/);
    expect(at(castleClamped, "j-stick-fwd", "torque")).not.toMatch(/maximum allowable/);
    expect(at(g, "j-stick-fwd", "torque")).not.toMatch(/cotter-pin slot/); // a self-locking nut has no slot to line up
    expect(at(g, "j-stick-pivot", "torque")).toBeUndefined(); // castellated on a bushing
    expect(at(g, "j-stick-pivot", "cotter-pin")).toMatch(/snugged so the part still turns freely/);
  });
  it("asks for the retaining washer on the free side where the side is not recorded, and names the side where it is", () => {
    const g = demoPitchLinkage();
    const text = (graph: typeof g) => checklistFor(graph).find((i) => i.jointId === DEMO_WRONG_JOINT && i.code === "retaining-washer")!.text;
    expect(text(g)).toMatch(/^Retaining washer fitted under the bolt head \(the rod end's free side\)/);
    const unset = { ...g, joints: g.joints.map((j) => (j.id === DEMO_WRONG_JOINT ? { ...j, hardware: { ...j.hardware, freeSide: undefined } } : j)) };
    expect(text(unset)).toMatch(/on the rod end's free side \(not recorded: under the bolt head or the nut, whichever is against the ball\)/);
  });
  it("adds a joint's to-do from the report when a check could not be made, and none when every check was made", () => {
    const g = demoPitchLinkage();
    expect(checklistFor(g, analyze(g)).filter((i) => i.code === "not-checked")).toEqual([]); // the demo's cards are complete
    const jt = g.joints.find((j) => j.id === "j-bellcrank-pivot")!;
    jt.hardware = { ...jt.hardware, bearingRating: undefined };
    const todo = checklistFor(g, analyze(g)).filter((i) => i.code === "not-checked");
    expect(todo.map((i) => i.jointId)).toEqual(["j-bellcrank-pivot"]);
    expect(todo[0].text).toContain("Enter the bearing's rated radial load from its maker");
  });
  it("never advises a lock washer", () => {
    const g = demoPitchLinkage();
    for (const jt of g.joints) if (jt.hardware.nut) jt.hardware = { ...jt.hardware, nut: { ...jt.hardware.nut, type: "plain" } };
    for (const i of checklistFor(g, analyze(g))) expect(i.text).not.toMatch(/lock washer \(|use a lock washer|fit a lock washer/i);
    const plain = checklistFor(g).find((i) => i.code === "nut-locking")!;
    expect(plain.text).toContain("not a lock washer"); // AC 43.13-1B: no lock washers on primary or secondary structure
  });
  it("a self-locking nut's item asks that nothing turns on its bolt (AC 43.13-1B 7-64a); a safety-wired nut's does not", () => {
    const g = demoPitchLinkage();
    const self = checklistFor(g).find((i) => i.jointId === "j-stick-fwd" && i.code === "nut-locking")!;
    expect(self.text).toMatch(/the bolt is clamped so nothing turns on it/);
    expect(self.source.text).toMatch(/7-64a/);
    const wired = { ...g, joints: g.joints.map((j) => (j.id === "j-stick-fwd" ? { ...j, hardware: { ...j.hardware, nut: { type: "plainSafetyWire" as const, pattern: "tension" as const } } } : j)) };
    expect(checklistFor(wired).filter((i) => i.jointId === "j-stick-fwd").map((i) => i.text).join(" ")).not.toMatch(/nothing turns on it/);
  });
  it("a rod end without a witness hole is checked by its measured length, k×D given as a rule of thumb (domain.md §4 rule 2)", () => {
    const g = demoPitchLinkage();
    const id = g.joints.find((j) => j.hardware.rodEnd)!.id;
    const noHole = { ...g, joints: g.joints.map((j) => (j.id === id ? { ...j, hardware: { ...j.hardware, rodEnd: { ...j.hardware.rodEnd!, hasWitnessHole: false } } } : j)) };
    const items = checklistFor(noHole).filter((i) => i.jointId === id);
    expect(items.map((i) => i.code)).not.toContain("witness-hole");
    expect(items.find((i) => i.code === "engagement-length")!.text).toMatch(/at least 0\.25 in in steel, 0\.5 in in aluminium \(a rule of thumb/); // 1/4-28 demo rod end
  });
});

describe("hardware list", () => {
  it("groups the demo's parts with quantities and where used", () => {
    const lines = hardwareList([{ id: "L1", name: "Pitch", graph: demoPitchLinkage() }]);
    const q = Object.fromEntries(lines.map((l) => [l.description, l.quantity]));
    expect(q["Rod end 1/4-28 RH male, bore 0.25 in"]).toBe(2);
    expect(q["Rod end 1/4-28 LH male, bore 0.25 in"]).toBe(2);
    expect(q["Jam nut 1/4-28 RH"]).toBe(2);
    expect(q["Jam nut 1/4-28 LH"]).toBe(2); // the wrong joint has none fitted, and needs one: it is on the list to get
    expect(q["Cotter pin for 5/16-24 castellated nut"]).toBe(1);
    const lh = lines.find((l) => l.description === "Rod end 1/4-28 LH male, bore 0.25 in")!;
    expect(lh.partNumber).toBe("LW-SRE4M-LH");
    expect(lh.usedIn.map((u) => u.jointId)).toEqual(["j-fwd-bellcrank", DEMO_WRONG_JOINT]);
  });

  it("lists a clevis pin and, where a cotter pin alone holds it, that cotter pin", () => {
    const g = demoPitchLinkage();
    const withPin = { ...g, joints: g.joints.map((j) => (j.id === "j-stick-fwd" ? { ...j, hardware: { ...j.hardware, clevisPin: { diameter: 0.25, retention: "cotterPinOnly" as const } } } : j)) };
    const q = Object.fromEntries(hardwareList([{ id: "L1", name: "Pitch", graph: withPin }]).map((l) => [l.description, l.quantity]));
    expect(q["Clevis pin Ø0.25 in"]).toBe(1);
    expect(q["Cotter pin for Ø0.25 in clevis pin"]).toBe(1);
  });

  it("lists a rod end of no recorded hand, and its jam nut, as such, apart from the RH and LH ones", () => {
    const g = demoPitchLinkage();
    const id = "j-stick-fwd"; // an RH rod end with a jam nut in the demo
    const noHand = { ...g, joints: g.joints.map((j) => (j.id === id ? { ...j, hardware: { ...j.hardware, rodEnd: { ...j.hardware.rodEnd!, hand: undefined, partNumber: undefined } } } : j)) };
    const q = Object.fromEntries(hardwareList([{ id: "L1", name: "Pitch", graph: noHand }]).map((l) => [l.description, l.quantity]));
    expect(q["Rod end 1/4-28 (hand not recorded) male, bore 0.25 in"]).toBe(1);
    expect(q["Jam nut 1/4-28, hand not recorded (the rod end's hand)"]).toBe(1);
    expect(q["Jam nut 1/4-28 RH"]).toBe(1); // one fewer than the demo's two
    const item = checklistFor(noHand).find((i) => i.jointId === id && i.code === "jam-nut")!;
    expect(item.text).toMatch(/^Jam nut on the 1\/4-28 rod end \(the same hand as the rod end; record it on the joint card\)/);
    expect(checklistFor(g).find((i) => i.jointId === id && i.code === "jam-nut")!.text).toMatch(/^Jam nut on the 1\/4-28 RH rod end tight/);
  });
});
