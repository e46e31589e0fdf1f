/**
 * Each retention and installation rule of domain.md §4 with one linkage that trips it and one that does not,
 * plus the strength findings. Every case starts from goodRun() (no findings) and changes one joint.
 * goodRun loads: stick 167 lbf (14 CFR 23.397(b)) × 20/5 = 668 lbf in the pushrod; rod-end ultimate
 * 668 × 1.5 × 1.15 = 1,152.3 lbf (14 CFR 23.303, 23.625).
 */
import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import type { JointHardware, LinkageGraph } from "@/shared/linkage/schema";
import { goodRun, valid, withHardware } from "./fixtures";

const codes = (g: LinkageGraph, subject?: string) =>
  analyze(valid(g)).findings.filter((f) => !subject || f.subject.id === subject).map((f) => f.code);
const severityOf = (g: LinkageGraph, code: string) => analyze(valid(g)).findings.find((f) => f.code === code)?.severity;
const patchRodEnd = (over: Partial<NonNullable<JointHardware["rodEnd"]>>) => (h: JointHardware) => ({ ...h, rodEnd: { ...h.rodEnd!, ...over } });
const patchBolt = (over: Partial<NonNullable<JointHardware["bolt"]>>) => (h: JointHardware) => ({ ...h, bolt: { ...h.bolt!, ...over } });

it("the base run has no findings at all", () => {
  expect(analyze(valid(goodRun())).findings).toEqual([]);
});

describe("rule 1: jam nut fitted and tightened", () => {
  it("trips with no jam nut", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, jamNut: undefined }));
    expect(codes(g, "rodA")).toEqual(["jam-nut-missing"]);
    expect(severityOf(g, "jam-nut-missing")).toBe("hazard");
  });
  it("trips with a jam nut fitted but not tightened", () => {
    expect(codes(withHardware(goodRun(), "rodA", (h) => ({ ...h, jamNut: { fitted: true, tightened: false } })), "rodA")).toEqual(["jam-nut-loose"]);
  });
  it("does not trip with the jam nut fitted and tightened", () => {
    expect(codes(goodRun(), "rodA")).toEqual([]);
  });
});

describe("rule 2: thread engagement", () => {
  it("asks for verification when the witness hole is not checked and no length is recorded", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, engagement: { witnessHoleVerified: false } }));
    expect(codes(g, "rodA")).toEqual(["thread-engagement-unverified"]);
    expect(severityOf(g, "thread-engagement-unverified")).toBe("caution");
  });
  // domain.md §4 rule 2: the engaged length judges engagement where the rod end has no witness hole.
  const noHoleLen = (engagedLength: number) => (h: JointHardware) => ({ ...patchRodEnd({ hasWitnessHole: false })(h), engagement: { witnessHoleVerified: false, engagedLength } });
  it("trips when the engaged length is under 1 × D in a steel pushrod", () => {
    // 1/4-28: D = 0.25 in (ASME B1.1); 1×D in steel (common practice) = 0.25 in
    const g = withHardware(goodRun(), "rodA", noHoleLen(0.2));
    expect(codes(g, "rodA")).toEqual(["thread-engagement-short"]);
    expect(severityOf(g, "thread-engagement-short")).toBe("hazard");
    expect(analyze(valid(g)).findings.find((f) => f.code === "thread-engagement-short")!.message).toContain("a rule of thumb");
  });
  it("does not trip at exactly 1 × D in steel", () => {
    expect(codes(withHardware(goodRun(), "rodA", noHoleLen(0.25)), "rodA")).toEqual([]);
  });
  it("needs 2 × D in an aluminium pushrod", () => {
    // 2×D in aluminium (common practice) = 0.50 in for 1/4-28
    const alu = goodRun();
    const rod = alu.nodes.find((n) => n.id === "rod")!;
    if (rod.kind === "pushrod") rod.props.material = "6061-T6";
    expect(codes(withHardware(alu, "rodA", noHoleLen(0.4)), "rodA")).toEqual(["thread-engagement-short"]);
    expect(codes(withHardware(alu, "rodA", noHoleLen(0.5)), "rodA")).toEqual([]);
  });
  it("a rod end with a witness hole is not passed on its recorded length: the wire check is asked for; a short length is still a hazard", () => {
    const holeLen = (engagedLength: number) => withHardware(goodRun(), "rodA", (h) => ({ ...h, engagement: { witnessHoleVerified: false, engagedLength } }));
    const g = holeLen(0.3); // over 1×D of 1/4-28
    expect(codes(g, "rodA")).toEqual(["thread-engagement-unverified"]);
    expect(severityOf(g, "thread-engagement-unverified")).toBe("caution");
    expect(analyze(valid(g)).findings.find((f) => f.code === "thread-engagement-unverified")!.message).toMatch(/^Not checked: .* Check the hole with a wire/);
    expect(codes(holeLen(0.2), "rodA")).toEqual(["thread-engagement-short"]);
    expect(codes(withHardware(goodRun(), "rodA", (h) => ({ ...h, engagement: { witnessHoleVerified: true, engagedLength: 0.3 } })), "rodA")).toEqual([]);
  });
  it("a rod end without a witness hole needs its length recorded", () => {
    const noHole = withHardware(goodRun(), "rodA", (h) => ({ ...patchRodEnd({ hasWitnessHole: false })(h), engagement: { witnessHoleVerified: true } }));
    expect(codes(noHole, "rodA")).toEqual(["thread-engagement-unverified"]);
    expect(codes(withHardware(noHole, "rodA", (h) => ({ ...h, engagement: { witnessHoleVerified: false, engagedLength: 0.3 } })), "rodA")).toEqual([]);
  });
});

describe("rule 3: bolt clamped in the ball; no self-locking nut on a bolt subject to rotation", () => {
  it("trips when the bolt is free to rotate in the rod end (and its self-locking nut with it)", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, fit: "freeToRotate" }));
    expect(codes(g, "rodA").sort()).toEqual(["bolt-turns-in-ball", "self-locking-nut-on-turning-bolt"]);
  });
  it("trips on a self-locking nut on a pivot that turns on a plain bushing", () => {
    const g = withHardware(goodRun(), "pivot", (h) => ({ ...h, bearing: "plainBushing" }));
    expect(codes(g, "pivot")).toEqual(["self-locking-nut-on-turning-bolt"]);
    expect(severityOf(g, "self-locking-nut-on-turning-bolt")).toBe("hazard");
  });
  it("does not trip with a castellated nut and new cotter pin on that pivot (and no torque asked of it)", () => {
    const g = withHardware(goodRun(), "pivot", (h) => ({ ...h, bearing: "plainBushing", nut: { type: "castellatedCotter", pattern: "shear", cotterPinNew: true }, torque: undefined }));
    expect(codes(g, "pivot")).toEqual([]);
  });
  it("does not trip on a self-locking nut clamping a ball bearing's inner race (AC 43.13-1B 7-64d)", () => {
    expect(codes(goodRun(), "pivot")).toEqual([]);
  });  // common practice, no source: an unrecorded fit is not taken as clamped.
  it("says the fit is not checked when a rod end's bolt has no fit recorded", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, fit: undefined }));
    expect(codes(g, "rodA")).toEqual(["bolt-fit-unrecorded"]);
    expect(severityOf(g, "bolt-fit-unrecorded")).toBe("caution");
  });
  it("does not ask for the fit where it is recorded clamped, or where no rod end is", () => {
    expect(codes(goodRun(), "rodA")).toEqual([]);
    expect(codes(withHardware(goodRun(), "pivot", (h) => ({ ...h, fit: undefined })), "pivot")).toEqual([]);
  });
});

describe("rule 4: retaining washer on a single-shear rod end", () => {
  const single = (washerOD?: number) => (h: JointHardware) => ({ ...h, shear: "single" as const, freeSide: "head" as const, washerUnderHead: washerOD === undefined ? undefined : { outsideDiameter: washerOD } });
  const sideUnset = (head?: number, nut?: number) => (h: JointHardware) => ({
    ...h, shear: "single" as const, freeSide: undefined,
    washerUnderHead: head === undefined ? undefined : { outsideDiameter: head }, washerUnderNut: nut === undefined ? undefined : { outsideDiameter: nut },
  });
  it("trips with a washer no larger than the housing bore (0.438 in on a 0.500 in bore)", () => {
    const c = codes(withHardware(goodRun(), "rodB", single(0.438)), "rodB");
    expect(c).toContain("retaining-washer-small");
    expect(c).toContain("rod-end-single-shear"); // domain.md §3: single shear with bending is a caution
  });
  it("trips with no washer under the head", () => {
    expect(codes(withHardware(goodRun(), "rodB", single(undefined)), "rodB")).toContain("retaining-washer-missing");
  });
  it("does not trip with a 0.625 in washer over the 0.500 in bore", () => {
    expect(codes(withHardware(goodRun(), "rodB", single(0.625)), "rodB")).toEqual(["rod-end-single-shear"]);
  });
  it("falls back to the ball diameter, and asks when neither is known", () => {
    const noBore = (h: JointHardware) => patchRodEnd({ housingBore: undefined })(single(0.5)(h));
    expect(codes(withHardware(goodRun(), "rodB", noBore), "rodB")).toContain("retaining-washer-small"); // 0.5 ≤ ball 0.531
    const nothing = (h: JointHardware) => patchRodEnd({ housingBore: undefined, ballDiameter: undefined })(single(0.5)(h));
    expect(codes(withHardware(goodRun(), "rodB", nothing), "rodB")).toContain("retaining-washer-unverifiable");
  });
  it("does not apply in double shear", () => {
    expect(codes(withHardware(goodRun(), "rodB", (h) => ({ ...h, washerUnderHead: { outsideDiameter: 0.3 } })), "rodB")).toEqual([]);
  });
  it("free side not recorded: asks for it rather than taking the head, when one side's washer is not over the bore", () => {
    // A 0.625 in washer under the head and a 0.5 in one under the nut on a 0.500 in bore: right only if the head side is free.
    const g = withHardware(goodRun(), "rodB", sideUnset(0.625, 0.5));
    expect(codes(g, "rodB").sort()).toEqual(["retaining-washer-side-unrecorded", "rod-end-single-shear"].sort());
    expect(severityOf(g, "retaining-washer-side-unrecorded")).toBe("caution");
    expect(codes(withHardware(goodRun(), "rodB", sideUnset(0.625)), "rodB")).toContain("retaining-washer-side-unrecorded");
  });
  it("free side not recorded: washers over the bore on both sides hold the eye either way; none at all is a hazard", () => {
    expect(codes(withHardware(goodRun(), "rodB", sideUnset(0.625, 0.625)), "rodB")).toEqual(["rod-end-single-shear"]);
    expect(codes(withHardware(goodRun(), "rodB", sideUnset()), "rodB")).toContain("retaining-washer-missing");
  });
});

describe("rule 5: thread protrusion and grip", () => {
  it("trips with no full thread past the nut", () => {
    expect(codes(withHardware(goodRun(), "horn", patchBolt({ threadsProtruding: 0 })), "horn")).toEqual(["bolt-thread-short"]);
  });
  it("does not trip with one full thread (AC 43.13-1B 7-37)", () => {
    expect(codes(withHardware(goodRun(), "horn", patchBolt({ threadsProtruding: 1 })), "horn")).toEqual([]);
  });
  it("asks for the protrusion when it is not recorded", () => {
    const g = withHardware(goodRun(), "horn", patchBolt({ threadsProtruding: undefined }));
    expect(codes(g, "horn")).toEqual(["bolt-protrusion-unrecorded"]);
    expect(severityOf(g, "bolt-protrusion-unrecorded")).toBe("advisory");
  });
  it("trips when the grip is longer than the stack", () => {
    expect(codes(withHardware(goodRun(), "rodA", patchBolt({ grip: 0.875, stack: 0.75 })), "rodA")).toEqual(["bolt-grip-long"]);
  });
  it("trips when threads would bear in the joint", () => {
    // stack 0.75 less 0.063 washer under the nut = 0.687 in of bearing; grip 0.6 < 0.687 (from memory: grip matches stack)
    expect(codes(withHardware(goodRun(), "rodA", patchBolt({ grip: 0.6, stack: 0.75 })), "rodA")).toEqual(["bolt-threads-in-bearing"]);
  });
  it("does not trip when the threads end inside the washer under the nut", () => {
    expect(codes(withHardware(goodRun(), "rodA", patchBolt({ grip: 0.7, stack: 0.75 })), "rodA")).toEqual([]);
  });
});

describe("rule 6: torque within AC 43.13-1B table 7-1", () => {
  const noDrag = (torque: number) => (h: JointHardware) => ({ ...h, nut: { ...h.nut!, dragTorque: undefined }, torque });
  it("trips below the range (45 < 50 in·lbf, 1/4-28 tension nut)", () => {
    expect(codes(withHardware(goodRun(), "rodA", noDrag(45)), "rodA")).toEqual(["torque-low"]); // table 7-1: 50–70
  });
  it("trips below the range plus the measured drag (57 < 50 + 8 in·lbf)", () => {
    expect(codes(withHardware(goodRun(), "rodA", (h) => ({ ...h, torque: 57 })), "rodA")).toEqual(["torque-low"]); // table 7-1: 50–70, fixture drag 8
  });
  it("a self-locking nut in the bare range with no drag recorded is not checked against the drag (advisory), not passed", () => {
    const g = withHardware(goodRun(), "rodA", noDrag(60));
    expect(codes(g, "rodA")).toEqual(["torque-drag-unrecorded"]);
    expect(severityOf(g, "torque-drag-unrecorded")).toBe("advisory");
    expect(analyze(valid(g)).findings.find((f) => f.code === "torque-drag-unrecorded")!.message).toMatch(/^Not checked against the nut's drag/);
  });
  it("the maximum allowable takes the measured drag too: a 10-32 shear nut with 12 in·lbf drag at 26 in·lbf is in its 24–27 range, not over 25", () => {
    // AC 43.13-1B table 7-1: 10-32 shear 12–15 in·lbf; maximum allowable 25 (as in TM 9-6150-228-13&P table H-1)
    const clamp10 = (torque: number) => (h: JointHardware) => ({ ...h, nut: { type: "selfLockingMetal" as const, pattern: "shear" as const, dragTorque: 12 }, torque });
    expect(codes(withHardware(goodRun(), "horn", clamp10(26)), "horn")).toEqual([]);
    const over = withHardware(goodRun(), "horn", clamp10(38)); // over 25 + 12
    expect(codes(over, "horn")).toEqual(["torque-over-maximum"]);
    expect(analyze(valid(over)).findings.find((f) => f.code === "torque-over-maximum")!.message).toContain("above the 37 in·lbf maximum allowable");
  });
  it("trips above the range on a nut without drag torque (75 > 70 in·lbf)", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, nut: { type: "plainSafetyWire", pattern: "tension" }, torque: 75 })); // table 7-1: 50–70
    expect(codes(g, "rodA")).toEqual(["torque-high"]);
    expect(severityOf(g, "torque-high")).toBe("caution");
  });
  it("only advises on a self-locking nut above the range (the excess may be drag torque)", () => {
    const g = withHardware(goodRun(), "rodA", noDrag(75));
    expect(codes(g, "rodA")).toEqual(["torque-check-drag"]);
    expect(severityOf(g, "torque-check-drag")).toBe("caution");
  });
  it("uses the shear-nut column for a shear nut", () => {
    const shear = (t: number) => (h: JointHardware) => ({ ...h, nut: { type: "plainSafetyWire" as const, pattern: "shear" as const }, torque: t });
    expect(codes(withHardware(goodRun(), "rodA", shear(35)), "rodA")).toEqual([]); // table 7-1: 1/4-28 shear 30–40
    expect(codes(withHardware(goodRun(), "rodA", shear(45)), "rodA")).toEqual(["torque-high"]);
  });
  it("does not trip within the range plus the drag", () => {
    expect(codes(withHardware(goodRun(), "rodA", (h) => ({ ...h, torque: 58 })), "rodA")).toEqual([]); // table 7-1 minimum 50 + 8 drag
    expect(codes(withHardware(goodRun(), "rodA", (h) => ({ ...h, torque: 78 })), "rodA")).toEqual([]); // table 7-1 maximum 70 + 8 drag
  });
  it("above the range but within the maximum: re-torque, never 'replace' (caution)", () => {
    const wired = withHardware(goodRun(), "rodA", (h) => ({ ...h, nut: { type: "plainSafetyWire" as const, pattern: "tension" as const }, torque: 80 }));
    const m = analyze(valid(wired)).findings.find((f) => f.code === "torque-high")!;
    expect(m.severity).toBe("caution");
    expect(m.message).toMatch(/within the 100 in·lbf maximum allowable\. Back the nut off and torque it again/);
    expect(m.message).not.toMatch(/replace/i);
  });
  // AC 43.13-1B 7-40f: start lining up the cotter-pin hole at the range's minimum; do not exceed its maximum; if the
  // hole and castellation do not align, change the washer or the nut.
  const castleAt = (torque: number) => withHardware(goodRun(), "rodA", (h) => ({ ...h, nut: { type: "castellatedCotter" as const, pattern: "tension" as const, cotterPinNew: true }, torque }));
  it("a castellated nut past the range to line up its slot is a caution that says change the washer or nut, not an accepted practice", () => {
    const m = analyze(valid(castleAt(80))).findings.find((f) => f.code === "torque-high")!; // table 7-1: 1/4-28 tension 50–70
    expect(m.severity).toBe("caution");
    expect(m.message).toMatch(/Do not go past the range to line up the cotter-pin slot \(AC 43\.13-1B 7-40f\): back the nut off, change the washer or the nut/);
    expect(m.message).not.toMatch(/acceptable/);
    expect(m.source.text).toMatch(/7-40f/);
  });
  it("a castellated nut within the range lines up its slot without a finding", () => {
    expect(codes(castleAt(70), "rodA")).toEqual([]);
    expect(codes(castleAt(50), "rodA")).toEqual([]);
  });
  it("a self-locking nut above the range with its drag measured names the drag once: the table's range, then the drag", () => {
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, torque: 85, nut: { ...h.nut!, dragTorque: 10 } })); // 50–70 + 10 drag
    const m = analyze(valid(g)).findings.find((f) => f.code === "torque-high")!;
    expect(m.message).toContain("above the 50–70 in·lbf of table 7-1 for a 1/4-28 tension nut plus the measured 10.0 in·lbf drag");
    expect(m.message).not.toContain("60–80");
    expect(m.numbers).toEqual(expect.arrayContaining([expect.objectContaining({ label: "table maximum with drag", value: 80 })]));
    // Without drag (a safety-wired plain nut) the figures are the table's own.
    const wired = withHardware(goodRun(), "rodA", (h) => ({ ...h, nut: { type: "plainSafetyWire" as const, pattern: "tension" as const }, torque: 80 }));
    expect(analyze(valid(wired)).findings.find((f) => f.code === "torque-high")!.numbers).toEqual(expect.arrayContaining([expect.objectContaining({ label: "table maximum", value: 70 })]));
  });
  it("asks for the torque when it is not recorded", () => {
    expect(codes(withHardware(goodRun(), "rodA", (h) => ({ ...h, torque: undefined })), "rodA")).toEqual(["torque-unrecorded"]);
  });  // Pattern not recorded: table 7-1 gives 1/4-28 tension 50–70, shear 30–40, maxima 100 and 60 in·lbf.
  const noPattern = (t: number | undefined) => (h: JointHardware) => ({ ...h, nut: { type: "plainSafetyWire" as const }, torque: t });
  it("does not take a nut of unrecorded pattern as a tension nut: 65 in·lbf is in range for one and over for the other", () => {
    const g = withHardware(goodRun(), "rodA", noPattern(65));
    expect(codes(g, "rodA")).toEqual(["nut-pattern-unrecorded"]);
    expect(severityOf(g, "nut-pattern-unrecorded")).toBe("caution");
    expect(analyze(valid(g)).findings.find((f) => f.code === "nut-pattern-unrecorded")!.message).toContain("50–70 in·lbf for a 1/4-28 tension nut, 30–40 in·lbf for a shear (thin) nut");
  });
  it("still calls a torque over both maxima a hazard (120 > 100 in·lbf)", () => {
    expect(codes(withHardware(goodRun(), "rodA", noPattern(120)), "rodA")).toEqual(["torque-over-maximum"]);
  });
  it("asks for both torque and pattern when neither is recorded (advisory), and not at all once both are", () => {
    const g = withHardware(goodRun(), "rodA", noPattern(undefined));
    expect(codes(g, "rodA")).toEqual(["nut-pattern-unrecorded"]);
    expect(severityOf(g, "nut-pattern-unrecorded")).toBe("advisory");
    expect(codes(withHardware(goodRun(), "rodA", (h) => ({ ...h, nut: { type: "plainSafetyWire" as const, pattern: "tension" as const }, torque: 60 })), "rodA")).toEqual([]);
  });
});

describe("rule 7: castellated nut with a new cotter pin", () => {
  const castle = (cotterPinNew?: boolean) => (h: JointHardware) => ({ ...h, nut: { type: "castellatedCotter" as const, pattern: "shear" as const, cotterPinNew }, torque: 35 }); // table 7-1: 1/4-28 shear 30–40
  it("trips on a reused cotter pin", () => {
    const g = withHardware(goodRun(), "rodA", castle(false));
    expect(codes(g, "rodA")).toEqual(["cotter-pin-reused"]);
    expect(severityOf(g, "cotter-pin-reused")).toBe("hazard");
  });
  it("asks when the cotter pin is not recorded", () => {
    expect(codes(withHardware(goodRun(), "rodA", castle(undefined)), "rodA")).toEqual(["cotter-pin-unrecorded"]);
  });
  it("does not trip with a new cotter pin", () => {
    expect(codes(withHardware(goodRun(), "rodA", castle(true)), "rodA")).toEqual([]);
  });
});

describe("rule 8: no bolt under 10-32", () => {
  it("trips on a 0.164 in (8-32) custom bolt", () => {
    const g = withHardware(goodRun(), "horn", patchBolt({ size: "custom", diameter: 0.164 }));
    expect(codes(g, "horn")).toEqual(["bolt-too-small"]); // AC 43.13-1B 7-41: nothing under 10-32 (0.190 in)
  });
  it("does not trip at 0.190 in", () => {
    expect(codes(withHardware(goodRun(), "horn", patchBolt({ size: "custom", diameter: 0.19 })), "horn")).toEqual([]);
  });
});

describe("rule 9: one RH and one LH end per pushrod", () => {
  it("advises when both ends are RH", () => {
    const g = withHardware(goodRun(), "rodB", patchRodEnd({ hand: "RH" }));
    expect(codes(g, "rod")).toEqual(["pushrod-ends-same-hand"]);
    expect(severityOf(g, "pushrod-ends-same-hand")).toBe("advisory");
  });
  it("does not trip with RH and LH ends", () => {
    expect(codes(goodRun(), "rod")).toEqual([]);
  });
  it("does not take an unrecorded hand as RH (one RH end and one of no recorded hand)", () => {
    expect(codes(withHardware(goodRun(), "rodB", patchRodEnd({ hand: undefined })), "rod")).toEqual([]);
  });
});

describe("rule 10: misalignment rating present", () => {
  it("cautions when the rating is unknown", () => {
    const g = withHardware(goodRun(), "rodA", patchRodEnd({ ratedMisalignment: undefined }));
    expect(codes(g, "rodA")).toEqual(["misalignment-rating-unknown"]);
    expect(severityOf(g, "misalignment-rating-unknown")).toBe("caution");
  });
  it("does not trip with a rating on the card", () => {
    expect(codes(withHardware(goodRun(), "rodA", patchRodEnd({ ratedMisalignment: 6 })), "rodA")).toEqual([]);
  });
});

describe("nut present and locked (common practice, cf. 14 CFR 23.607; beyond the ten rules)", () => {
  it("trips on a plain nut, a missing nut, an unrecorded nut", () => {
    expect(codes(withHardware(goodRun(), "horn", (h) => ({ ...h, nut: { type: "plain", pattern: "tension" } })), "horn")).toEqual(["nut-not-locked"]);
    expect(codes(withHardware(goodRun(), "horn", (h) => ({ ...h, nut: { type: "none", pattern: "tension" } })), "horn")).toEqual(["nut-missing"]);
    const unrec = withHardware(goodRun(), "horn", (h) => ({ ...h, nut: undefined }));
    expect(codes(unrec, "horn")).toEqual(["nut-missing"]);
    expect(severityOf(unrec, "nut-missing")).toBe("caution");
  });
  it("does not trip on a safety-wired nut", () => {
    expect(codes(withHardware(goodRun(), "horn", (h) => ({ ...h, nut: { type: "plainSafetyWire", pattern: "tension" } })), "horn")).toEqual([]);
  });
});

describe("strength findings", () => {
  it("rod end rated under the required ultimate", () => {
    // required 1,152.3 lbf (header); rating 1,000 → MS = 1000/1152.3 − 1 = −0.132
    const g = withHardware(goodRun(), "rodA", patchRodEnd({ ratedUltimate: 1000 }));
    const f = analyze(valid(g)).findings.find((x) => x.code === "rod-end-underrated")!;
    expect(f.severity).toBe("hazard");
    expect(f.numbers.find((n) => n.label === "margin")!.value).toBeCloseTo(1000 / 1152.3 - 1, 3);
    expect(codes(withHardware(goodRun(), "rodA", patchRodEnd({ ratedUltimate: 1200 })), "rodA")).toEqual([]);
  });
  it("rod end with no rating", () => {
    expect(codes(withHardware(goodRun(), "rodA", patchRodEnd({ ratedUltimate: undefined })), "rodA")).toEqual(["rod-end-rating-missing"]);
  });
  it("bolt too weak in shear", () => {
    // 0.190 in aluminium bolt, single shear: 37,000 × π × 0.19²/4 = 1,049 lbf (from memory: 2024-T4 Fsu 37 ksi) < 1,152.3
    const g = withHardware(goodRun(), "rodA", (h) => ({ ...h, shear: "single", bolt: { ...h.bolt!, size: "custom", diameter: 0.19, material: "aluminium" } }));
    expect(codes(g, "rodA")).toContain("bolt-shear-weak");
    expect(codes(goodRun(), "rodA")).not.toContain("bolt-shear-weak");
  });
  it("pushrod that buckles", () => {
    // 4130N 1.000 × 0.049 × 100 in: I = π/64 (1 − 0.902⁴) = 0.016594 in⁴; Euler = π² · 29e6 · 0.016594 / 100² = 475 lbf < 1,002 lbf ultimate
    const g = goodRun();
    const rod = g.nodes.find((n) => n.id === "rod")!;
    if (rod.kind === "pushrod") rod.props.length = 100;
    expect(codes(g, "rod")).toEqual(["pushrod-buckles"]);
    // 24 in: A = π/4 (1 − 0.8136) = 0.14639 in², r = √(0.016594/0.14639) = 0.3367 in, KL/r = 71.3 < C_c 87.4 → Johnson:
    // 0.14639 · 75,000 · (1 − 75,000 · 71.3² / (4π² · 29e6)) = 10,980 · 0.667 = 7,320 lbf > 1,002 lbf → no finding
    expect(codes(goodRun(), "rod")).toEqual([]);
    const base = analyze(valid(goodRun())).pushrods[0];
    expect(base.columnMode).toBe("johnson");
    expect(Math.abs(base.columnAllowable / 7320 - 1)).toBeLessThan(0.005);
  });
  it("pushrod too weak in tension", () => {
    // 4130N 0.200 × 0.010: A = π/4 (0.04 − 0.0324) = 0.005969 in²; × 95,000 psi (from memory) = 567 lbf < 1,002 lbf
    const g = goodRun();
    const rod = g.nodes.find((n) => n.id === "rod")!;
    if (rod.kind === "pushrod") Object.assign(rod.props, { outsideDiameter: 0.2, wall: 0.01 });
    expect(codes(g, "rod")).toContain("pushrod-tension-weak");
  });
});

describe("rule 4: no lock washers in a control run (AC 43.13-1B chapter 7, lock washers)", () => {
  it("a split or tooth lock washer recorded at a joint is a hazard; none recorded, or recorded as absent, is not", () => {
    const withWasher = (lockWasher?: boolean) => withHardware(goodRun(), "rodB", (h) => ({ ...h, ...(lockWasher === undefined ? {} : { lockWasher }) }));
    const f = analyze(valid(withWasher(true))).findings.find((x) => x.code === "lock-washer-in-run");
    expect(f).toMatchObject({ severity: "hazard", subject: { type: "joint", id: "rodB" } });
    expect(f!.message).toContain("remove it");
    for (const g of [withWasher(false), withWasher(undefined)]) expect(analyze(valid(g)).findings.map((x) => x.code)).not.toContain("lock-washer-in-run");
  });
});
