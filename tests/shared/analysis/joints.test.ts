/**
 * The joint checks of the load-path check v2, each tripped and not tripped. Loads come from goodRun()
 * (tests/shared/fixtures.ts): stick 167 lbf (14 CFR 23.397(b)) × 20/5 = 668 lbf limit in the pushrod and at
 * its rod-end joints; ultimate with the fitting factor 668 × 1.5 × 1.15 = 1,152.3 lbf (14 CFR 23.303, 23.625).
 */
import { describe, expect, it } from "vitest";
import { analyze, selectSpecialFactor, DEFAULT_SETTINGS, type JointResult } from "@/shared/analysis";
import type { JointHardware, LinkageGraph } from "@/shared/linkage/schema";
import { bearingUltimate, PLATE_TABLE, tearOutStrength } from "@/shared/hardware";
import { GOOD_HINGE_LOAD, goodRun, valid, withHardware } from "./fixtures";
import { HINGE_LOAD_TODO } from "@/shared/analysis/joints/path";

const run = (g: LinkageGraph, settings = {}) => analyze(valid(g), settings);
const joint = (g: LinkageGraph, id: string, settings = {}): JointResult => run(g, settings).joints.find((x) => x.jointId === id)!;
const check = (r: JointResult, id: string) => r.checks.find((c) => c.id === id)!;
const codes = (g: LinkageGraph, subject: string) => run(g).findings.filter((f) => f.subject.id === subject).map((f) => f.code);
const rel = (a: number, b: number, tol = 1e-4) => expect(Math.abs(a / b - 1)).toBeLessThan(tol);
/** goodRun with the stick's design force set so the pushrod carries `link` lbf limit (grip 20, attach 5: × 4). */
function withLink(link: number): LinkageGraph {
  const g = goodRun();
  (g.nodes[0].props as { designForce?: number }).designForce = link / 4;
  return g;
}

describe("bolt bending in single shear (domain.md §3: AN4, a = 0.25 in)", () => {
  // Link 2,400 / 1.725 = 1,391.3 lbf limit → 2,400 lbf ultimate at the rod end (14 CFR 23.303 × 1.5, 23.625 × 1.15).
  // Bending: a = spacers 0 + ball width 0.5/2 = 0.25 in; M = 2,400 × 0.25 = 600 in·lbf.
  // Allowable: 125,000 psi (AN steel Ftu, from memory) × 1.5 (round-bar shape factor, from memory: 1.5–1.7) × π · 0.25³/32 = 287.6 in·lbf.
  // Shear: 75,000 × π · 0.25²/4 = 3,681.6 lbf single shear (from memory) → MS +0.534.
  const single = (h: JointHardware) => ({ ...h, shear: "single" as const, spacers: 0, rodEnd: { ...h.rodEnd!, ballWidth: 0.5 } });
  const g = withHardware(withLink(2400 / 1.725), "rodA", single);
  const r = joint(g, "rodA");
  it("bending margin is negative while the shear margin is positive", () => {
    rel(check(r, "boltBending").required!, 600);
    rel(check(r, "boltBending").allowable!, 287.62, 1e-3);
    rel(check(r, "boltBending").margin! + 1, 287.62 / 600, 1e-3); // −0.52
    rel(check(r, "boltShear").margin! + 1, 3681.55 / 2400, 1e-3); // +0.534
    expect(check(r, "boltShear").margin!).toBeGreaterThan(0);
    expect(r.governing).toMatchObject({ check: "boltBending" });
    expect(r.governing!.margin).toBeLessThan(0);
    expect(codes(g, "rodA")).toContain("bolt-bending-weak");
  });
  it("the summary's lowest margin is the bending, not a pushrod", () => {
    expect(run(g).summary.lowestMargin).toMatchObject({ subject: { type: "joint", id: "rodA" } });
    expect(run(g).summary.lowestMargin!.what).toMatch(/bending/);
  });
  it("does not trip at the base load (1,152.3 lbf ultimate: M = 288.1 in·lbf, just over; at a = 0.125 in 144 in·lbf passes)", () => {
    const ok = withHardware(goodRun(), "rodA", (h) => ({ ...h, shear: "single", spacers: 0, rodEnd: { ...h.rodEnd!, ballWidth: 0.25 } }));
    expect(check(joint(ok, "rodA"), "boltBending").margin!).toBeGreaterThan(0); // 287.6 / (1,152.3 × 0.125) − 1 = +1.0
    expect(codes(ok, "rodA")).not.toContain("bolt-bending-weak");
  });
  it("is not checked without the stack: it asks for the ball width and spacers", () => {
    const g2 = withHardware(goodRun(), "rodA", (h) => ({ ...h, shear: "single", spacers: undefined, rodEnd: { ...h.rodEnd!, ballWidth: undefined } }));
    const c = check(joint(g2, "rodA"), "boltBending");
    expect(c).toMatchObject({ status: "notChecked", margin: null });
    expect(c.todo).toMatch(/ball width/);
    expect(c.todo).toMatch(/spacers/);
    expect(codes(g2, "rodA")).toContain("joint-checks-not-made");
  });
  it("double shear without gaps has no bending check; with spacers it has one", () => {
    expect(joint(goodRun(), "rodA").checks.some((c) => c.id === "boltBending")).toBe(false);
    // Gap 0.125 in, fork cheek 0.25/2 = 0.125 in, ball 0.375 in: M = P/2 × (0.125 + 0.0625 + 0.09375) = 1,152.3 × 0.140625 = 162.0 in·lbf.
    const gap = withHardware(goodRun(), "rodA", (h) => ({ ...h, spacers: 0.125 }));
    rel(check(joint(gap, "rodA"), "boltBending").required!, 1152.3 * 0.140625);
  });
});

describe("bearing and tear-out at the hole (a lug worked by hand)", () => {
  // 2024-T3 plate, t = 0.125 in, AN4 (D = 0.25 in), e = 0.4375 in → e/D = 1.75.
  // Fbru (from memory, MIL-HDBK-5): 104 ksi at e/D 1.5, 129 ksi at 2.0 → 116.5 ksi at 1.75 (linear).
  // Bearing: 116,500 × 0.25 × 0.125 = 3,640.6 lbf. Tear-out: 2 × 0.125 × (0.4375 − 0.125) × 39,000 (Fsu, from memory) = 3,046.9 lbf.
  const lug = { material: "2024-T3" as const, thickness: 0.125, edgeDistance: 0.4375 };
  const g = (link: number) => withHardware(withLink(link), "rodA", (h) => ({ ...h, holes: { from: lug, to: lug } }));
  it("matches the hand figures", () => {
    expect(bearingUltimate(PLATE_TABLE["2024-T3"], 1.75)).toBe(116_500);
    rel(tearOutStrength(0.125, 0.4375, 0.25, 39_000), 3046.875, 1e-9);
    const r = joint(g(668), "rodA");
    rel(check(r, "bearingFrom").allowable!, 3640.625, 1e-9);
    rel(check(r, "tearOutFrom").allowable!, 3046.875, 1e-9);
    expect(check(r, "bearingFrom").label).toMatch(/stick|Control stick/i);
    expect(r.checks.some((c) => c.id === "bearingTo")).toBe(false); // the pushrod side is the rod end's eye: its rating
  });
  it("trips tear-out when the ultimate passes 3,046.9 lbf, not below", () => {
    const over = 3046.875 / 1.725 * 1.01, under = 3046.875 / 1.725 * 0.99;
    expect(codes(g(over), "rodA")).toContain("hole-tear-out-weak");
    expect(codes(g(under), "rodA")).not.toContain("hole-tear-out-weak");
  });
  it("trips when the edge distance is under 1.5 D, and the bearing is then not checked", () => {
    const short = withHardware(goodRun(), "rodA", (h) => ({ ...h, holes: { from: { ...lug, edgeDistance: 0.3 }, to: lug } }));
    expect(codes(short, "rodA")).toContain("hole-edge-short"); // e/D 1.2 < 1.5 (MIL-HDBK-5 tables start at 1.5, from memory)
    expect(check(joint(short, "rodA"), "bearingFrom").status).toBe("notChecked");
    expect(codes(goodRun(), "rodA")).not.toContain("hole-edge-short");
  });
  it("a member without its data is not checked, with what to enter — never a margin", () => {
    const g2 = withHardware(goodRun(), "rodA", (h) => ({ ...h, holes: { from: { material: "6061-T6" }, to: lug } }));
    const c = check(joint(g2, "rodA"), "bearingFrom");
    expect(c).toMatchObject({ status: "notChecked", margin: null });
    expect(c.todo).toMatch(/thickness, edge distance/);
  });
});

describe("special factor: only the highest applies (14 CFR 23.619), on bearing", () => {
  const s = DEFAULT_SETTINGS;
  it("fitting factor 1.15 on a clamped rod end (23.625)", () => {
    expect(selectSpecialFactor({ ...goodRun().joints[1].hardware }, "link", s)).toMatchObject({ value: 1.15, name: "fitting factor" });
  });
  it("3.33 on a part turning on a plain bushing or on the bolt (23.693), 2.0 in a cable system", () => {
    const hw = { ...goodRun().joints[0].hardware, bearing: "plainBushing" as const };
    expect(selectSpecialFactor(hw, "pivot", s).value).toBe(3.33);
    expect(selectSpecialFactor({ ...hw, bearing: "none" }, "pivot", s).value).toBe(3.33);
    expect(selectSpecialFactor(hw, "pivot", s, { cable: true })).toMatchObject({ value: 2, name: "cable-system joint factor" });
    expect(selectSpecialFactor({ ...hw, bearing: "ballBearing" }, "pivot", s).value).toBe(1.15);
  });
  it("a hinge is checked with the designer's hinge load added to the control system's (668 + 100 lbf), and the report says so", () => {
    rel(joint(goodRun(), "hinge").radialLimit, 668 + GOOD_HINGE_LOAD); // horn force 668 lbf (167 × 20 / 5) and the designer's load, in line
    expect(run(goodRun()).assumptions.some((a) => a.startsWith("A hinge joint carries the designer's limit hinge load entered on its card"))).toBe(true);
    // The air load does not scale with the pilot's force: a second load of 200 lbf adds 100 lbf, not a factor.
    rel(joint(withHardware(goodRun(), "hinge", (h) => ({ ...h, hingeLoad: 200 })), "hinge").radialLimit, 668 + 200);
  });
  it("without the designer's hinge load a hinge is not checked: no margin, the to-do says what to enter, a finding names it", () => {
    const g = withHardware(goodRun(), "hinge", (h) => ({ ...h, hingeLoad: undefined }));
    const r = joint(g, "hinge");
    expect(r.todo).toEqual([HINGE_LOAD_TODO]);
    expect(r.boltMargin).toBeNull();
    expect(r.checks.length).toBeGreaterThan(0);
    expect(r.checks.every((c) => c.status === "notChecked" && c.margin === null)).toBe(true);
    expect(codes(g, "hinge")).toContain("joint-checks-not-made");
    // The other joints keep their margins; the pivot is no hinge and needs no such load.
    expect(joint(g, "pivot").todo).toEqual([]);
  });
  it("bolt bending is listed as not checked, with what decides it, where the shear planes or the gaps in the stack are not entered", () => {
    const noGaps = check(joint(withHardware(goodRun(), "rodA", (h) => ({ ...h, spacers: undefined })), "rodA"), "boltBending");
    expect(noGaps).toMatchObject({ status: "notChecked", margin: null, todo: "enter the washers and spacers between the member's face and the ball (0 if none)" });
    const noPlanes = check(joint(withHardware(goodRun(), "rodA", (h) => ({ ...h, shear: undefined })), "rodA"), "boltBending");
    expect(noPlanes).toMatchObject({ status: "notChecked", margin: null, todo: "choose single or double shear on the joint's card" });
    // Double shear with no gaps (0 entered): nothing bends the bolt, no line.
    expect(check(joint(goodRun(), "rodA"), "boltBending")).toBeUndefined();
  });
  it("the bolt-shear basis says when an AN bolt is taken as steel, and a pin without its strength shows no number", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, bolt: { ...h.bolt!, material: undefined } }));
    expect(check(joint(g, "rodA"), "boltShear").basis).toBe("steel 75 ksi (an AN bolt, taken as steel: material not recorded) × πD²/4 × 2"); // from memory: AN steel 75 ksi shear
    expect(check(joint(goodRun(), "rodA"), "boltShear").basis).toBe("steel 75 ksi × πD²/4 × 2");
    const pin = withHardware(goodRun(), "rodA", (h) => ({ ...h, bolt: undefined, clevisPin: { diameter: 0.25 } }));
    expect(check(joint(pin, "rodA"), "pinShear").basis).toBe("Fsu ? ksi × πD²/4 × 2");
  });
  it("a link end with no rod end and no bearing recorded (a fork on a crank arm) is taken to turn on its bolt: 3.33 (23.693), not 1.15", () => {
    const bare = { ...goodRun().joints[1].hardware, rodEnd: undefined, jamNut: undefined, engagement: undefined, bearing: undefined };
    expect(selectSpecialFactor(bare, "link", s).value).toBe(3.33);
    expect(selectSpecialFactor({ ...bare, bearing: "ballBearing" }, "link", s).value).toBe(1.15);
    expect(selectSpecialFactor(bare, "other", s).value).toBe(1.15); // a clamped attachment does not move
    // Its self-locking nut is asked about (caution), not passed.
    const g = withHardware(goodRun(), "rodB", (h) => ({ ...h, rodEnd: undefined, jamNut: undefined, engagement: undefined, bearing: undefined }));
    expect(codes(g, "rodB")).toContain("self-locking-nut-on-turning-bolt");
    expect(run(g).findings.find((f) => f.code === "self-locking-nut-on-turning-bolt" && f.subject.id === "rodB")!.severity).toBe("caution");
  });
  it("a rod end as a hinge bearing takes 6.67 (23.657(a)) when rod ends are treated as plain bearings; the fitting factor otherwise", () => {
    const hw = { ...goodRun().joints[1].hardware, bearing: undefined };
    expect(selectSpecialFactor(hw, "hinge", s).value).toBe(1.15);
    expect(selectSpecialFactor(hw, "hinge", { ...s, bearingFactorOnRodEnds: true })).toMatchObject({ value: 6.67, name: "hinge bearing factor" });
  });
  it("the assumptions state the factors the report used: the published ones by default, the build's own when it changed them", () => {
    const line = (settings: object) => run(goodRun(), settings).assumptions.find((a) => a.startsWith("Ultimate = limit"))!;
    // 14 CFR 23.303 1.5, 23.625 1.15, 23.693 3.33 and 2.0, 23.657(a) 6.67
    expect(line({})).toContain("× 1.5 ultimate factor");
    expect(line({})).toContain("× the 1.15 fitting factor");
    expect(line({})).toContain("3.33 where a part turns on a plain bearing (23.693); rod ends are taken as rolling bearings");
    expect(line({})).toContain("2 on joints of cable systems");
    expect(line({})).toContain("6.67 at hinges");
    const own = line({ fittingFactor: 1.2, bearingFactor: 4, bearingFactorOnRodEnds: true });
    expect(own).toContain("× the 1.2 fitting factor");
    expect(own).toContain("4 where a part turns on a plain bearing (23.693), rod ends included");
    expect(own).not.toContain("3.33");
    expect(run(goodRun()).assumptions.every((a) => !a.startsWith("\u0000"))).toBe(true);
    // 14 CFR 23.397(b): the maximum column is for a design weight of 5,000 lb or less.
    expect(run(goodRun()).assumptions[0]).toContain("design weight up to 5,000 lb");
  });
  it("a rod end at a hinge, treated as a plain bearing, is rated against the hinge's 6.67 (23.657(a)); at a link end against 3.33 (23.693)", () => {
    const rodEnd = { ...goodRun().joints[1].hardware.rodEnd!, ratedUltimate: undefined };
    const g = withHardware(goodRun(), "hinge", (h) => ({ ...h, rodEnd, bearing: undefined }));
    const plain = { bearingFactorOnRodEnds: true };
    expect(check(joint(g, "hinge", plain), "rodEndRating").factor).toBeCloseTo(6.67, 9);
    expect(check(joint(goodRun(), "rodA", plain), "rodEndRating").factor).toBeCloseTo(3.33, 9);
    const msg = (settings: object) => run(g, settings).findings.find((f) => f.subject.id === "hinge" && f.code === "rod-end-rating-missing")!.message;
    expect(msg(plain)).toContain("× 6.67 hinge bearing factor");
    expect(msg(plain)).not.toContain("fitting factor");
    expect(msg({})).toContain("× 1.15 fitting factor"); // rod ends as rolling bearings: the fitting factor, named so
  });
  it("6.67 at a hinge that is not a ball or roller bearing (23.657(a)); fitting factor at a ball-bearing hinge", () => {
    const g = withHardware(goodRun(), "hinge", (h) => ({ ...h, bearing: "plainBushing" }));
    const r = joint(g, "hinge");
    expect(r.factor).toMatchObject({ value: 6.67, name: "hinge bearing factor" });
    // The hinge carries 668 + 100 lbf limit; bearing at the mount's hole takes that × 1.5 × 6.67, the bolt × 1.725.
    rel(check(r, "bearingTo").required!, (668 + GOOD_HINGE_LOAD) * 1.5 * 6.67);
    rel(check(r, "boltShear").required!, (668 + GOOD_HINGE_LOAD) * 1.725);
    expect(joint(goodRun(), "hinge").factor.value).toBe(1.15);
  });
});

describe("ball and roller bearings: the rating may not be exceeded (23.693, 23.657(a))", () => {
  it("not checked without a rating (a caution), a hazard when exceeded, nothing when it holds", () => {
    const none = withHardware(goodRun(), "pivot", (h) => ({ ...h, bearingRating: undefined }));
    expect(check(joint(none, "pivot"), "bearingRating").status).toBe("notChecked");
    expect(codes(none, "pivot")).toEqual(["bearing-rating-missing"]);
    // The stick pivot carries 167 + 668 = 835 lbf limit → 1,440.4 lbf ultimate with the fitting factor.
    expect(codes(withHardware(goodRun(), "pivot", (h) => ({ ...h, bearingRating: 1400 })), "pivot")).toEqual(["bearing-rating-exceeded"]);
    expect(codes(withHardware(goodRun(), "pivot", (h) => ({ ...h, bearingRating: 1500 })), "pivot")).toEqual([]);
  });
});

describe("clevis pins (14 CFR 23.689(d))", () => {
  const pin = (retention: "cotterPinOnly" | "nutAndCotterPin", shearStrength?: number) => (h: JointHardware) =>
    ({ ...h, rodEnd: h.rodEnd, bolt: undefined, clevisPin: { diameter: 0.25, retention, ...(shearStrength ? { shearStrength } : {}) } });
  it("a pin under load retained only by a cotter pin is a hazard; by more than a cotter pin, none", () => {
    expect(codes(withHardware(goodRun(), "rodA", pin("cotterPinOnly", 60_000)), "rodA")).toContain("clevis-pin-cotter-only");
    expect(codes(withHardware(goodRun(), "rodA", pin("nutAndCotterPin", 60_000)), "rodA")).not.toContain("clevis-pin-cotter-only");
  });
  it("shear like a bolt: 60,000 × π · 0.25²/4 × 2 = 5,890 lbf; without the pin's strength, not checked", () => {
    rel(check(joint(withHardware(goodRun(), "rodA", pin("nutAndCotterPin", 60_000)), "rodA"), "pinShear").allowable!, 5890.49, 1e-5);
    expect(check(joint(withHardware(goodRun(), "rodA", pin("nutAndCotterPin")), "rodA"), "pinShear").status).toBe("notChecked");
  });
});

describe("rod-end thread in tension at its stress area (ASME B1.1)", () => {
  // 1/4-28: A_t = 0.0364 in² (ASME B1.1). Alloy steel body 125 ksi (from memory): 4,550 lbf; aluminium 62 ksi: 2,256.8 lbf.
  it("computed from the body's material; trips when the link load passes it", () => {
    rel(check(joint(goodRun(), "rodA"), "threadTension").allowable!, 4550);
    const alu = (link: number) => withHardware(withLink(link), "rodA", (h) => ({ ...h, rodEnd: { ...h.rodEnd!, bodyMaterial: "aluminium" } }));
    expect(codes(alu(2256.8 / 1.725 * 1.01), "rodA")).toContain("thread-tension-weak");
    expect(codes(alu(2256.8 / 1.725 * 0.99), "rodA")).not.toContain("thread-tension-weak");
  });
  it("not checked without the body material", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, rodEnd: { ...h.rodEnd!, bodyMaterial: undefined } }));
    expect(check(joint(g, "rodA"), "threadTension")).toMatchObject({ status: "notChecked", todo: "enter the rod end's body material" });
  });
});

describe("nuts, bolts and torque", () => {
  it("self-locking nut where the part turns on the bolt: hazard for bearing none, caution when unknown, none on a ball bearing", () => {
    const on = (bearing?: JointHardware["bearing"]) => withHardware(goodRun(), "pivot", (h) => ({ ...h, bearing }));
    expect(run(on("none")).findings.find((f) => f.code === "self-locking-nut-on-turning-bolt")?.severity).toBe("hazard");
    expect(run(on(undefined)).findings.find((f) => f.code === "self-locking-nut-on-turning-bolt")?.severity).toBe("caution");
    expect(codes(on("ballBearing"), "pivot")).not.toContain("self-locking-nut-on-turning-bolt");
    const msg = run(on("plainBushing")).findings.find((f) => f.code === "self-locking-nut-on-turning-bolt")!.message;
    expect(msg).toMatch(/castellated nut with a new cotter pin/);
    expect(msg).not.toMatch(/clamp the bolt so/); // clamping would bind a bushing pivot
  });
  it("torque: within table 7-1 plus the drag passes; above it a caution; above the maximum allowable a hazard (AC 43.13-1B)", () => {
    const tq = (torque: number, dragTorque?: number) => withHardware(goodRun(), "rodA", (h) => ({ ...h, torque, nut: { ...h.nut!, dragTorque } }));
    expect(codes(tq(75, 10), "rodA")).toEqual([]); // 1/4-28 tension 50–70 + 10 drag
    expect(codes(tq(85, 10), "rodA")).toEqual(["torque-high"]);
    // The maximum allowable takes the drag as the range does: the 100 in·lbf column (AC 43.13-1B table 7-1 as in TM 9-6150-228-13&P table H-1) + 10 drag.
    expect(codes(tq(105, 10), "rodA")).toEqual(["torque-high"]);
    expect(codes(tq(111, 10), "rodA")).toEqual(["torque-over-maximum"]);
    expect(run(tq(111, 10)).findings.find((f) => f.code === "torque-over-maximum")!.severity).toBe("hazard");
  });
  it("drag below the minimum for a re-used self-locking nut is a hazard: it no longer locks, as a plain nut does not", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, torque: 60, nut: { ...h.nut!, dragTorque: 2, reused: true } }));
    expect(codes(g, "rodA")).toEqual(["nut-drag-low"]); // 1/4-28 minimum breakaway 3.5 in·lbf (TM 10-5430-237-12&P table 2)
    expect(run(g).findings.find((f) => f.code === "nut-drag-low")!.severity).toBe("hazard");
    expect(codes(withHardware(goodRun(), "rodA", (h) => ({ ...h, torque: 63, nut: { ...h.nut!, dragTorque: 4, reused: true } })), "rodA")).toEqual([]);
  });
  it("aluminium bolts under 1/4 in (AC 43.13-1B 7-41) in a run of any system, flaps too; not an AN4", () => {
    const alu = (g: LinkageGraph, id = "horn") => withHardware(g, id, (h) => ({ ...h, bolt: { ...h.bolt!, material: "aluminium" } }));
    expect(codes(alu(goodRun()), "horn")).toContain("aluminium-bolt-small");
    const flap = goodRun();
    flap.system = "flap";
    expect(codes(alu(flap), "horn")).toContain("aluminium-bolt-small");
    expect(codes(withHardware(goodRun(), "horn", (h) => ({ ...h, bolt: { size: "AN4" as const, material: "aluminium" as const, grip: 0.5, stack: 0.5, threadsProtruding: 2 } })), "horn")).not.toContain("aluminium-bolt-small");
  });
  it("an aluminium AN4 at a rod end (taken apart for rigging) is an advisory; at a clamped horn it is not (AC 43.13-1B 7-41, from memory)", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, bolt: { ...h.bolt!, material: "aluminium" } }));
    expect(codes(g, "rodA")).toContain("aluminium-bolt-moving-joint");
    expect(run(g).findings.find((f) => f.code === "aluminium-bolt-moving-joint")!.severity).toBe("advisory");
    const clamp = withHardware(goodRun(), "horn", (h) => ({ ...h, bolt: { size: "AN4" as const, material: "aluminium" as const, grip: 0.5, stack: 0.5, threadsProtruding: 2 } }));
    expect(codes(clamp, "horn")).not.toContain("aluminium-bolt-moving-joint");
  });
  it("a female rod end's own thread is taken as aluminium unless its body is recorded as steel (2×D, then 1×D)", () => {
    // 1/4-28: 1×D = 0.25 in in steel, 2×D = 0.5 in in aluminium (domain.md §4 rule 2, common practice)
    const female = (bodyMaterial?: "aluminium" | "alloySteel") => withHardware(goodRun(), "rodA", (h) => ({
      ...h, rodEnd: { ...h.rodEnd!, shank: "female" as const, hasWitnessHole: false, bodyMaterial }, engagement: { witnessHoleVerified: false, engagedLength: 0.3 },
    }));
    expect(codes(female("alloySteel"), "rodA")).not.toContain("thread-engagement-short");
    expect(codes(female("aluminium"), "rodA")).toContain("thread-engagement-short");
    expect(codes(female(undefined), "rodA")).toContain("thread-engagement-short");
    expect(run(female(undefined)).findings.find((f) => f.code === "thread-engagement-short")!.message).toContain("body material not recorded");
  });
  it("the retaining washer is looked for on the rod end's free side", () => {
    const single = (freeSide: "head" | "nut") => withHardware(goodRun(), "rodA", (h) => ({ ...h, shear: "single", freeSide, washerUnderHead: { outsideDiameter: 0.4 }, washerUnderNut: { outsideDiameter: 0.625 } }));
    expect(codes(single("nut"), "rodA")).not.toContain("retaining-washer-small");
    expect(codes(single("head"), "rodA")).toContain("retaining-washer-small");
  });
});

describe("a bolt's shear planes left unentered are not assumed", () => {
  // Two planes would double the allowable (75,000 psi × πD²/4 × 2, AN steel from memory): unentered, the check
  // says what to enter and shows no margin.
  const g = withHardware(withLink(2400 / 1.725), "rodA", (h) => { const { shear: _omit, ...rest } = h; return rest as JointHardware; });
  const r = joint(g, "rodA");
  it("reads not checked, with what to enter, and no allowable or margin", () => {
    const c = check(r, "boltShear");
    expect(c.status).not.toBe("computed");
    expect(c.allowable).toBeNull();
    expect(c.margin).toBeNull();
    expect(c.todo).toMatch(/single or double shear/);
    expect(c.label).toBe("bolt shear, shear planes not entered");
  });
  it("is checked once double shear is entered: 75 ksi × πD²/4 × 2 (AN steel bolt, from memory)", () => {
    const c = check(joint(withHardware(g, "rodA", (h) => ({ ...h, shear: "double" })), "rodA"), "boltShear");
    expect(c.status).toBe("computed");
    rel(c.allowable!, 2 * 3681.55, 1e-3);
  });
});

describe("a bolt's material is not assumed where the part number does not give it", () => {
  const g = goodRun();
  const patchBolt = (over: Record<string, unknown>) => (h: JointHardware) => ({ ...h, bolt: { ...h.bolt!, ...over } as NonNullable<JointHardware["bolt"]> });
  it("an AN bolt with no material entered is steel: 75 ksi (AN bolts without DD are alloy steel, from memory)", () => {
    const c = check(joint(withHardware(g, "rodA", patchBolt({ material: undefined })), "rodA"), "boltShear");
    expect(c.status).toBe("computed");
    rel(c.allowable!, 2 * 3681.55, 1e-3);
  });
  it("a custom bolt with no material entered is not checked, and says what to enter", () => {
    const c = check(joint(withHardware(g, "rodA", patchBolt({ size: "custom", diameter: 0.25, material: undefined })), "rodA"), "boltShear");
    expect(c.status).toBe("notChecked");
    expect(c.allowable).toBeNull();
    expect(c.todo).toBe("enter the bolt's material (steel or aluminium)");
  });
  it("a custom bolt with its material entered is checked", () => {
    const c = check(joint(withHardware(g, "rodA", patchBolt({ size: "custom", diameter: 0.25, material: "aluminium" })), "rodA"), "boltShear");
    expect(c.status).toBe("computed");
    expect(c.allowable!).toBeLessThan(2 * 3681.55 * 0.6); // aluminium 37 ksi, not steel 75
  });
});

describe("a custom bolt with its diameter but no material", () => {
  it("is reported as a check not made for want of its material, not as a bolt without a diameter", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, bolt: { ...h.bolt!, size: "custom", diameter: 0.25, material: undefined } }));
    const r = run(g);
    const f = r.findings.filter((x) => x.subject.id === "rodA").map((x) => x.code);
    expect(f).not.toContain("bolt-diameter-unknown");
    expect(r.findings.find((x) => x.code === "joint-checks-not-made" && x.subject.id === "rodA")!.message).toContain("enter the bolt's material");
    // Without its diameter the own message is still given.
    const g2 = withHardware(goodRun(), "rodA", (h) => ({ ...h, bolt: { ...h.bolt!, size: "custom", diameter: undefined, material: "steel" } }));
    expect(run(g2).findings.map((x) => `${x.code}@${x.subject.id}`)).toContain("bolt-diameter-unknown@rodA");
  });
});

describe("checks that need a recorded input are not made without it (inspector's review, engine 2.5)", () => {
  it("bolt bending: spacers in the stack but no shear case recorded is not checked (single shear's bending is not assumed away); a recorded case is", () => {
    const g = (shear: "single" | "double" | undefined) => withHardware(goodRun(), "rodA", (h) => ({ ...h, shear, spacers: 0.1 }));
    expect(check(joint(g(undefined), "rodA"), "boltBending")).toMatchObject({ status: "notChecked", margin: null, todo: "choose single or double shear on the joint's card" });
    const single = check(joint(g("single"), "rodA"), "boltBending"), double = check(joint(g("double"), "rodA"), "boltBending");
    expect(single.status).toBe("computed");
    expect(double.status).toBe("computed");
    // Single shear: M = P · (gaps + w/2); double with gaps: M = P/2 · (gaps + t/2 + w/4) — single is the larger moment.
    expect(single.required!).toBeGreaterThan(double.required!);
  });
  it("a rod end with no bolt or pin recorded: its fastener is listed as not checked and told as a caution; with its bolt, not", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, bolt: undefined }));
    expect(check(joint(g, "rodA"), "boltShear")).toMatchObject({ status: "notChecked", margin: null, allowable: null });
    expect(joint(g, "rodA").governing?.check).not.toBe("boltShear");
    const f = run(g).findings.find((x) => x.subject.id === "rodA" && x.code === "fastener-not-recorded");
    expect(f?.severity).toBe("caution");
    expect(f?.message).toContain("no bolt or clevis pin is recorded");
    expect(codes(goodRun(), "rodA")).not.toContain("fastener-not-recorded");
  });
  it("a stop's bolt is checked for bearing and tear-out at its holes (14 CFR 23.675: the stop takes the system's load)", () => {
    const r = joint(goodRun(), "stop");
    expect(check(r, "bearingFrom")?.status).toBe("computed");
    expect(check(r, "tearOutTo")?.status).toBe("computed");
    // Without the members recorded, listed as not checked with what to enter — not left out.
    const bare = joint(withHardware(goodRun(), "stop", (h) => ({ ...h, holes: undefined })), "stop");
    expect(check(bare, "bearingFrom")).toMatchObject({ status: "notChecked", margin: null });
  });
  it("hole-bearing-weak trips on a thin member at the hole and not on the fixture's", () => {
    const thin = withHardware(goodRun(), "pivot", (h) => ({ ...h, bearing: "plainBushing", holes: { ...h.holes, to: { material: "6061-T6", thickness: 0.02, edgeDistance: 0.5 } } }));
    expect(codes(thin, "pivot")).toContain("hole-bearing-weak");
    expect(codes(goodRun(), "pivot")).not.toContain("hole-bearing-weak");
  });
  it("pin-shear-weak trips on a weak clevis pin and not on a strong one (Fsu · πD²/4 per plane)", () => {
    const pin = (shearStrength: number, diameter = 0.25) => withHardware(goodRun(), "rodA", (h) => ({ ...h, bolt: undefined, clevisPin: { diameter, shearStrength, retention: "nutAndCotterPin" as const } }));
    expect(codes(pin(2_000, 0.0625), "rodA")).toContain("pin-shear-weak");
    expect(codes(pin(60_000), "rodA")).not.toContain("pin-shear-weak");
  });
  it("clevis-pin-retention-unrecorded: a clevis pin with no retention recorded is a caution; recorded, it is not", () => {
    const pin = (retention?: "nutAndCotterPin") => withHardware(goodRun(), "rodA", (h) => ({ ...h, bolt: undefined, clevisPin: { diameter: 0.25, shearStrength: 60_000, ...(retention ? { retention } : {}) } }));
    expect(codes(pin(), "rodA")).toContain("clevis-pin-retention-unrecorded");
    expect(codes(pin("nutAndCotterPin"), "rodA")).not.toContain("clevis-pin-retention-unrecorded");
  });
});
