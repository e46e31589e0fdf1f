/**
 * Cable systems and wheels (domain.md §1, §6): loads worked by hand, the closed circuit, and each rule tripped
 * and not tripped with its source. The base circuit (cable-fixtures.ts) has no findings at all.
 */
import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { goodBallPivot, goodClamp, graph, horn, j, mount, pushrod, stick, surface, valid } from "./fixtures";
import { cable, RIGGED, rudderCircuit, wheelRun, withProps } from "./cable-fixtures";

const run = (g: LinkageGraph, s?: Parameters<typeof analyze>[1]) => analyze(valid(g), s);
const codes = (g: LinkageGraph) => run(g).findings.map((f) => `${f.code}@${f.subject.id}`);
const has = (g: LinkageGraph, code: string) => codes(g).some((c) => c.startsWith(`${code}@`));

it("the base rudder circuit has no findings", () => expect(codes(rudderCircuit())).toEqual([]));

describe("loads through a pedal, a pulley and a turnbuckle, worked by hand", () => {
  it("carries the pedal force to the cables, the pulley, the horn and the joints", () => {
    const r = run(rudderCircuit());
    // Pedal force 200 lbf (14 CFR 23.397(b), yaw pedal) at a 9 in pedal arm, cable on a 3 in arm:
    // F = 200 × 9 / 3 = 600 lbf. Rigging tension P = 30 lbf: T = max(600, 30 + 600/2 = 330) = 600 lbf
    // (preloaded circuit, from memory: statics). Ultimate 600 × 1.5 (14 CFR 23.303) × 2.0 (14 CFR 23.693) = 1,800 lbf.
    // 1/8 in 7×19 carbon: 2,000 lbf (AC 43.13-1B table 7-3) × 100 % swaged → MS = 2,000/1,800 − 1 = 0.111.
    const cl = r.cables.find((c) => c.nodeId === "cableL")!;
    expect(cl.limitTension).toBeCloseTo(600, 9);
    expect(cl.ultimateRequired).toBeCloseTo(1800, 9);
    expect(cl.breakingStrength).toBe(2000);
    expect(cl.margin).toBeCloseTo(2000 / 1800 - 1, 9);
    expect(cl.inCircuit).toBe(true);
    expect(cl.pretension).toBe(30);
    const joint = (id: string) => r.joints.find((x) => x.jointId === id)!;
    // Pulley: the cable turns 30° over it: R = 2 × 600 × sin(15°) = 310.58 lbf (statics), on its axle too.
    expect(joint("overP").radialLimit).toBeCloseTo(2 * 600 * Math.sin((15 * Math.PI) / 180), 9);
    expect(joint("pulleyAxle").radialLimit).toBeCloseTo(310.583, 3);
    // Fairlead, 2°: 2 × 600 × sin(1°) = 20.94 lbf.
    expect(joint("fairMount").radialLimit).toBeCloseTo(20.943, 3);
    // The turnbuckle and its joints carry the cable's tension; the cable-system factor 2.0 is the highest there.
    expect(joint("hornL").radialLimit).toBeCloseTo(600, 9);
    expect(joint("hornL").specialFactor).toBe(2.0); // 14 CFR 23.693
    expect(joint("hornMount").specialFactor).toBe(1.15); // 14 CFR 23.625, not a cable joint
    // Rudder hinge moment: 600 lbf on a 3 in horn = 1,800 in·lbf. Pedal pivot: 200 + 600 = 800 lbf (arms opposite).
    expect(r.surfaces[0].hingeMomentLimit).toBeCloseTo(1800, 9);
    expect(joint("pivL").radialLimit).toBeCloseTo(800, 9);
  });

  it("takes the rigging tension plus half the force when that is larger", () => {
    // Pedal force 40 lbf on equal arms: F = 40. P = 30: T = max(40, 30 + 20) = 50 lbf. P = 10: T = max(40, 30) = 40.
    const light = withProps(withProps(rudderCircuit(), "pedalL", { designForce: 40, cableArm: 9 }), "pedalR", { designForce: 40, cableArm: 9 });
    expect(run(light).cables.find((c) => c.nodeId === "cableL")!.limitTension).toBeCloseTo(50, 9);
    const slack = withProps(light, "cableL", { riggingTension: 10 });
    expect(run(slack).cables.find((c) => c.nodeId === "cableL")!.limitTension).toBeCloseTo(40, 9);
  });
});

/** Stick → pushrod → cable sector → two cables → elevator horn: the two cables run between the same two parts. */
function sectorCircuit(extraPushrod = false): LinkageGraph {
  const g = graph(
    [stick("stick", 20, 5), mount("m"), pushrod("rod", "4130N", 0.75, 0.035, 20),
      { id: "sector", kind: "cableSector", label: "Sector", position: { x: 0, y: 0 }, props: { inputArm: 5, sectorRadius: 5 } },
      cable("up", RIGGED), cable("down"), horn("horn", 3), surface("elev")],
    [
      j("sp", ["stick", "pivot"], ["m", "mount"], goodBallPivot()),
      j("s1", ["stick", "attach"], ["rod", "a"], goodClamp()),
      j("s2", ["rod", "b"], ["sector", "in"], goodClamp()),
      j("secp", ["sector", "pivot"], ["m", "mount"], goodBallPivot()),
      j("u1", ["sector", "out"], ["up", "a"], goodClamp()),
      j("d1", ["sector", "out"], ["down", "a"], goodClamp()),
      j("u2", ["up", "b"], ["horn", "attach"], goodClamp()),
      j("d2", ["down", "b"], ["horn", "attach"], goodClamp()),
      j("hm", ["horn", "surface"], ["elev", "horn"], goodClamp()),
      j("hinge", ["elev", "hinge"], ["m", "mount"], goodBallPivot()),
    ],
  );
  if (extraPushrod) {
    g.nodes.push(pushrod("rod2", "4130N", 0.75, 0.035, 20));
    g.joints.push(j("x1", ["sector", "out"], ["rod2", "a"], goodClamp()), j("x2", ["rod2", "b"], ["horn", "attach"], goodClamp()));
  }
  return g;
}

describe("a closed circuit is one thing, not a loop", () => {
  it("two cables between a sector and a horn: no loop, each cable pulls one way", () => {
    const c = codes(sectorCircuit());
    expect(c.filter((x) => x.startsWith("linkage-loop"))).toEqual([]);
    expect(c.filter((x) => x.startsWith("cable-pushes"))).toEqual([]);
    const r = run(sectorCircuit());
    // Stick 167 lbf (14 CFR 23.397(b)) × 20/5 = 668 lbf in the pushrod; sector 5/5 → 668 lbf; T = max(668, 30 + 334) = 668.
    expect(r.cables.find((x) => x.nodeId === "up")!.limitTension).toBeCloseTo(668, 9);
    expect(r.cables.every((x) => x.inCircuit)).toBe(true);
  });
  it("the pedals' two cables to one horn are a circuit too, and not a loop", () => {
    expect(codes(rudderCircuit()).filter((x) => x.startsWith("linkage-loop"))).toEqual([]);
    expect(run(rudderCircuit()).cables.every((x) => x.inCircuit)).toBe(true);
  });
  it("a pushrod beside the cables between the same parts does close a loop", () => {
    expect(has(sectorCircuit(true), "linkage-loop")).toBe(true);
  });
});

describe("a cable drawn to push (tension only)", () => {
  const lone = () => {
    const g = rudderCircuit();
    const drop = new Set(["cableR", "tbR", "fairlead"]);
    g.nodes = g.nodes.filter((n) => !drop.has(n.id));
    g.joints = g.joints.filter((x) => !["pedR", "thruF", "fairMount", "tbRa", "hornR"].includes(x.id));
    return g;
  };
  it("trips for a cable with no return", () => expect(codes(lone())).toContain("cable-pushes@cableL"));
  it("does not trip in a closed circuit", () => expect(has(rudderCircuit(), "cable-pushes")).toBe(false));
  it("never gives a cable a column check", () => expect(Object.keys(run(lone()).cables[0])).not.toContain("columnAllowable"));
});

describe("cable size in a primary system (14 CFR 23.689(a)(1))", () => {
  const small = () => withProps(rudderCircuit(), "cableR", { size: "3/32" });
  it("trips for 3/32 in in the rudder", () => expect(codes(small())).toContain("cable-too-small@cableR"));
  it("does not trip for 1/8 in", () => expect(has(rudderCircuit(), "cable-too-small")).toBe(false));
  it("does not trip in a trim system", () => expect(has({ ...small(), system: "trim" }, "cable-too-small")).toBe(false));
  it("in a trim system a cable under 1/8 in is an advisory: only where the airplane is safely controllable with the tab at its worst (23.689(f))", () => {
    const f = run({ ...small(), system: "trim" }).findings.find((x) => x.code === "trim-cable-small")!;
    expect(f.severity).toBe("advisory");
    expect(f.message).toMatch(/safely controllable with the tab in its most adverse position/);
    expect(f.source).toMatchObject({ kind: "published", text: expect.stringMatching(/^14 CFR 23\.689\(f\)/) }); // the tab exception, not (a)(1)
    expect(has({ ...rudderCircuit(), system: "trim" }, "trim-cable-small")).toBe(false); // 1/8 in
    expect(has(small(), "trim-cable-small")).toBe(false); // the rudder: the hazard above instead
  });
});

describe("cable strength × terminal efficiency against limit × 1.5 × 2.0", () => {
  it("trips with thimble-and-bushing terminals: 2,000 × 80 % = 1,600 < 1,800 lbf", () => {
    const g = withProps(rudderCircuit(), "cableL", { terminalB: "thimble" }); // from memory: 80 %
    expect(codes(g)).toContain("cable-strength-weak@cableL");
    expect(run(g).cables[0].allowable).toBeCloseTo(1600, 9);
    // The words say the 2.0 is the check's own choice on the cable: 14 CFR 23.693 sets it for the joints.
    expect(run(g).findings.find((x) => x.code === "cable-strength-weak")!.message).toContain("which 14 CFR 23.693 sets for the joints and this check puts on the cable as well");
  });
  it("advises a larger cable or stronger terminals, and arm changes only as the designer allows (they set gearing and travel)", () => {
    const msg = run(withProps(rudderCircuit(), "cableL", { terminalB: "thimble" })).findings.find((x) => x.code === "cable-strength-weak")!.message;
    expect(msg).toContain("Use a larger cable or stronger terminals");
    expect(msg).toContain("only as the designer allows");
    expect(msg).not.toContain("longer arm");
    // The facts stay: required ultimate, limit tension, strength × terminal efficiency, allowable, margin.
    expect(msg).toMatch(/1,800 lbf ultimate \(600 lbf limit tension.*2,000 lbf × 80 % for the .* is 1,600 lbf — margin −0\.11/);
  });
  it("trips in stainless: 1,760 lbf (AC 43.13-1B table 7-3, comp B) < 1,800", () => {
    expect(codes(withProps(rudderCircuit(), "cableL", { material: "stainless" }))).toContain("cable-strength-weak@cableL");
  });
  it("does not trip in 5/32 in stainless: 2,400 lbf (table 7-3)", () => {
    expect(has(withProps(rudderCircuit(), "cableL", { material: "stainless", size: "5/32" }), "cable-strength-weak")).toBe(false);
  });
  it("a cable no input drives is not checked: no margin (never the capped margin of a zero load) and no lowest margin", () => {
    // The right cable with its pedal and turnbuckle joints removed: it hangs in its fairlead only, no force reaches it.
    const g = rudderCircuit();
    g.joints = g.joints.filter((x) => x.id !== "pedR" && x.id !== "tbRa");
    const r = run(g);
    const cr = r.cables.find((c) => c.nodeId === "cableR")!;
    expect(cr.driven).toBe(false);
    expect(cr.limitTension).toBe(0);
    expect(cr.margin).toBeNull();
    expect(r.summary.lowestMargin?.subject.id).not.toBe("cableR");
  });
  it("a driven cable in the same run keeps its computed margin", () => {
    const g = rudderCircuit();
    g.joints = g.joints.filter((x) => x.id !== "pedR" && x.id !== "tbRa");
    const cl = run(g).cables.find((c) => c.nodeId === "cableL")!;
    expect(cl.driven).toBe(true);
    expect(cl.margin).toBeCloseTo(2000 / 1800 - 1, 9); // 2,000 lbf (AC 43.13-1B table 7-3) / (600 × 1.5 × 2.0) − 1
  });
  it("is not checked (never a margin) in a circuit with no rigging tension recorded", () => {
    const g = withProps(rudderCircuit(), "cableL", { riggingTension: undefined });
    expect(codes(g)).toContain("cable-strength-unchecked@cableL");
    expect(run(g).cables[0].margin).toBeNull();
  });
});

describe("fairlead turn (14 CFR 23.689(c))", () => {
  it("trips at 4°", () => expect(codes(withProps(rudderCircuit(), "fairlead", { turnAngle: 4 }))).toContain("fairlead-turn@fairlead"));
  it("does not trip at 3°", () => expect(has(withProps(rudderCircuit(), "fairlead", { turnAngle: 3 }), "fairlead-turn")).toBe(false));
  it("asks for the angle when it is not recorded", () => expect(codes(withProps(rudderCircuit(), "fairlead", { turnAngle: undefined }))).toContain("fairlead-turn-unrecorded@fairlead"));
});

describe("pulleys: groove and guards (14 CFR 23.689(b)), diameter, rating", () => {
  it("trips for a groove made for another cable", () => expect(codes(withProps(rudderCircuit(), "pulley", { grooveFor: "3/16" }))).toContain("pulley-groove-mismatch@pulley"));
  it("trips with the guards missing, and with a guard gap as wide as the cable", () => {
    expect(codes(withProps(rudderCircuit(), "pulley", { guards: "missing" }))).toContain("pulley-guards-missing@pulley");
    expect(codes(withProps(rudderCircuit(), "pulley", { guardGap: 0.125 }))).toContain("pulley-guard-gap@pulley");
  });
  it("does not trip with the right groove and close guards", () => {
    const c = codes(rudderCircuit());
    expect(c.filter((x) => x.startsWith("pulley-"))).toEqual([]);
  });
  // from memory: 20 × d for 7×19, so 2.5 in for 1/8 in cable.
  it("trips below 20 × the cable diameter (2.4 in for 1/8 in 7×19)", () => expect(codes(withProps(rudderCircuit(), "pulley", { diameter: 2.4 }))).toContain("pulley-too-small@pulley"));
  it("does not trip at 2.5 in", () => expect(has(withProps(rudderCircuit(), "pulley", { diameter: 2.5 }), "pulley-too-small")).toBe(false));
  it("trips for 1×19 nonflexible strand over a pulley (MIL-DTL-87161 1.1)", () => expect(codes(withProps(rudderCircuit(), "cableL", { construction: "1x19" }))).toContain("nonflexible-over-pulley@pulley"));
  it("trips when the resultant × 1.5 × 2.0 exceeds the rating: 310.6 × 3 = 931.7 > 900 lbf", () => {
    expect(codes(withProps(rudderCircuit(), "pulley", { ratedLoad: 900 }))).toContain("pulley-overloaded@pulley");
    expect(has(withProps(rudderCircuit(), "pulley", { ratedLoad: 940 }), "pulley-overloaded")).toBe(false);
  });
});

describe("turnbuckles: threads showing, safetied, cannot bind (AC 43.13-1B 7-166, 7-179; 14 CFR 23.689(e))", () => {
  it("trips with 4 threads showing, not with 3", () => {
    expect(codes(withProps(rudderCircuit(), "tbL", { threadsShowingB: 4 }))).toContain("turnbuckle-threads-showing@tbL");
    expect(has(withProps(rudderCircuit(), "tbL", { threadsShowingB: 3 }), "turnbuckle-threads-showing")).toBe(false);
  });
  it("trips when not safetied, not when safety-wired", () => {
    expect(codes(withProps(rudderCircuit(), "tbL", { locking: "none" }))).toContain("turnbuckle-not-safetied@tbL");
    expect(has(withProps(rudderCircuit(), "tbL", { locking: "wire" }), "turnbuckle-not-safetied")).toBe(false);
    expect(codes(withProps(rudderCircuit(), "tbL", { locking: undefined }))).toContain("turnbuckle-locking-unrecorded@tbL");
  });
  it("trips when it binds, and asks for the check when it joins a moving part unrecorded", () => {
    expect(codes(withProps(rudderCircuit(), "tbL", { travelCheck: "binds" }))).toContain("turnbuckle-binds@tbL");
    expect(codes(withProps(rudderCircuit(), "tbL", { travelCheck: undefined }))).toContain("turnbuckle-binding-unchecked@tbL");
    expect(has(rudderCircuit(), "turnbuckle-bind")).toBe(false);
  });
  it("trips when made for a smaller cable than the one it joins", () => {
    expect(codes(withProps(rudderCircuit(), "tbL", { size: "3/32" }))).toContain("turnbuckle-undersized@tbL");
  });
});

describe("rigging tension within the designer's range, with its temperature", () => {
  it("trips low (20 < 25 lbf) and high (40 > 35 lbf)", () => {
    expect(codes(withProps(rudderCircuit(), "cableL", { riggingTension: 20 }))).toContain("rigging-tension-low@cableL");
    expect(codes(withProps(rudderCircuit(), "cableL", { riggingTension: 40 }))).toContain("rigging-tension-high@cableL");
  });
  it("asks for the temperature, the range and the measurement when they are missing", () => {
    expect(codes(withProps(rudderCircuit(), "cableL", { riggingTemperature: undefined }))).toContain("rigging-temperature-missing@cableL");
    expect(codes(withProps(rudderCircuit(), "cableL", { tensionMin: undefined, tensionMax: undefined }))).toContain("rigging-range-missing@cableL");
    expect(codes(withProps(rudderCircuit(), "cableL", { riggingTension: undefined }))).toContain("rigging-tension-missing@cableL");
  });
  it("points to the designer's chart when measured far from the range's temperature", () => {
    expect(codes(withProps(rudderCircuit(), "cableL", { riggingTemperature: 40 }))).toContain("rigging-temperature-differs@cableL");
    expect(has(withProps(rudderCircuit(), "cableL", { riggingTemperature: 75 }), "rigging-temperature-differs")).toBe(false);
  });
});

describe("control wheel (14 CFR 23.397(b))", () => {
  it("puts in the roll couple 50 × D: 600 in·lbf on a 12 in wheel, 400 lbf on a 1.5 in drum", () => {
    const r = run(wheelRun());
    // 50 × 12 = 600 in·lbf; 600 / 1.5 = 400 lbf; T = max(400, 30 + 200) = 400; horn 400 × 3 = 1,200 in·lbf.
    expect(r.cables.find((c) => c.nodeId === "l")!.limitTension).toBeCloseTo(400, 9);
    expect(r.surfaces[0].hingeMomentLimit).toBeCloseTo(1200, 9);
    expect(r.findings.filter((f) => f.code.startsWith("wheel-"))).toEqual([]);
  });
  it("trips when the roll couple used is below 40 × D (470 < 480 in·lbf), not at 480", () => {
    expect(codes(wheelRun({ designCouple: 470 }))).toContain("wheel-couple-below-minimum@wheel");
    expect(has(wheelRun({ designCouple: 480 }), "wheel-couple-below-minimum")).toBe(false);
    expect(run(wheelRun({ designCouple: 480 })).cables[0].limitTension).toBeCloseTo(320, 9); // 480 / 1.5
  });
  it("pitch: 200 lbf at the wheel through a 20 in column and a 5 in arm is 800 lbf; below 100 lbf trips", () => {
    const pitch = { ...wheelRun({ axis: "pitch", attachArm: 5 }), system: "pitch" as const };
    expect(run(pitch).cables[0].limitTension).toBeCloseTo(800, 9); // 200 × 20 / 5
    expect(codes(withProps(pitch, "wheel", { designForce: 90 }))).toContain("wheel-force-below-minimum@wheel");
    expect(has(withProps(pitch, "wheel", { designForce: 100 }), "wheel-force-below-minimum")).toBe(false);
  });
});

/** The "not checked" and drawing findings: each asked for when its input is missing, and absent from the base circuit. */
describe("what a cable run needs recorded or joined before it can be checked", () => {
  const without = (g: LinkageGraph, ids: string[]) => ({ ...g, joints: g.joints.filter((x) => !ids.includes(x.id)) });
  it("a cable or turnbuckle with one end joined and the other open", () => {
    const c = codes(without(rudderCircuit(), ["tbLa"]));
    expect(c).toContain("cable-end-open@cableL");
    expect(c).toContain("cable-end-open@tbL");
    expect(has(rudderCircuit(), "cable-end-open")).toBe(false);
  });
  it("a cable with no tabled breaking strength (1/4 in 7×7 is in neither table) is not checked, never passed", () => {
    const g = withProps(rudderCircuit(), "cableR", { size: "1/4", construction: "7x7" });
    expect(codes(g)).toContain("cable-strength-unknown@cableR");
    const r = run(g).cables.find((x) => x.nodeId === "cableR")!;
    expect([r.breakingStrength, r.margin]).toEqual([null, null]);
    expect(has(rudderCircuit(), "cable-strength-unknown")).toBe(false);
  });
  it("a pulley not joined to structure, and one joined to a cable's end instead of its run", () => {
    expect(codes(without(rudderCircuit(), ["pulleyAxle"]))).toContain("guide-unmounted@pulley");
    const onEnd = rudderCircuit();
    onEnd.joints = onEnd.joints.map((x) => (x.id === "overP" ? { ...x, from: { node: "cableL", port: "b" } } : x));
    expect(codes(onEnd)).toContain("guide-on-cable-end@pulley");
    expect(codes(rudderCircuit()).filter((x) => x.startsWith("guide-"))).toEqual([]);
  });
  it("a pulley's groove, guards and rating asked for when not recorded (14 CFR 23.689(b))", () => {
    expect(codes(withProps(rudderCircuit(), "pulley", { grooveFor: undefined }))).toContain("pulley-groove-unrecorded@pulley");
    expect(codes(withProps(rudderCircuit(), "pulley", { guards: undefined }))).toContain("pulley-guards-unrecorded@pulley");
    const unrated = run(withProps(rudderCircuit(), "pulley", { ratedLoad: undefined })).findings.find((f) => f.code === "pulley-rating-missing")!;
    expect(unrated.severity).toBe("caution"); // as rod-end-rating-missing and bearing-rating-missing: a load not checked
    expect(has(rudderCircuit(), "pulley-rating-missing")).toBe(false); // rated 1,200 lbf in the base circuit
    // The 310.6 lbf resultant of the hand-worked case above, limit.
    expect(unrated.numbers[0].value).toBeCloseTo(2 * 600 * Math.sin((15 * Math.PI) / 180), 6);
  });
  it("a turnbuckle's threads asked for when either end is not recorded (AC 43.13-1B 7-166)", () => {
    expect(codes(withProps(rudderCircuit(), "tbR", { threadsShowingA: undefined }))).toContain("turnbuckle-threads-unrecorded@tbR");
    expect(has(rudderCircuit(), "turnbuckle-threads-unrecorded")).toBe(false);
  });
});

describe("a cable's terminal asks for no rod end", () => {
  const terminals = ["pedL", "hornL"];
  const bare = (over: Record<string, unknown>) => {
    const g = rudderCircuit();
    for (const x of g.joints) if (terminals.includes(x.id)) x.hardware = { fit: "clamped", shear: "double", torqueStripe: false, photos: [], note: "", ...over } as typeof x.hardware;
    return g;
  };
  const about = (g: LinkageGraph) => {
    const r = run(g);
    return [...r.findings.filter((f) => terminals.includes(f.subject.id)).map((f) => f.message), ...r.joints.filter((x) => terminals.includes(x.jointId)).flatMap((x) => x.todo ?? [])].join("\n");
  };
  it("with nothing recorded: the card is asked for the bolt or clevis pin and nut, not a rod end", () => {
    const text = about(bare({}));
    expect(text).toContain("no bolt or clevis pin and nut holding the terminal");
    expect(text).not.toMatch(/rod end|jam nut|witness/i);
    // A pushrod's end still names the rod end (the same finding elsewhere).
    const rod = graph([stick("s", 20, 5), mount("m"), pushrod("p", "4130N", 0.75, 0.035, 20)], [j("x", ["s", "attach"], ["p", "a"], { fit: "clamped", shear: "double", torqueStripe: false, photos: [], note: "" })]);
    expect(run(rod).findings.find((f) => f.code === "joint-hardware-missing")!.message).toContain("rod end");
  });
  it("with a bolt and nut but no holes recorded: the to-do names the holes, never a rod end", () => {
    const text = about(bare({ bolt: { size: "AN3", material: "steel", grip: 0.5, stack: 0.5, threadsProtruding: 2 }, nut: { type: "castellatedCotter", pattern: "shear", cotterPinNew: true } }));
    expect(text).not.toMatch(/rod end|jam nut|witness/i);
  });
});

describe("a cable's bolted terminal needs its bolt; where a cable runs over a pulley, through a fairlead or screws into a turnbuckle, none", () => {
  const noBolt = (id: string) => { const g = rudderCircuit(); return { ...g, joints: g.joints.map((x) => (x.id === id ? { ...x, hardware: { ...x.hardware, bolt: undefined } } : x)) }; };
  it("a terminal on a pedal with no bolt recorded lists its fastener as not checked", () => {
    expect(codes(noBolt("pedL"))).toContain("fastener-not-recorded@pedL");
  });
  it("the pass-through and screwed joints of the base circuit are not asked for a bolt", () => {
    const c = codes(rudderCircuit());
    for (const id of ["overP", "thruF", "tbLa", "tbRa"]) expect(c).not.toContain(`fastener-not-recorded@${id}`);
  });
});
