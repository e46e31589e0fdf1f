import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import { graphSchema } from "@/shared/linkage/schema";
import { parseLinkageFile, serializeLinkage } from "@/shared/linkage/io";
import { demoPitchLinkage } from "@/shared/demo";
import { demoPitchGeometry } from "@/shared/demo-geometry";
import { barRun, type Bar } from "./motion-fixtures";
import type { LinkageGraph } from "@/shared/linkage/schema";

const square: Bar = { a: 3, c: 3, o2: [0, 0], o4: [30, 0], alpha: 90, beta: 90 }; // parallelogram: surface = stick
const codes = (g: LinkageGraph) => analyze(g).findings.map((f) => f.code);

function withStop(g: LinkageGraph, target: string, stopAt: number): LinkageGraph {
  return graphSchema.parse({
    ...g,
    nodes: [...g.nodes, { id: "stop", kind: "travelStop", label: "Stop", position: { x: 0, y: 0 }, props: { stopAt } }],
    joints: [...g.joints, { id: "j-stop", from: { node: "stop", port: "contact" }, to: { node: target, port: target === "elevator" ? "hinge" : "pivot" }, hardware: {} }],
  });
}

describe("rod-end misalignment (rated ± angle vs the rod's angle out of the plane)", () => {
  it("trips when the rod leaves the plane by more than the rating", () => {
    // 30 in rod rising 7 in out of plane: asin(7 / 30.8) ≈ 13.1° > 12° rated (geometry; rating from the card)
    expect(codes(barRun({ ...square, dzA: 0, dzB: 7 }))).toContain("motion-misalignment");
  });
  it("does not trip within the rating", () => {
    // 2 in over 30 in: ≈ 3.8° < 12°
    expect(codes(barRun({ ...square, dzA: 0, dzB: 2 }))).not.toContain("motion-misalignment");
  });
  it("with an attach point's offset not entered it is not checked (never read as in line) and the run's notes ask for it", () => {
    const r = analyze(barRun({ ...square, dzB: 7 }));
    expect(r.findings.map((f) => f.code)).not.toContain("motion-misalignment");
    expect(r.motion!.chains[0].rods[0].misalignment).toBeNull();
    expect(r.motion!.notChecked.join(" ")).toMatch(/Rod-end misalignment at "Rod": enter the out-of-plane offset of each of its attach points/);
    expect(analyze(barRun({ ...square, dzA: 0, dzB: 2 })).motion!.chains[0].rods[0].misalignment).toBeCloseTo((Math.asin(2 / Math.hypot(30, 2)) * 180) / Math.PI, 9);
  });
});

describe("surface travel at the stops vs the designer's travel", () => {
  it("trips when the surface moves more than the designer's travel plus tolerance", () => {
    // Parallelogram: surface = stick, ±15°; designer 10° up and down ± 1°.
    const f = analyze(barRun(square, { designTravel: { up: 10, down: 10, tolerance: 1 } })).findings.filter((x) => x.code === "motion-surface-travel");
    expect(f.map((x) => x.numbers[0].value.toFixed(3))).toEqual(["15.000", "15.000"]);
  });
  it("does not trip within tolerance", () => {
    expect(codes(barRun(square, { designTravel: { up: 15.5, down: 14.5, tolerance: 1 } }))).not.toContain("motion-surface-travel");
  });
  it("a travel stop met first sets the travel the surface has", () => {
    const g = withStop(barRun(square, { designTravel: { up: 10, down: 15, tolerance: 0.5 } }), "elevator", 10);
    expect(codes(g)).not.toContain("motion-surface-travel");
    expect(analyze(g).motion!.chains[0].deflectionForward).toBeCloseTo(10, 1);
  });
});

describe("surface travel swept vs the surface's own travel on its card (14 CFR 23.675: the stops end the travel)", () => {
  it("trips when the sweep drives the elevator past its 20° down travel (a 4 in stick arm on a 2.5 in horn)", () => {
    const g = barRun({ a: 4, c: 2.5, o2: [0, 0], o4: [40, 0], alpha: -60, beta: -90 });
    const f = analyze(g).findings.filter((x) => x.code === "motion-surface-past-travel");
    expect(f.map((x) => x.message.match(/swings [\d.]+° (up|down)/)![1])).toEqual(["down"]);
    expect(f[0].numbers.find((n) => n.label === "down travel on the card")!.value).toBe(20);
    expect(f[0].numbers.find((n) => n.label === "down travel swept")!.value).toBeGreaterThan(21); // past the 1° slack (common practice)
  });
  it("does not trip where the sweep stays within the card's travel (3 in arm, 2.5 in horn), nor on the demo run to scale", () => {
    expect(analyze(barRun({ a: 3, c: 2.5, o2: [0, 0], o4: [40, 0], alpha: -90, beta: -90 })).findings.map((x) => x.code)).not.toContain("motion-surface-past-travel");
    const demo = { ...demoPitchLinkage(), geometry: demoPitchGeometry() };
    expect(analyze(demo).findings.map((x) => x.code)).not.toContain("motion-surface-past-travel");
  });
});

describe("control sense of a pitch run (14 CFR 23.779 table: elevator rearward for nose up)", () => {
  // Both arms up: stick forward (ccw in this view) pulls the horn's tip forward, so the elevator goes up — reversed.
  const reversed = square;
  // Stick arm up, horn arm down: the same push turns the horn the other way, so the elevator goes down — right.
  const right: Bar = { ...square, beta: -90 };
  const sense = (g: LinkageGraph) => analyze(g).findings.filter((f) => f.code === "control-sense-reversed");
  it("trips when stick forward raises a tail's trailing edge, naming the travel and saying a tail was taken", () => {
    const f = sense(barRun(reversed));
    expect(f).toHaveLength(1);
    expect(f[0].severity).toBe("hazard");
    expect(f[0].subject).toEqual({ type: "node", id: "stick" });
    expect(f[0].message).toMatch(/pushing "Stick" forward moves the trailing edge of "Elevator" 15(\.0)?° up \(at 15(\.0)?° forward\)/);
    expect(f[0].message).toMatch(/a tail was taken/);
    expect(f[0].numbers.find((n) => n.label === "surface deflection")!.value).toBeCloseTo(15, 6); // parallelogram: surface = stick
    expect(analyze(barRun(reversed)).motion!.chains[0].sense).toEqual({ axis: "pitch", forward: "up", expected: "down", surface: "tail", surfaceRecorded: false });
  });
  it("does not trip when stick forward lowers a tail's trailing edge, nor on the demo run to scale", () => {
    expect(sense(barRun(right))).toEqual([]);
    expect(analyze(barRun(right)).motion!.chains[0].sense).toMatchObject({ forward: "down", expected: "down" });
    const demo = { ...demoPitchLinkage(), geometry: demoPitchGeometry() };
    expect(sense(demo)).toEqual([]);
    expect(analyze(demo).motion!.chains[0].sense).toMatchObject({ axis: "pitch", forward: "down" });
  });
  it("a canard ahead of the wing wants the opposite: the reversed-for-a-tail run is right, the other trips", () => {
    expect(sense(barRun(reversed, { pitchSurface: "canard" }))).toEqual([]);
    const f = sense(barRun(right, { pitchSurface: "canard" }));
    expect(f.map((x) => x.message.match(/On a canard ahead of the wing/) !== null)).toEqual([true]);
    expect(f[0].message).not.toMatch(/a tail was taken/); // recorded
    expect(sense(barRun(reversed, { pitchSurface: "tail" }))[0].message).not.toMatch(/a tail was taken/);
  });
  it("a mirrored view (forward and up both clockwise) reads the same sense; one direction flipped alone reverses it", () => {
    expect(sense(barRun(reversed, { inputForward: "cw", surfaceUp: "cw" }))).toHaveLength(1);
    expect(sense(barRun(reversed, { surfaceUp: "cw" }))).toEqual([]);
  });
  it("read at the back end when the forward end does not move the surface", () => {
    const f = sense(barRun({ ...reversed, forward: 0 }));
    expect(f[0].message).toMatch(/pulling "Stick" back moves the trailing edge of "Elevator" 15(\.0)?° down/);
  });
  it("not read where the surface moves under half a degree each way (common practice, no source): said, not passed", () => {
    const r = analyze(barRun({ ...reversed, forward: 0.2, back: 0.2 }));
    expect(r.findings.map((f) => f.code)).not.toContain("control-sense-reversed");
    expect(r.motion!.chains[0].sense).toBeNull();
    expect(r.motion!.notChecked.join(" ")).toMatch(/not read from the geometry \(the surface does not go one way with the input forward and the other way with it back\)/);
  });
  it("not read for a flap run: the run's notes send the builder to the aircraft and the checklist", () => {
    const g = graphSchema.parse({ ...barRun(reversed), system: "flap" });
    const r = analyze(g);
    expect(r.findings.map((f) => f.code)).not.toContain("control-sense-reversed");
    expect(r.motion!.chains[0].sense).toBeNull();
    expect(r.motion!.notChecked.join(" ")).toMatch(/Control sense of the run from "Stick": not read from the geometry \(only a pitch or roll run from a stick or wheel, or a yaw run from pedals, is\)\. Move the control on the aircraft/);
  });
});

describe("control sense of a roll run (14 CFR 23.779 table: stick right for right wing down)", () => {
  // In this view the stick's forward turn is "stick right" (a roll run's meaning of inputForward); surface up: trailing edge up.
  const raises: Bar = square; // stick right raises the trailing edge
  const lowers: Bar = { ...square, beta: -90 }; // stick right lowers it
  const rollRun = (bar: Bar, extra: Parameters<typeof barRun>[1] = {}) => {
    const g = barRun(bar, extra);
    return graphSchema.parse({ ...g, system: "roll", nodes: g.nodes.map((n) => (n.id === "elevator" ? { ...n, label: "Aileron" } : n)) });
  };
  const sense = (g: LinkageGraph) => analyze(g).findings.filter((f) => f.code === "control-sense-reversed");
  it("not read until the geometry says which wing's aileron the run drives: the run's notes ask for it, nothing passes", () => {
    const r = analyze(rollRun(lowers));
    expect(r.findings.map((f) => f.code)).not.toContain("control-sense-reversed");
    expect(r.motion!.chains[0].sense).toBeNull();
    expect(r.motion!.notChecked.join(" ")).toMatch(/Control sense of the run from "Stick": not read from the geometry \(set in the geometry which wing's aileron this run drives\)/);
  });
  it("trips when stick right lowers the right wing's aileron, naming the travel and the wing", () => {
    const f = sense(rollRun(lowers, { rollSide: "right" }));
    expect(f).toHaveLength(1);
    expect(f[0].severity).toBe("hazard");
    expect(f[0].subject).toEqual({ type: "node", id: "stick" });
    expect(f[0].message).toMatch(/moving "Stick" right takes the trailing edge of "Aileron", the right wing's aileron, [\d.]+° down \(at 15(\.0)?° right\)/);
    expect(f[0].message).toMatch(/reversed roll control/);
    expect(analyze(rollRun(lowers, { rollSide: "right" })).motion!.chains[0].sense).toEqual({ axis: "roll", right: "down", expected: "up", side: "right" });
  });
  it("does not trip when stick right raises the right aileron or lowers the left one", () => {
    expect(sense(rollRun(raises, { rollSide: "right" }))).toEqual([]);
    expect(sense(rollRun(lowers, { rollSide: "left" }))).toEqual([]);
    expect(analyze(rollRun(lowers, { rollSide: "left" })).motion!.chains[0].sense).toEqual({ axis: "roll", right: "down", expected: "down", side: "left" });
  });
  it("trips on the left wing's aileron when stick right raises it", () => {
    expect(sense(rollRun(raises, { rollSide: "left" }))).toHaveLength(1);
  });
  it("a mirrored view (both directions clockwise) reads the same sense; one direction flipped alone reverses it", () => {
    expect(sense(rollRun(lowers, { rollSide: "right", inputForward: "cw", surfaceUp: "cw" }))).toHaveLength(1);
    expect(sense(rollRun(lowers, { rollSide: "right", surfaceUp: "cw" }))).toEqual([]);
  });
});

describe("control sense of a yaw run (14 CFR 23.779 table: right pedal forward for nose right)", () => {
  // The input's forward turn is the recorded pedal pushed; the surface's "up" turn is its trailing edge going right.
  const toRight: Bar = square; // the pushed pedal takes the trailing edge right
  const toLeft: Bar = { ...square, beta: -90 };
  const yawRun = (bar: Bar, extra: Parameters<typeof barRun>[1] = {}) => {
    const g = barRun(bar, extra);
    return graphSchema.parse({
      ...g, system: "yaw",
      nodes: g.nodes.map((n) => n.id === "stick" ? { ...n, kind: "pedal", label: "Pedals", props: { pedalArm: 8, attachArm: bar.a, travel: 15 } } : n.id === "elevator" ? { ...n, label: "Rudder" } : n),
    });
  };
  const sense = (g: LinkageGraph) => analyze(g).findings.filter((f) => f.code === "control-sense-reversed");
  it("not read until the geometry names the pushed pedal: the run's notes ask for it", () => {
    const r = analyze(yawRun(toLeft));
    expect(r.motion!.chains[0].sense).toBeNull();
    expect(r.findings.map((f) => f.code)).not.toContain("control-sense-reversed");
    expect(r.motion!.notChecked.join(" ")).toMatch(/Control sense of the run from "Pedals": not read from the geometry \(set in the geometry which pedal, pushed forward, turns the input its forward way\)/);
  });
  it("trips when the right pedal pushed takes the rudder's trailing edge left", () => {
    const f = sense(yawRun(toLeft, { yawPedal: "right" }));
    expect(f).toHaveLength(1);
    expect(f[0].severity).toBe("hazard");
    expect(f[0].message).toMatch(/pushing the right pedal of "Pedals" forward takes the trailing edge of "Rudder" [\d.]+° left/);
    expect(f[0].message).toMatch(/reversed yaw control/);
  });
  it("does not trip when the pushed pedal takes the trailing edge to its own side", () => {
    expect(sense(yawRun(toRight, { yawPedal: "right" }))).toEqual([]);
    expect(sense(yawRun(toLeft, { yawPedal: "left" }))).toEqual([]);
    expect(analyze(yawRun(toRight, { yawPedal: "right" })).motion!.chains[0].sense).toEqual({ axis: "yaw", pushed: "right", expected: "right", pedal: "right" });
  });
  it("trips when the left pedal pushed takes the trailing edge right", () => {
    expect(sense(yawRun(toRight, { yawPedal: "left" }))).toHaveLength(1);
  });
});

describe("stops", () => {
  it("a stop beyond the input's travel is never reached", () => {
    expect(codes(withStop(barRun(square), "elevator", 20))).toContain("stop-never-reached");
  });
  it("a stop inside the travel is reached", () => {
    const c = codes(withStop(barRun(square), "elevator", 12));
    expect(c).not.toContain("stop-never-reached");
    expect(c).not.toContain("stop-after-runout");
  });
  it("a stop beyond where the run jams is reached after another part runs out", () => {
    // 6 in arm on a 1.5 in horn: the horn reaches toggle at about 14.5° of stick; a stop at 80° of the horn is never met first.
    const g = withStop(barRun({ a: 6, c: 1.5, o2: [0, 0], o4: [30, 0], alpha: 90, beta: 90 }), "elevator", 80);
    const c = codes(g);
    expect(c).toContain("stop-after-runout");
    expect(c).toContain("motion-cannot-assemble");
  });
  it("a stop met before the run jams makes the jam unreachable", () => {
    const g = withStop(barRun({ a: 6, c: 1.5, o2: [0, 0], o4: [30, 0], alpha: 90, beta: 90 }), "stick", 10);
    // Without the stop it jams at about 12.4° forward (the case above); a stick stop at 10° is met first.
    expect(codes(g)).not.toContain("motion-cannot-assemble");
  });
});

describe("rigging range (thread length and minimum engagement, a rule of thumb for the witness hole)", () => {
  function rigged(engaged: number, threadLength: number, cardDelta: number): LinkageGraph {
    const g = barRun(square);
    g.nodes = g.nodes.map((n) => (n.kind === "pushrod" ? { ...n, props: { ...n.props, length: n.props.length + cardDelta } } : n));
    g.joints = g.joints.map((j) => (j.hardware.rodEnd ? { ...j, hardware: { ...j.hardware, rodEnd: { ...j.hardware.rodEnd, threadLength }, engagement: { witnessHoleVerified: true, engagedLength: engaged } } } : j));
    return g;
  }
  it("not checked, with what to enter, when thread and engaged lengths are missing", () => {
    const r = analyze(barRun(square));
    expect(r.motion!.notChecked.some((s) => s.includes("thread length") && s.includes("engaged length"))).toBe(true);
    expect(r.findings.map((f) => f.code)).not.toContain("rigging-out-of-range");
  });
  it("in range: 1/4-28 ends, 1.0 in of thread, 0.6 in engaged; steel tube → min engagement 0.25 in (1×D)", () => {
    // longest = card + 2·(0.6 − 0.25) = card + 0.7; shortest = card − 2·(1.0 − 0.6) = card − 0.8 (common practice, 1×D)
    const r = analyze(rigged(0.6, 1.0, -0.5));
    expect(r.findings.map((f) => f.code)).not.toContain("rigging-out-of-range");
    expect(r.motion!.chains[0].rods[0].longest! - r.motion!.chains[0].rods[0].card).toBeCloseTo(0.7, 9);
  });
  it("out of range: the geometry needs 1 in more than the ends can give", () => {
    expect(codes(rigged(0.6, 1.0, -1))).toContain("rigging-out-of-range");
    // k×D is a rule of thumb (domain.md §4 rule 2, common practice); the message does not present it as the witness hole's own test.
    const m = analyze(rigged(0.6, 1.0, -1)).findings.find((f) => f.code === "rigging-out-of-range")!.message;
    expect(m).toContain("a rule of thumb — the witness hole decides");
    expect(m).not.toContain("the witness-hole rule");
  });
});

describe("the format: geometry is optional in version 1", () => {
  it("an old file without geometry reads, and writes back without it", () => {
    const text = serializeLinkage(demoPitchLinkage());
    const r = parseLinkageFile(text);
    expect(r.ok).toBe(true);
    expect(text.includes("geometry")).toBe(false);
  });
  it("geometry round-trips through the file", () => {
    const g = { ...demoPitchLinkage(), geometry: demoPitchGeometry() };
    const r = parseLinkageFile(serializeLinkage(g));
    expect(r.ok && r.graph.geometry?.parts.bellcrank.arms.out).toBe(90);
  });
  it("rejects geometry for a missing node, an arm on a port the part lacks, and a pivot out of range", () => {
    const bad = (geometry: unknown) => graphSchema.safeParse({ ...demoPitchLinkage(), geometry }).success;
    expect(bad({ parts: { nope: { pivot: { x: 0, y: 0 }, arms: {} } } })).toBe(false);
    expect(bad({ parts: { stick: { pivot: { x: 0, y: 0 }, arms: { out: 10 } } } })).toBe(false);
    expect(bad({ parts: { stick: { pivot: { x: 1e6, y: 0 }, arms: {} } } })).toBe(false);
    expect(bad({ parts: { stick: { pivot: { x: 1, y: 0 }, arms: { attach: -90 } } } })).toBe(true);
  });
  it("geometry missing for a part of the run: motion not checked, naming what to enter", () => {
    const g = { ...demoPitchLinkage(), geometry: { ...demoPitchGeometry(), parts: { stick: demoPitchGeometry().parts.stick } } };
    const r = analyze(graphSchema.parse(g));
    expect(r.motion!.checked).toBe(false);
    expect(r.motion!.notChecked[0]).toMatch(/Bellcrank under the seat.*pivot position/);
  });
});
