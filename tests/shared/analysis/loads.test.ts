/**
 * End-to-end elevator run, every load derived by hand here (domain.md §1–§3):
 *
 *   stick (grip 20 in, attach 5 in) → forward pushrod (4130N 0.750 × 0.035, 30 in)
 *   → bellcrank (in 3 in, out 4 in, arms at 90°) → aft pushrod (6061-T6 1.500 × 0.058, 72 in)
 *   → horn (2.5 in, link at 90°) → elevator.
 *
 * Design force at the grip: 167 lbf (14 CFR 23.397(b), pitch stick).
 * Forward pushrod:   F1 = 167 · 20 / 5 = 668 lbf limit (statics, from memory).
 * Stick pivot:       arms taken opposite (grip above, attach below the pivot): R = 167 + 668 = 835 lbf.
 * Aft pushrod:       F2 = 668 · 3 / 4 = 501 lbf limit.
 * Bellcrank pivot:   arms at 90°: R = √(668² + 501²) = √(446,224 + 251,001) = √697,225 = 835 lbf.
 * Elevator hinge moment: 501 · 2.5 · sin 90° = 1,252.5 in·lbf.
 * Hinge: carries the link force at the horn, 501 lbf.
 * Horn attachment, two bolts 1.5 in apart (bolt-group statics): each takes its share 501 / 2 = 250.5 lbf plus
 *   the couple of the hinge moment 6 · 1,252.5 / (1.5 · 2 · 3) = 835 lbf, in line: 1,085.5 lbf limit.
 * Stop 10 in from the stick's pivot: the stick's moment 668 · 5 = 3,340 in·lbf over 10 in = 334 lbf (14 CFR 23.675).
 *
 * Ultimate (14 CFR 23.303 ×1.5; 14 CFR 23.625 fitting factor ×1.15 on joints):
 *   forward pushrod 668 × 1.5 = 1,002 lbf; aft pushrod 501 × 1.5 = 751.5 lbf;
 *   rod ends on the forward pushrod 668 × 1.5 × 1.15 = 1,152.3 lbf; on the aft pushrod 501 × 1.725 = 864.225 lbf;
 *   stick pivot on a plain bushing: bolt and fittings 835 × 1.725 = 1,440.375 lbf; bearing at its holes with the
 *   highest special factor 3.33 (14 CFR 23.693, 23.619): 835 × 1.5 × 3.33 = 4,170.825 lbf;
 *   bellcrank pivot on a ball bearing: 835 × 1.725 = 1,440.375 lbf.
 *
 * Forward pushrod column: Di = 0.68; A = π/4 (0.5625 − 0.4624) = 0.078618 in²;
 *   I = π/64 (0.316406 − 0.213814) = 0.0050359 in⁴; r = √(I/A) = 0.25309 in; KL/r = 30/0.25309 = 118.5;
 *   C_c (4130N, E 29.0 Msi, Fty 75 ksi, from memory MIL-HDBK-5) = √(2π² · 29e6/75e3) = 87.4 → Euler:
 *   P = π² · 29e6 · 0.0050359 / 30² = 1,601.5 lbf; MS = 1,601.5/1,002 − 1 = +0.598.
 *   Tension: 95,000 × 0.078618 = 7,468.7 lbf; MS = 7,468.7/1,002 − 1 = +6.454.
 * Aft pushrod column (6061-T6, E 9.9 Msi, Fty 35 ksi, from memory MIL-HDBK-5): Di = 1.384;
 *   A = π/4 (2.25 − 1.915456) = 0.262750 in²; I = π/64 (5.0625 − 3.669028) = 0.068411 in⁴;
 *   r = √(0.068411/0.262750) = 0.51026 in; KL/r = 72/0.51026 = 141.1; C_c = √(2π² · 9.9e6/35e3) = 74.7 → Euler:
 *   P = π² · 9.9e6 · 0.068411 / 72² = 1,289.3 lbf; MS = 1,289.3/751.5 − 1 = +0.716.
 * Bolt, AN4 double shear (from memory: 75 ksi): 2 · 75,000 · π · 0.25²/4 = 7,363.1 lbf; at the forward rod ends
 *   MS = 7,363.1/1,152.3 − 1 = +5.390.
 */
import { describe, expect, it } from "vitest";
import { bellcrankPivotLoad } from "@/shared/linkage/kinds/bellcrank";
import { analyze } from "@/shared/analysis";
import { GOOD_HINGE_LOAD, bellcrank, goodBallPivot, goodClamp, goodRodEndJoint, graph, hardware, horn, j, mount, pushrod, stick, stop, surface, valid } from "./fixtures";

function elevatorRun() {
  return valid(graph(
    [stick("stick", 20, 5), mount("m-stick"), pushrod("fwd", "4130N", 0.75, 0.035, 30), bellcrank("bc", 3, 4, 90), mount("m-bc"),
      pushrod("aft", "6061-T6", 1.5, 0.058, 72), horn("horn", 2.5, 90), surface("elev"), mount("m-tail"), stop("stop", 10)],
    [
      j("stick-pivot", ["stick", "pivot"], ["m-stick", "mount"], hardware({
        bearing: "plainBushing", bolt: { size: "AN5", material: "steel", threadsProtruding: 2 }, nut: { type: "castellatedCotter", pattern: "shear", cotterPinNew: true },
        holes: { from: { material: "4130N", thickness: 0.25, edgeDistance: 0.625, bushing: "steel" }, to: { material: "4130N", thickness: 0.25, edgeDistance: 0.625, cheeks: 2 } },
      })),
      j("stick-fwd", ["stick", "attach"], ["fwd", "a"], goodRodEndJoint({}, { hand: "RH" })),
      j("fwd-bc", ["fwd", "b"], ["bc", "in"], goodRodEndJoint({}, { hand: "LH" })),
      j("bc-pivot", ["bc", "pivot"], ["m-bc", "mount"], goodBallPivot()),
      j("bc-aft", ["bc", "out"], ["aft", "a"], goodRodEndJoint({}, { hand: "RH" })),
      j("aft-horn", ["aft", "b"], ["horn", "attach"], goodRodEndJoint({}, { hand: "LH" })),
      j("horn-elev", ["horn", "surface"], ["elev", "horn"], goodClamp()),
      j("hinge", ["elev", "hinge"], ["m-tail", "mount"], goodBallPivot({ hingeLoad: GOOD_HINGE_LOAD })),
      j("stop", ["stop", "contact"], ["stick", "attach"], goodClamp()),
    ],
  ));
}

const rel = (actual: number, expected: number, tol = 1e-4) => expect(Math.abs(actual / expected - 1)).toBeLessThan(tol);

describe("end-to-end elevator run (hand-derived loads in the header)", () => {
  const r = analyze(elevatorRun());
  const pr = (id: string) => r.pushrods.find((p) => p.nodeId === id)!;
  const jr = (id: string) => r.joints.find((x) => x.jointId === id)!;

  it("has no findings: every joint card is complete and correct", () => {
    expect(r.findings).toEqual([]);
  });
  it("pushrod limit and ultimate axial loads", () => {
    rel(pr("fwd").limitAxial, 668); // 167 × 20/5
    rel(pr("fwd").ultimateAxial, 1002); // × 1.5 (14 CFR 23.303)
    rel(pr("aft").limitAxial, 501); // 668 × 3/4
    rel(pr("aft").ultimateAxial, 751.5);
  });
  it("joint radial loads, limit and ultimate with the special factors", () => {
    rel(jr("stick-fwd").radialLimit, 668);
    rel(jr("fwd-bc").radialLimit, 668);
    rel(jr("stick-fwd").radialUltimate, 1152.3); // × 1.5 × 1.15 (14 CFR 23.303, 23.625)
    rel(jr("bc-aft").radialLimit, 501);
    rel(jr("aft-horn").radialUltimate, 864.225);
    rel(jr("stick-pivot").radialLimit, 835); // 167 + 668
    rel(jr("stick-pivot").radialUltimate, 1440.375); // × 1.5 × 1.15 (14 CFR 23.303, 23.625): the bolt takes the fitting factor
    expect(jr("stick-pivot").specialFactor).toBe(3.33); // 14 CFR 23.693, only the highest: 23.619
    expect(jr("stick-pivot").factor.name).toMatch(/bearing factor/);
    rel(jr("stick-pivot").checks.find((c) => c.id === "bearingFrom")!.required!, 4170.825); // bearing at the hole: × 1.5 × 3.33
    rel(jr("bc-pivot").radialLimit, 835); // √(668² + 501²)
    rel(jr("bc-pivot").radialUltimate, 1440.375);
    rel(jr("horn-elev").radialLimit, 1085.5); // 501/2 + 6 · 1,252.5/(1.5 · 2 · 3), bolt-group statics
    rel(jr("stop").radialLimit, 334); // 668 · 5 / 10 (14 CFR 23.675)
    rel(jr("hinge").radialLimit, 501 + GOOD_HINGE_LOAD); // the horn's 501 lbf and the designer's hinge load, added in line
  });
  it("hinge moment at the elevator", () => {
    rel(r.surfaces[0].hingeMomentLimit, 1252.5); // 501 × 2.5
  });
  it("column and tension allowables and margins", () => {
    expect(pr("fwd").columnMode).toBe("euler");
    rel(pr("fwd").columnAllowable, 1601.5, 2e-4);
    rel(pr("fwd").marginCompression! + 1, 1.598, 3e-4);
    rel(pr("fwd").tensionAllowable, 7468.7, 2e-4);
    rel(pr("fwd").marginTension! + 1, 7.454, 3e-4);
    expect(pr("aft").columnMode).toBe("euler");
    rel(pr("aft").columnAllowable, 1289.3, 3e-4);
    rel(pr("aft").marginCompression! + 1, 1.716, 5e-4);
  });
  it("rod-end and bolt margins", () => {
    rel(jr("stick-fwd").rodEndMargin! + 1, 5000 / 1152.3); // rating 5,000 lbf (fixture part)
    rel(jr("stick-fwd").boltShearAllowable!, 7363.1, 2e-5);
    rel(jr("stick-fwd").boltMargin! + 1, 6.39, 2e-4);
  });
  it("summary names the lowest margin: the forward pushrod in compression", () => {
    expect(r.summary).toMatchObject({ hazard: 0, caution: 0, advisory: 0 });
    expect(r.summary.lowestMargin?.subject).toEqual({ type: "node", id: "fwd" });
    rel(r.summary.lowestMargin!.value + 1, 1.598, 3e-4);
  });
});

describe("factors and settings", () => {
  it("dual controls with one stick keep the single-pilot full-force case", () => {
    const r = analyze(elevatorRun(), { dualControls: true });
    // 75 % each (14 CFR 23.399) would give 501 lbf; the single pilot's full 668 lbf is always checked too.
    rel(r.pushrods.find((p) => p.nodeId === "fwd")!.limitAxial, 668);
    expect(r.designCase.singlePilotChecked).toBe(true);
  });
  it("the bearing factor on rod ends raises their required ultimate to × 3.33", () => {
    const r = analyze(elevatorRun(), { bearingFactorOnRodEnds: true });
    rel(r.joints.find((x) => x.jointId === "stick-fwd")!.radialUltimate, 668 * 1.5 * 3.33); // 14 CFR 23.693
  });
  it("a stick's own design force overrides the setting", () => {
    const g = elevatorRun();
    (g.nodes[0].props as { designForce?: number }).designForce = 100; // 14 CFR 23.397(b): pitch stick minimum 100 lbf
    rel(analyze(g).pushrods.find((p) => p.nodeId === "fwd")!.limitAxial, 400); // 100 × 20/5
  });
  it("a roll linkage uses the roll stick force", () => {
    const g = elevatorRun();
    g.system = "roll";
    rel(analyze(g).pushrods.find((p) => p.nodeId === "fwd")!.limitAxial, 67 * 4); // 14 CFR 23.397(b): roll stick 67 lbf × 20/5
  });
  it("invalid settings fall back to the defaults with a finding", () => {
    const r = analyze(elevatorRun(), { ultimateFactor: 0.5 });
    expect(r.settings.ultimateFactor).toBe(1.5); // 14 CFR 23.303
    expect(r.findings.map((f) => f.code)).toContain("settings-invalid");
  });
  it("a horn at 30° to its link puts in half the moment", () => {
    const g = elevatorRun();
    (g.nodes[6].props as { linkAngle: number }).linkAngle = 30;
    rel(analyze(g).surfaces[0].hingeMomentLimit, 501 * 2.5 * 0.5, 1e-9); // effective arm L · sin 30° (statics)
  });
  it("a force arriving at a bellcrank's out port leaves through in with the ratio reversed", () => {
    const g = elevatorRun();
    for (const jt of g.joints) {
      if (jt.id === "fwd-bc") jt.to.port = "out";
      if (jt.id === "bc-aft") jt.from.port = "in";
    }
    rel(analyze(valid(g)).pushrods.find((p) => p.nodeId === "aft")!.limitAxial, 668 * 4 / 3); // out arm 4 → in arm 3
  });
});

describe("bellcrank pivot resultant (statics, from memory: |R|² = Fi² + Fo² − 2·Fi·Fo·cos α)", () => {
  it("gives the vector sum at 90° and 180°, and the difference with the arms folded", () => {
    expect(bellcrankPivotLoad(300, 400, 90)).toBeCloseTo(500, 9); // 3-4-5
    expect(bellcrankPivotLoad(300, 400, 180)).toBeCloseTo(700, 9); // arms opposite: the loads add
    expect(bellcrankPivotLoad(300, 400, 0)).toBeCloseTo(100, 9); // arms together: they subtract
  });
  it("scales exactly with the force where the arms are folded and the loads equal (no cancellation noise)", () => {
    const f = 200 * (0.05 / 0.05000000000000001);
    for (const k of [0.78, 3.1, 9.7]) {
      const r = bellcrankPivotLoad(200, f, 0), rk = bellcrankPivotLoad(200 * k, f * k, 0);
      expect(Math.abs(rk - k * r)).toBeLessThan(1e-12);
    }
  });
});
