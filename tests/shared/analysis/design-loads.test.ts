/**
 * Loads of the load-path check v2: stops, horn bolts, the 14 CFR 23.395 hinge-moment case, dual controls,
 * secondary inputs, settings below the published minimums, and files saved before v2.
 * goodRun() (tests/shared/fixtures.ts): stick 167 lbf (14 CFR 23.397(b)), grip 20 in, attach 5 in → 668 lbf link;
 * horn 2 in → elevator hinge moment 668 × 2 = 1,336 in·lbf limit (statics).
 */
import { HINGE_LOAD_TODO } from "@/shared/analysis/joints/path";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import { graphSchema, type LinkageGraph } from "@/shared/linkage/schema";
import { goodClamp, goodRun, j, stick, mount, goodBallPivot, valid } from "./fixtures";
import { rudderCircuit, wheelRun, withProps } from "./cable-fixtures";

const run = (g: LinkageGraph, settings = {}) => analyze(valid(g), settings);
const jr = (g: LinkageGraph, id: string, settings = {}) => run(g, settings).joints.find((x) => x.jointId === id)!;
const codes = (g: LinkageGraph, settings = {}) => run(g, settings).findings.map((f) => f.code);
const rel = (a: number, b: number, tol = 1e-4) => expect(Math.abs(a / b - 1)).toBeLessThan(tol);
const setProps = (g: LinkageGraph, id: string, p: Record<string, unknown>) => {
  const n = g.nodes.find((x) => x.id === id)!;
  n.props = { ...n.props, ...p } as never;
  return g;
};

describe("stops (14 CFR 23.675): load = the moment of the part it stops / its arm", () => {
  it("a stop 10 in from the stick's pivot: 668 × 5 / 10 = 334 lbf; 1 in from it: 3,340 lbf", () => {
    rel(jr(goodRun(), "stop").radialLimit, 334);
    rel(jr(setProps(goodRun(), "stop", { arm: 1 }), "stop").radialLimit, 3340);
  });
  it("the stop close to the pivot overloads its AN3 bolt; the one 10 in out does not", () => {
    // AN3 double shear 2 × 75,000 × π · 0.19²/4 = 4,252 lbf (from memory) < 3,340 × 1.725 = 5,761.5 lbf.
    const near = setProps(goodRun(), "stop", { arm: 1 });
    expect(run(near).findings.filter((f) => f.subject.id === "stop").map((f) => f.code)).toContain("bolt-shear-weak");
    expect(run(goodRun()).findings.filter((f) => f.subject.id === "stop")).toEqual([]);
  });
  it("without its arm the stop's load is not known: every check at it is not checked, with the to-do", () => {
    const g = goodRun();
    g.nodes = g.nodes.map((n) => (n.id === "stop" ? { ...n, props: { stopAt: 15 } } : n)) as LinkageGraph["nodes"];
    const r = jr(g, "stop");
    expect(r.checks.every((c) => c.status === "notChecked" && c.margin === null)).toBe(true);
    expect(r.todo[0]).toMatch(/arm of .* from the pivot/);
  });
  it("a run with no stop is a caution; a stop set past the surface's travel is a caution", () => {
    const g = goodRun();
    g.nodes = g.nodes.filter((n) => n.id !== "stop");
    g.joints = g.joints.filter((x) => x.id !== "stop");
    expect(codes(g)).toContain("no-stop");
    expect(codes(goodRun())).not.toContain("no-stop");
    const past = goodRun();
    past.joints = past.joints.map((x) => (x.id === "stop" ? j("stop", ["stop", "contact"], ["elev", "horn"], goodClamp()) : x));
    setProps(past, "stop", { stopAt: 30, arm: 3 });
    expect(codes(past)).toContain("stop-beyond-travel"); // 30° past the elevator's 25° up
    setProps(past, "stop", { stopAt: 20 });
    expect(codes(past)).not.toContain("stop-beyond-travel");
    // A stop acts one way: −22° (down) is past the 20° down travel though under the 25° up one; +22° (up) is not.
    setProps(past, "stop", { stopAt: -22 });
    expect(codes(past)).toContain("stop-beyond-travel");
    setProps(past, "stop", { stopAt: 22 });
    expect(codes(past)).not.toContain("stop-beyond-travel");
  });
});

describe("horn bolts: share of the link force plus the hinge moment's couple", () => {
  // Two bolts s apart: each F/2 + 6M/(s · 2 · 3) = 668/2 + 1,336/s (bolt-group statics).
  it("two bolts 1.5 in apart: 334 + 890.7 = 1,224.7 lbf; 0.5 in apart: 334 + 2,672 = 3,006 lbf, which overloads an AN3", () => {
    rel(jr(goodRun(), "horn").radialLimit, 334 + 1336 / 1.5);
    const close = setProps(goodRun(), "hornpart", { boltSpacing: 0.5 });
    rel(jr(close, "horn").radialLimit, 3006);
    // 3,006 × 1.725 = 5,185 lbf > AN3 double shear 4,252 lbf (from memory).
    expect(run(close).findings.filter((f) => f.subject.id === "horn").map((f) => f.code)).toContain("bolt-shear-weak");
    expect(run(goodRun()).findings.filter((f) => f.subject.id === "horn")).toEqual([]);
  });
  it("three bolts: the outer one takes F/3 + 6M/(s · 3 · 4)", () => {
    rel(jr(setProps(goodRun(), "hornpart", { boltCount: 3, boltSpacing: 1 }), "horn").radialLimit, 668 / 3 + (6 * 1336) / 12);
  });
  it("one bolt, or no bolt count: not checked, with the to-do", () => {
    const one = setProps(goodRun(), "hornpart", { boltCount: 1 });
    expect(codes(one)).toContain("horn-single-bolt");
    expect(jr(one, "horn").checks.every((c) => c.status === "notChecked")).toBe(true);
    const g = goodRun();
    g.nodes = g.nodes.map((n) => (n.id === "hornpart" ? { ...n, props: { hornArm: 2, linkAngle: 90 } } : n)) as LinkageGraph["nodes"];
    expect(jr(g, "horn").todo[0]).toMatch(/number of bolts/);
  });
});

describe("hinge moments (14 CFR 23.395): 125 % of the hinge moment, within the 23.397(b) forces", () => {
  // The maximum pitch force (167 lbf) puts 1,336 in·lbf on the elevator.
  const withHm = (hm: number) => setProps(goodRun(), "elev", { hingeMoment: hm });
  it("a large hinge moment: 125 % × 1,200 = 1,500 > 1,336, so the maximum pilot force governs (need not exceed)", () => {
    const r = run(withHm(1200));
    expect(r.designCase).toMatchObject({ governing: "maximumPilotForce", scale: 1 });
    rel(r.pushrods[0].limitAxial, 668);
  });
  it("a moderate one: 125 % × 800 = 1,000 in·lbf governs: loads × 1,000/1,336, pushrod 500 lbf", () => {
    const r = run(withHm(800));
    expect(r.designCase.governing).toBe("hingeMoment");
    rel(r.designCase.scale, 1000 / 1336);
    rel(r.pushrods[0].limitAxial, 500);
    rel(r.surfaces[0].hingeMomentLimit, 1000);
    expect(r.surfaces[0].loadCase).toBe("hingeMoment");
  });
  it("a small one: 125 % × 600 = 750 needs under 100 lbf, so the 100 lbf minimum governs: loads × 100/167", () => {
    const r = run(withHm(600));
    expect(r.designCase.governing).toBe("minimumPilotForce");
    rel(r.designCase.scale, 100 / 167);
    rel(r.pushrods[0].limitAxial, 400); // 100 × 20/5
  });
  it("without a hinge moment the maximum pilot force governs, and says so", () => {
    expect(run(goodRun()).designCase).toMatchObject({ governing: "maximumPilotForce", scale: 1 });
    expect(run(goodRun()).designCase.text).toMatch(/no hinge moment/);
  });
});

describe("hinge-moment-not-used: 14 CFR 23.395 bounds a hinge moment by the 23.397(b) stick and pedal forces only", () => {
  it("trips for a hinge moment given in a flap run", () => {
    expect(codes({ ...setProps(goodRun(), "elev", { hingeMoment: 800 }), system: "flap" })).toContain("hinge-moment-not-used");
  });
  it("does not trip for the same hinge moment in a pitch run (it sets the loads there), nor in a flap run without one", () => {
    expect(codes(setProps(goodRun(), "elev", { hingeMoment: 800 }))).not.toContain("hinge-moment-not-used");
    expect(codes({ ...goodRun(), system: "flap" })).not.toContain("hinge-moment-not-used");
  });
});

describe("the hinge-moment case in a rigged cable circuit: the cable's tension is made from the scaled pilot force", () => {
  // Rudder circuit (cable-fixtures.ts): pedal 200 lbf (14 CFR 23.397(b)) × 9 in / 3 in = 600 lbf at the cable; 3 in horn
  // → 1,800 in·lbf. Hinge moment 1,080 in·lbf (invented): 125 % (14 CFR 23.395) = 1,350 = 0.75 × 1,800, which is also
  // the pedal's 150/200 lbf minimum (23.397(b)): factor 0.75. Rigged at 400 lbf (invented), the pulling cable carries
  // T = max(F, P + F/2) (from memory: statics) = max(450, 400 + 225) = 625 lbf at F = 0.75 × 600 = 450 lbf —
  // not 0.75 × max(600, 400 + 300) = 525 lbf.
  const rigged = (over: Record<string, unknown> = {}) =>
    setProps(withProps(rudderCircuit(), "cableL", { riggingTension: 400, tensionMax: 450, ...over }), "rudder", { hingeMoment: 1080 });
  const sin = (deg: number) => Math.sin((deg * Math.PI) / 180);
  it("cable 625 lbf (not 525), its joints and the pulley and fairlead from 625 lbf", () => {
    const r = run(rigged());
    rel(r.designCase.scale, 0.75);
    const cl = r.cables.find((c) => c.nodeId === "cableL")!;
    rel(cl.limitTension, 625);
    rel(cl.ultimateRequired, 625 * 1.5 * 2.0); // 14 CFR 23.303 × the cable-system factor of 23.693
    rel(cl.margin!, 2000 / 1875 - 1); // 1/8 in 7×19 carbon, 2,000 lbf (AC 43.13-1B table 7-3), swaged 100 %
    rel(r.cables.find((c) => c.nodeId === "cableR")!.limitTension, 625); // the same circuit, the same rigging tension
    const jt = (id: string) => r.joints.find((x) => x.jointId === id)!.radialLimit;
    rel(jt("hornL"), 625);
    rel(jt("overP"), 2 * 625 * sin(15)); // 30° over the pulley: 2·T·sin(θ/2) = 323.5 lbf (statics)
    rel(jt("pulleyAxle"), 2 * 625 * sin(15));
    rel(jt("fairMount"), 2 * 625 * sin(1)); // 2° through the fairlead
    // Loads linear in the force keep the factor alone: pedal pivot 0.75 × (200 + 600) = 600 lbf, rudder 0.75 × 1,800.
    rel(jt("pivL"), 600);
    rel(r.surfaces[0].hingeMomentLimit, 1350);
  });
  it("a pulley rated 950 lbf trips at 323.5 × 1.5 × 2.0 = 970.6 lbf, and one rated 1,000 lbf does not", () => {
    const pulley = (rating: number) => setProps(rigged(), "pulley", { ratedLoad: rating });
    expect(codes(pulley(950))).toContain("pulley-overloaded");
    expect(codes(pulley(1000))).not.toContain("pulley-overloaded");
  });
  it("without a rigging tension every load is the factor on the force: 0.75 × 600 = 450 lbf", () => {
    rel(run(rigged({ riggingTension: undefined })).cables.find((c) => c.nodeId === "cableL")!.limitTension, 450);
  });
  it("without the hinge moment the full force governs: max(600, 400 + 300) = 700 lbf", () => {
    const g = rigged();
    delete (g.nodes.find((n) => n.id === "rudder")!.props as Record<string, unknown>).hingeMoment;
    rel(run(g).cables.find((c) => c.nodeId === "cableL")!.limitTension, 700);
  });
});

describe("dual controls: the single-pilot full-force case is always checked (14 CFR 23.399)", () => {
  it("two sticks on one pushrod end: 75 % each added (1.5 × 668 = 1,002 lbf) is above one pilot's 668 lbf", () => {
    const g = goodRun();
    g.nodes.push(stick("stick2", 20, 5), mount("m3"));
    g.joints.push(j("pivot2", ["stick2", "pivot"], ["m3", "mount"], goodBallPivot()));
    g.joints.push(j("rodA2", ["stick2", "attach"], ["rod", "a"], g.joints.find((x) => x.id === "rodA")!.hardware));
    rel(run(g, { dualControls: true }).pushrods[0].limitAxial, 1002);
    rel(run(g).pushrods[0].limitAxial, 668);
  });
});

describe("secondary inputs: the force has a stated source", () => {
  const flap = (p: Record<string, unknown>) => {
    const g = setProps(goodRun(), "stick", p);
    g.system = "flap";
    return g;
  };
  it("the build's default force without a source is a caution; the designer's figure is not", () => {
    expect(codes(flap({}))).toContain("secondary-force-default");
    expect(codes(flap({ designForce: 60, forceSource: "designer" }))).not.toContain("secondary-force-default");
  });
  it("the lever rule: (1 + R)/3 × 50 lbf within 50–150 lbf (from memory): R = 5 in → 100 lbf; R = 20 in → 150 lbf", () => {
    const r5 = run(setProps(flap({ forceSource: "leverRule" }), "stick", { gripArm: 5, attachArm: 5 }));
    rel(r5.pushrods[0].limitAxial, 100);
    rel(run(flap({ forceSource: "leverRule" })).pushrods[0].limitAxial, 150 * 4);
    expect(r5.findings.map((f) => f.code)).not.toContain("secondary-force-default");
    expect(r5.findings.find((f) => f.code === "secondary-force-lever-rule")!.message).toMatch(/is 100 lbf by the lever rule/);
  });
  it("states no lever-rule force from a grip arm that is still a starting value, and asks for the arm", () => {
    const g = setProps(flap({ forceSource: "leverRule" }), "stick", { gripArm: 5, attachArm: 5 });
    g.nodes.find((n) => n.id === "stick")!.unentered = ["gripArm"];
    const f = run(g).findings.find((x) => x.code === "secondary-force-lever-rule")!;
    expect(f.message).toMatch(/grip arm — still a starting value\. Enter the grip arm/);
    expect(f.message).not.toMatch(/100 lbf/);
    expect(f.numbers ?? []).toEqual([]);
  });
});

describe("a wheel's own minimum under the hinge-moment case (14 CFR 23.397(b))", () => {
  it("a roll wheel's loads go no lower than 40 · D of its 50 · D couple (× 0.8), not the roll stick's 40/67", () => {
    const g = wheelRun();
    (g.nodes.find((n) => n.id === "ail")!.props as { hingeMoment?: number }).hingeMoment = 1; // in·lbf: far below anything the wheel gives
    const r = run(g);
    expect(r.designCase.governing).toBe("minimumPilotForce");
    rel(r.designCase.scale, 40 / 50);
  });
  it("a stick's floor is still the stick's (40/67 in roll)", () => {
    const g = goodRun();
    g.system = "roll";
    (g.nodes.find((n) => n.kind === "controlSurface")!.props as { hingeMoment?: number }).hingeMoment = 1;
    rel(run(g).designCase.scale, 40 / 67); // 14 CFR 23.397(b): roll stick 40 minimum, 67 maximum
  });
});

describe("settings below the published minimums", () => {
  it("wheel forces under 200 lbf and 50 · D, and a cable factor under 2.0, are cautioned too; none at the defaults", () => {
    const r = run(goodRun(), { pilotForce: { pitchStick: 167, rollStick: 67, yawPedal: 200, other: 100, pitchWheel: 150, rollWheel: 45 }, cableFactor: 1.5 });
    const text = r.settingsCautions.join(" ");
    expect(text).toMatch(/wheel's pitch force is set to 150 lbf, below the 200 lbf of 14 CFR 23.397\(b\)/);
    expect(text).toMatch(/wheel's roll couple is set to 45 × D in·lbf, below the 50 × D/);
    expect(text).toMatch(/cable-system factor is set to 1.5, below the 2 of 14 CFR 23.693/);
    expect(run(goodRun()).settingsCautions).toEqual([]);
  });
  it("a caution shown with the results, and the text in the report; none at the defaults", () => {
    const r = run(goodRun(), { pilotForce: { pitchStick: 120, rollStick: 67, yawPedal: 200, other: 100 }, fittingFactor: 1 });
    expect(r.findings.map((f) => f.code)).toContain("settings-below-minimum");
    expect(r.settingsCautions.join(" ")).toMatch(/120 lbf, below the 167 lbf of 14 CFR 23.397\(b\)/);
    expect(r.settingsCautions.join(" ")).toMatch(/fitting factor is set to 1, below the 1.15 of 14 CFR 23.625/);
    expect(run(goodRun()).settingsCautions).toEqual([]);
  });
});

describe("a file saved before v2 (format version 1, no new fields)", () => {
  const saved = JSON.parse(readFileSync(new URL("../saved/v1-pitch-run.json", import.meta.url), "utf8"));
  const g = graphSchema.parse(saved.graph);
  const r = analyze(g);
  it("opens with the same schema", () => {
    expect(graphSchema.safeParse(saved.graph).success).toBe(true);
  });
  it("gives the same pushrod loads and margins and the same hinge moment", () => {
    for (const p of saved.numbers.pushrods) {
      const now = r.pushrods.find((x) => x.nodeId === p.nodeId)!;
      for (const k of ["limitAxial", "ultimateAxial", "marginCompression", "marginTension"] as const) rel(now[k]!, p[k]!, 1e-12);
    }
    rel(r.surfaces[0].hingeMomentLimit, saved.numbers.surfaces[0].hingeMomentLimit, 1e-12);
  });
  it("gives the same joint numbers where nothing new applies (rod ends on clamped bolts, ball-bearing pivots)", () => {
    const same = ["j-stick-fwd", "j-fwd-bellcrank", "j-bellcrank-pivot", "j-bellcrank-aft", "j-aft-horn"];
    for (const id of same) {
      const was = saved.numbers.joints.find((x: { jointId: string }) => x.jointId === id);
      const now = r.joints.find((x) => x.jointId === id)!;
      rel(now.radialLimit, was.radialLimit, 1e-12);
      rel(now.radialUltimate, was.radialUltimate, 1e-12);
      expect(now.rodEndMargin).toEqual(was.rodEndMargin);
      if (was.boltMargin !== null) rel(now.boltMargin!, was.boltMargin, 1e-12);
    }
  });
  it("where something new applies it says so: the bushing pivot's 3.33 moves to bearing, the horn bolts need their count", () => {
    const pivot = r.joints.find((x) => x.jointId === "j-stick-pivot")!;
    expect(pivot.specialFactor).toBe(3.33);
    rel(pivot.radialUltimate, saved.numbers.joints.find((x: { jointId: string }) => x.jointId === "j-stick-pivot").radialUltimate * 1.15 / 3.33, 1e-12);
    expect(r.joints.find((x) => x.jointId === "j-horn-elevator")!.todo[0]).toMatch(/number of bolts/);
    // Its hinge was checked with the control system's load alone; the file has no designer's hinge load, so it is not checked now.
    const hinge = r.joints.find((x) => x.jointId === "j-elevator-hinge")!;
    expect(hinge.todo).toContain(HINGE_LOAD_TODO);
    expect(hinge.boltMargin).toBeNull();
    expect(hinge.checks.every((c) => c.status === "notChecked" && c.margin === null)).toBe(true);
  });
});
