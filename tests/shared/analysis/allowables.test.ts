import { describe, expect, it } from "vitest";
import { analyze, columnAllowable, eulerLoad, johnsonLoad, marginOfSafety, transitionSlenderness, tubeSection, MARGIN_CAP } from "@/shared/analysis";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { goodRun, valid } from "./fixtures";
import { fromSI, toSI } from "@/shared/units";

describe("Euler column: the textbook case (domain.md §3)", () => {
  // Published inputs of a textbook exercise: tube Do 20 mm, Di 14 mm, L 1,500 mm, E 207 GPa, pinned ends.
  // Answer computed: I = π(0.020⁴ − 0.014⁴)/64 = π(1.6e-7 − 3.8416e-8)/64 = 5.9685e-9 m⁴;
  // P = π² · 207e9 · 5.9685e-9 / 1.5² = 5,419 N.
  const Do = 0.02, Di = 0.014, L = 1.5, E = 207e9; // m, m, m, Pa — textbook exercise inputs
  const wall = (Do - Di) / 2;

  it("computes 5,419 N in SI through the engine's formula", () => {
    const sec = tubeSection(Do, wall);
    expect(sec.insideDiameter).toBeCloseTo(Di, 12);
    expect(sec.inertia).toBeCloseTo(5.9685e-9, 12);
    expect(eulerLoad(E, sec.inertia, L)).toBeCloseTo(5419, -1); // answer computed from the textbook inputs: 5,419 N
    expect(Math.abs(eulerLoad(E, sec.inertia, L) / 5419 - 1)).toBeLessThan(0.001);
  });
  it("columnAllowable picks Euler for it (KL/r 246 ≥ C_c 128 with Fty 250 MPa)", () => {
    // r = √(I/A) = √(5.9685e-9 / 1.6022e-4) = 6.103 mm; KL/r = 1500/6.103 = 245.8;
    // Fty 250 MPa is an assumed mild-steel yield (common practice, no source): C_c = √(2π²·207e9/250e6) = 127.8.
    const sec = tubeSection(Do, wall);
    const r = columnAllowable({ area: sec.area, inertia: sec.inertia, length: L, e: E, fty: 250e6 });
    expect(r.mode).toBe("euler");
    expect(r.slenderness).toBeCloseTo(245.8, 0);
    expect(r.transition).toBeCloseTo(127.8, 0);
    expect(r.load).toBeCloseTo(5419, -1);
  });
  it("gives the same load when the case is converted to US units first", () => {
    const sec = tubeSection(fromSI(Do * 1000, "length"), fromSI(wall * 1000, "length"));
    const pLbf = eulerLoad(fromSI(E / 1e6, "stress"), sec.inertia, fromSI(L * 1000, "length"));
    expect(toSI(pLbf, "force")).toBeCloseTo(5419, -1); // 5,419 N, as above
  });
});

describe("Johnson column: a short 4130N tube (computed by hand)", () => {
  // 4130N: Fty 75,000 psi, E 29.0e6 psi (from memory: MIL-HDBK-5 values). Tube 1.000 × 0.065 in, L 12 in, K = 1.
  // Di = 0.870; A = π/4 (1 − 0.7569) = 0.19093 in²; I = π/64 (1 − 0.57290) = 0.020966 in⁴;
  // r = √(0.020966/0.19093) = 0.33137 in; KL/r = 12/0.33137 = 36.21;
  // C_c = √(2π² · 29e6 / 75e3) = 87.36 > 36.21 → Johnson;
  // P = A·Fty·[1 − Fty(KL/r)²/(4π²E)] = 0.19093 · 75,000 · [1 − 75,000 · 1311.3 / (4π² · 29e6)]
  //   = 14,320 · [1 − 0.08591] = 13,090 lbf.
  it("is Johnson and holds about 13,090 lbf", () => {
    const sec = tubeSection(1, 0.065);
    expect(sec.area).toBeCloseTo(0.19093, 4);
    expect(sec.inertia).toBeCloseTo(0.020966, 5);
    const r = columnAllowable({ area: sec.area, inertia: sec.inertia, length: 12, e: 29.0e6, fty: 75_000 });
    expect(r.mode).toBe("johnson");
    expect(r.slenderness).toBeCloseTo(36.21, 1);
    expect(Math.abs(r.load / 13090 - 1)).toBeLessThan(0.002);
  });
  it("meets Euler at the transition slenderness (the two curves are tangent there)", () => {
    // At KL/r = C_c: Johnson = A·Fty·(1 − 1/2) = A·Fty/2, and Euler = π²E·A/C_c² = A·Fty/2.
    const A = 0.2, E = 29.0e6, Fty = 75_000; // from memory: 4130N E and Fty
    const cc = transitionSlenderness(E, Fty);
    expect(johnsonLoad(A, Fty, E, cc)).toBeCloseTo((A * Fty) / 2, 6);
    const r = cc / Math.sqrt(2); // any r: pick I = A r²
    expect(eulerLoad(E, A * r * r, cc * r)).toBeCloseTo((A * Fty) / 2, 6);
  });
});

describe("margin of safety", () => {
  it("is allowable / required − 1", () => {
    expect(marginOfSafety(1500, 1000)).toBeCloseTo(0.5, 12); // 1500/1000 − 1 (domain.md §3 definition)
    expect(marginOfSafety(800, 1000)).toBeCloseTo(-0.2, 12);
  });
  it("caps an unloaded part's margin instead of returning Infinity", () => {
    expect(marginOfSafety(1000, 0)).toBe(MARGIN_CAP);
    expect(Number.isFinite(marginOfSafety(1e30, 1e-30))).toBe(true);
  });
});

describe("pushrod-wall-too-thick: a wall of half the diameter or more leaves no bore", () => {
  const withWall = (wall: number): LinkageGraph => {
    const g = goodRun();
    const rod = g.nodes.find((n) => n.id === "rod")!;
    rod.props = { ...rod.props, wall } as never;
    return g;
  };
  const codes = (g: LinkageGraph) => analyze(valid(g)).findings.map((f) => `${f.code}@${f.subject.id}`);
  it("trips for a 0.5 in wall on the fixture's 1 in tube, and the check takes it as a solid rod", () => {
    expect(codes(withWall(0.5))).toContain("pushrod-wall-too-thick@rod");
    expect(tubeSection(1, 0.5)).toMatchObject({ solid: true, insideDiameter: 0 });
  });
  it("does not trip for the fixture's 0.049 in wall, nor for 0.499 in (a bore of 0.002 in is left)", () => {
    expect(codes(goodRun()).filter((c) => c.startsWith("pushrod-wall-too-thick"))).toEqual([]);
    expect(codes(withWall(0.499)).filter((c) => c.startsWith("pushrod-wall-too-thick"))).toEqual([]);
  });
});
