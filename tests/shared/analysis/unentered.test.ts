/**
 * Starting values (shared/analysis/unentered.ts): a margin is computed only from values the builder entered.
 * `// common practice, no source` — the rule is the product's, not a regulation's: a figure from a value
 * nobody entered is not a figure an inspector can accept. Each rule is tripped here and not tripped.
 */
import { describe, expect, it } from "vitest";
import { analyze, DEFAULT_SETTINGS, type Report } from "@/shared/analysis";
import { LOAD_KEYS, VALUE_WORDS } from "@/shared/analysis/unentered";
import { demoPitchLinkage } from "@/shared/demo";
import { demoPitchGeometry } from "@/shared/demo-geometry";
import { defaultProps, ENGINE, NODE_KINDS, type NodeKind } from "@/shared/linkage/kinds";
import { KIND_SCHEMAS } from "@/shared/linkage/kinds/schemas";
import { graphSchema, type LinkageGraph } from "@/shared/linkage/schema";
import { rudderCircuit, wheelRun, withProps } from "./cable-fixtures";
import { valid } from "./fixtures";

/** The graph with part `id` marked as having `keys` unentered (through the schema, as a save would). */
function mark(g: LinkageGraph, id: string, keys: string[]): LinkageGraph {
  const out = { ...g, nodes: g.nodes.map((n) => (n.id === id ? { ...n, unentered: keys } : n)) };
  return graphSchema.parse(out);
}
const joint = (r: Report, id: string) => r.joints.find((j) => j.jointId === id)!;
const computed = (r: Report, id: string) => joint(r, id).checks.filter((c) => c.status === "computed" && c.margin !== null).length;
const codes = (r: Report) => r.findings.map((f) => `${f.code}@${f.subject.id}`);

describe("the format", () => {
  it("keeps a part's unentered values and refuses a name its kind does not have", () => {
    const g = mark(demoPitchLinkage(), "stick", ["gripArm"]);
    expect(g.nodes.find((n) => n.id === "stick")!.unentered).toEqual(["gripArm"]);
    const bad = { ...demoPitchLinkage(), nodes: demoPitchLinkage().nodes.map((n) => (n.id === "stick" ? { ...n, unentered: ["hornArm"] } : n)) };
    const r = graphSchema.safeParse(bad);
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].message).toContain("a stick does not have");
  });

  it("every starting value of every kind has words for the messages", () => {
    for (const k of NODE_KINDS) for (const key of Object.keys(defaultProps(k))) expect(VALUE_WORDS[key], `${k}.${key}`).toBeTruthy();
  });
});

describe("every value that moves a load is a load value", () => {
  // Each kind's engine functions (arms, design force, pivot load, effective arm, turn) with each starting value
  // changed in turn: a value that changes what they give must be in LOAD_KEYS, or a force through a starting
  // value would pass for the builder's.
  const other = (k: NodeKind, key: string, v: unknown): unknown => {
    if (typeof v === "number") return v * 1.37 + 0.5;
    let s = (KIND_SCHEMAS[k] as unknown as { shape: Record<string, { unwrap?: () => unknown; options?: string[] }> }).shape[key] as { unwrap?: () => unknown; options?: string[] };
    while (s.unwrap && !s.options) s = s.unwrap() as typeof s;
    return (s.options ?? []).find((o) => o !== v);
  };
  const probe = (k: NodeKind, p: Record<string, unknown>) => {
    const e = ENGINE[k] as unknown as Record<string, (...a: unknown[]) => unknown>;
    const out: unknown[] = [];
    if (e.arms) out.push(e.arms(p));
    if (e.pilotForce) for (const sys of ["pitch", "roll", "yaw", "flap"]) out.push(e.pilotForce(p, sys, DEFAULT_SETTINGS.pilotForce));
    if (e.pivotLoad) out.push(e.pivotLoad(100, 70, p));
    if (e.effectiveArm) out.push(e.effectiveArm(p));
    if (e.turn) out.push(e.turn(p));
    return JSON.stringify(out);
  };
  for (const k of NODE_KINDS) {
    it(k, () => {
      const base = defaultProps(k) as Record<string, unknown>;
      const moved: string[] = [];
      for (const key of Object.keys(base)) {
        const v = other(k, key, base[key]);
        if (v === undefined) continue;
        if (probe(k, { ...base, [key]: v }) !== probe(k, base)) moved.push(key);
      }
      for (const key of moved) expect(LOAD_KEYS[k] ?? [], `${k}.${key} moves a load`).toContain(key);
    });
  }
  it("the probe sees a changed arm (it can fail)", () => {
    const p = defaultProps("bellcrank") as Record<string, unknown>;
    expect(JSON.stringify((ENGINE.bellcrank as { arms: (p: unknown) => unknown }).arms({ ...p, inputArm: 9 }))).not.toBe(JSON.stringify((ENGINE.bellcrank as { arms: (p: unknown) => unknown }).arms(p)));
  });
});

describe("loads carried through starting values", () => {
  const entered = analyze(demoPitchLinkage());

  it("with every value entered, the demo's joints and pushrods have margins", () => {
    expect(computed(entered, "j-stick-fwd")).toBeGreaterThan(0);
    expect(computed(entered, "j-bellcrank-aft")).toBeGreaterThan(0);
    for (const p of entered.pushrods) expect(p.marginCompression).not.toBeNull();
    expect(codes(entered).filter((c) => c.startsWith("values-unentered"))).toEqual([]);
  });

  it("the stick's arms unentered: nothing past the stick has a margin, and each says what to enter", () => {
    const r = analyze(mark(demoPitchLinkage(), "stick", ["gripArm", "attachArm"]));
    for (const id of ["j-stick-fwd", "j-fwd-bellcrank", "j-bellcrank-pivot", "j-bellcrank-aft", "j-horn-elevator", "j-elevator-hinge"]) {
      expect(computed(r, id), id).toBe(0);
      expect(joint(r, id).todo.join(" "), id).toContain(`enter the grip arm and attach arm of "Control stick" (still its starting values)`);
      expect(joint(r, id).governing, id).toBeNull();
    }
    for (const p of r.pushrods) {
      expect(p.marginCompression).toBeNull();
      expect(p.marginTension).toBeNull();
      expect(p.todo).toContain("grip arm");
    }
    // The report's lowest margin is not one computed from the starting values.
    expect(r.summary.lowestMargin).toBeNull();
    const f = r.findings.find((x) => x.code === "values-unentered")!;
    expect(f.subject).toEqual({ type: "node", id: "stick" });
    expect(f.severity).toBe("caution");
    expect(f.message).toContain("grip arm and attach arm are still the starting values");
  });

  it("the bellcrank's arms unentered: the joints before it keep their margins, those after it lose theirs", () => {
    const r = analyze(mark(demoPitchLinkage(), "bellcrank", ["inputArm", "outputArm"]));
    // Stick → forward pushrod: the force there does not depend on the bellcrank.
    expect(computed(r, "j-stick-fwd")).toBe(computed(entered, "j-stick-fwd"));
    expect(r.pushrods.find((p) => p.nodeId === "pushrod-fwd")!.marginCompression).toBe(entered.pushrods.find((p) => p.nodeId === "pushrod-fwd")!.marginCompression);
    // Past it: not checked.
    expect(computed(r, "j-bellcrank-aft")).toBe(0);
    expect(computed(r, "j-bellcrank-pivot")).toBe(0);
    expect(r.pushrods.find((p) => p.nodeId === "pushrod-aft")!.marginCompression).toBeNull();
  });

  it("a value that moves no load (the stick's travel, without geometry) leaves the margins alone but is still named", () => {
    const r = analyze(mark(demoPitchLinkage(), "stick", ["travelFwd"]));
    expect(computed(r, "j-bellcrank-aft")).toBe(computed(entered, "j-bellcrank-aft"));
    const f = r.findings.find((x) => x.code === "values-unentered")!;
    expect(f.message).toContain("forward travel is still the starting value");
    expect(f.message).toContain("the checks that need them are not made");
  });

  it("a mount's note is not data for a check: no finding", () => {
    const r = analyze(mark(demoPitchLinkage(), "mount-stick", ["note"]));
    expect(codes(r).filter((c) => c.startsWith("values-unentered"))).toEqual([]);
  });
});

describe("a pushrod's tube", () => {
  it("unentered: no margins, and no buckling hazard even where the starting tube would buckle", () => {
    // A 0.25 × 0.02 in tube 72 in long buckles at the demo's load (the entered case proves it).
    const thin = withProps(demoPitchLinkage(), "pushrod-aft", { outsideDiameter: 0.25, wall: 0.02 });
    expect(codes(analyze(valid(thin)))).toContain("pushrod-buckles@pushrod-aft");
    const r = analyze(mark(thin, "pushrod-aft", ["outsideDiameter", "wall"]));
    expect(codes(r)).not.toContain("pushrod-buckles@pushrod-aft");
    const p = r.pushrods.find((x) => x.nodeId === "pushrod-aft")!;
    expect(p.marginCompression).toBeNull();
    expect(p.todo).toBe(`enter the outside diameter and wall thickness of "Aft pushrod" (still its starting values)`);
    expect(r.findings.find((x) => x.code === "values-unentered")!.message).toContain("its buckling and tension are not checked");
  });

  it("its material unentered: the female rod end's thread check asks for it instead of using it", () => {
    const g = demoPitchLinkage();
    g.joints = g.joints.map((j) => (j.id === "j-bellcrank-aft" && j.hardware.rodEnd ? { ...j, hardware: { ...j.hardware, rodEnd: { ...j.hardware.rodEnd, shank: "female" as const } } } : j));
    const thread = (r: Report) => joint(r, "j-bellcrank-aft").checks.find((c) => c.id === "threadTension")!;
    expect(thread(analyze(valid(g))).todo).toBeNull();
    const r = analyze(mark(g, "pushrod-aft", ["material"]));
    expect(thread(r).status).not.toBe("computed");
    expect(thread(r).todo).toBe(`enter the material of "Aft pushrod" (still its starting value)`);
  });
});

describe("cables and pulleys", () => {
  it("a cable's size unentered: not judged too small, and no strength margin", () => {
    const small = withProps(rudderCircuit(), "cableL", { size: "1/16" });
    expect(codes(analyze(valid(small)))).toContain("cable-too-small@cableL");
    const r = analyze(mark(small, "cableL", ["size"]));
    expect(codes(r)).not.toContain("cable-too-small@cableL");
    expect(r.cables.find((c) => c.nodeId === "cableL")!.margin).toBeNull();
    expect(r.findings.find((x) => x.code === "values-unentered" && x.subject.id === "cableL")!.message).toContain("its strength is not checked");
  });

  it("the pedal's arms unentered: the cable's tension is not the builder's, so no margin", () => {
    const base = analyze(valid(rudderCircuit()));
    expect(base.cables.find((c) => c.nodeId === "cableL")!.margin).not.toBeNull();
    const r = analyze(mark(rudderCircuit(), "pedalL", ["pedalArm", "cableArm"]));
    expect(r.cables.find((c) => c.nodeId === "cableL")!.margin).toBeNull();
    expect(computed(r, "overP")).toBe(0);
  });

  it("a pulley's wrap angle unentered: its rating is not compared with a load that rests on it", () => {
    const weak = withProps(rudderCircuit(), "pulley", { ratedLoad: 10 });
    expect(codes(analyze(valid(weak)))).toContain("pulley-overloaded@pulley");
    const r = analyze(mark(weak, "pulley", ["wrapAngle"]));
    expect(codes(r)).not.toContain("pulley-overloaded@pulley");
    expect(computed(r, "pulleyAxle")).toBe(0);
    expect(r.findings.some((x) => x.code === "values-unentered" && x.subject.id === "pulley")).toBe(true);
  });
});

describe("motion", () => {
  const withGeometry = () => ({ ...demoPitchLinkage(), geometry: demoPitchGeometry() });

  it("the stick's travel unentered: the run is not swept, and the note says what to enter", () => {
    const entered = analyze(valid(withGeometry()));
    expect(entered.motion!.chains.length).toBe(1);
    const r = analyze(mark(withGeometry(), "stick", ["travelFwd", "travelAft"]));
    expect(r.motion!.chains.length).toBe(0);
    expect(r.motion!.notChecked.join(" ")).toContain(`enter the forward travel and aft travel of "Control stick" (still its starting values)`);
  });

  it("a stop's contact angle unentered: not swept either", () => {
    const r = analyze(mark(withGeometry(), "stop-stick", ["stopAt"]));
    expect(r.motion!.chains.length).toBe(0);
    expect(r.motion!.notChecked.join(" ")).toContain(`contact angle of "Stick stop"`);
  });
});

describe("a wheel", () => {
  // 14 CFR 23.397(b): the roll couple's minimum is 40 × D, D the wheel's diameter.
  it("its diameter unentered: the roll couple is not judged against 40 × D", () => {
    const g = wheelRun({ designCouple: 470 });
    expect(codes(analyze(valid(g)))).toContain("wheel-couple-below-minimum@wheel");
    const r = analyze(mark(g, "wheel", ["diameter"]));
    expect(codes(r)).not.toContain("wheel-couple-below-minimum@wheel");
    expect(codes(r)).toContain("values-unentered@wheel");
  });
});

describe("found in review: places a starting value still reached a figure", () => {
  it("a hinge moment whose force passes through a starting horn arm does not set the loads (14 CFR 23.395 case waits)", () => {
    // 14 CFR 23.395: 125 % of the hinge moment sets the loads between the minimum and maximum pilot forces; a hinge
    // moment giving 80 % of the maximum-force case lowers them (the minimum for a stick in pitch is 60 %).
    const limit = analyze(demoPitchLinkage()).surfaces[0].hingeMomentLimit;
    const g = withProps(demoPitchLinkage(), "elevator", { hingeMoment: (0.8 * limit) / 1.25 });
    const entered = analyze(valid(g));
    expect(entered.designCase.scale).toBeLessThan(1); // the hinge-moment case lowers the loads when entered
    const r = analyze(mark(g, "horn", ["hornArm"]));
    expect(r.designCase.scale).toBe(1);
    expect(codes(r)).toContain("hinge-moment-waits@elevator");
    expect(codes(entered)).not.toContain("hinge-moment-waits@elevator");
    // The message names the part as every other message does (its name in quotes, or its kind's name), never its id.
    expect(r.findings.find((f) => f.code === "hinge-moment-waits")!.message).toContain('The hinge moment of "Elevator" is not used yet');
    const unnamed = analyze(mark({ ...g, nodes: g.nodes.map((n) => (n.id === "elevator" ? { ...n, label: "" } : n)) }, "horn", ["hornArm"]));
    const msg = unnamed.findings.find((f) => f.code === "hinge-moment-waits")!.message;
    expect(msg).toMatch(/^The hinge moment of "[^"]+" is not used yet/);
    expect(msg).not.toMatch(/^The hinge moment of "?elevator"? /);
  });

  it("a pushrod whose length is a starting value is not held against the geometry's length", () => {
    const withGeometry = { ...demoPitchLinkage(), geometry: demoPitchGeometry() };
    const entered = analyze(valid(withGeometry));
    expect(entered.motion!.notChecked.join(" ")).not.toContain(`length of "Aft pushrod"`);
    const r = analyze(mark(withGeometry, "pushrod-aft", ["length"]));
    expect(r.motion!.notChecked.join(" ")).toContain(`enter the length of "Aft pushrod" (still its starting value)`);
    expect(r.motion!.chains[0].rods.find((x) => x.rodId === "pushrod-aft")!.shortest).toBeNull();
    expect(codes(r).some((c) => c.startsWith("rigging-out-of-range@pushrod-aft"))).toBe(false);
  });

  it("a cable whose size was entered is still judged too small when only a terminal is a starting value", () => {
    // AC 43.13-1B 7-149 (as the cables tests): no cable under 1/8 in in the primary controls.
    const r = analyze(mark(withProps(rudderCircuit(), "cableL", { size: "1/16" }), "cableL", ["terminalA"]));
    expect(codes(r)).toContain("cable-too-small@cableL");
    expect(r.cables.find((c) => c.nodeId === "cableL")!.margin).toBeNull();
  });
});
