import { describe, expect, it } from "vitest";
import { MIN_PREVAILING_TORQUE, PREVAILING_SRC } from "@/shared/hardware/plates";
import { AN_BOLT_TABLE, AN_BOLTS_BY_SIZE, THREAD_TABLE, TORQUE_TABLE, TUBE_MATERIALS_BY_NAME, boltShearStrength, tensileStressArea, torqueRange, STEEL_BOLT_FSU } from "@/shared/hardware";
import { DEFAULT_SETTINGS, settingsSchema } from "@/shared/analysis";
import { breakingStrength, CABLE_SIZES, minPulleyDiameter, PULLEY_RATIO } from "@/shared/hardware/cables";

describe("design pilot forces and factors (domain.md §1)", () => {
  it("defaults to the maximum forces of the published table", () => {
    expect(DEFAULT_SETTINGS.pilotForce.pitchStick).toBe(167); // 14 CFR 23.397(b) table, pitch stick maximum
    expect(DEFAULT_SETTINGS.pilotForce.rollStick).toBe(67); // 14 CFR 23.397(b) table, roll stick maximum
    expect(DEFAULT_SETTINGS.pilotForce.yawPedal).toBe(200); // 14 CFR 23.397(b) table, yaw pedal maximum
  });
  it("defaults the factors to the published values", () => {
    expect(DEFAULT_SETTINGS.ultimateFactor).toBe(1.5); // 14 CFR 23.303
    expect(DEFAULT_SETTINGS.fittingFactor).toBe(1.15); // 14 CFR 23.625
    expect(DEFAULT_SETTINGS.bearingFactor).toBe(3.33); // 14 CFR 23.693
    expect(DEFAULT_SETTINGS.bearingFactorOnRodEnds).toBe(false); // domain.md §1: default, rating at limit × 1.5 × 1.15
    expect(DEFAULT_SETTINGS.dualControls).toBe(false);
  });
  it("rejects a factor below 1", () => {
    expect(settingsSchema.safeParse({ ultimateFactor: 0.9 }).success).toBe(false);
  });
});

describe("AN bolts (domain.md §3)", () => {
  // Expected rows typed in from domain.md, not read from the module under test.
  const rows: [string, number, number, number][] = [
    ["AN3", 0.19, 2126, 2210], // from memory: AN steel bolt table
    ["AN4", 0.25, 3680, 4080], // from memory: AN steel bolt table
    ["AN5", 0.3125, 5750, 6500], // from memory: AN steel bolt table
    ["AN6", 0.375, 8280, 10100], // from memory: AN steel bolt table
    ["AN7", 0.4375, 11250, 13600], // from memory: AN steel bolt table
    ["AN8", 0.5, 14700, 18500], // from memory: AN steel bolt table
  ];
  it.each(rows)("%s: the table holds D %s in, %s lbf single shear, %s lbf tension", (size, d, shear, tension) => {
    const row = AN_BOLTS_BY_SIZE[size as "AN3"];
    expect(row.diameter).toBe(d);
    expect(row.singleShear).toBe(shear);
    expect(row.tension).toBe(tension);
    expect(row.source.kind).toBe("fromMemory");
  });
  it.each(rows)("%s: 75 ksi · πD²/4 agrees with the table within 1 %%", (_size, d, shear) => {
    const computed = boltShearStrength(d, 75_000, 1); // from memory: 75 ksi shear
    expect(Math.abs(computed / shear - 1)).toBeLessThan(0.01); // domain.md: tables agree with the formula within 1 %
  });
  it("double shear is twice single shear", () => {
    // AN4: 75,000 × π × 0.25² / 4 = 3,681.6 lbf single; 7,363.1 double (computed by hand)
    expect(boltShearStrength(0.25, STEEL_BOLT_FSU, 1)).toBeCloseTo(3681.55, 1);
    expect(boltShearStrength(0.25, STEEL_BOLT_FSU, 2)).toBeCloseTo(7363.11, 1);
  });
  it("has six sizes AN3–AN8", () => expect(AN_BOLT_TABLE.map((r) => r.size)).toEqual(["AN3", "AN4", "AN5", "AN6", "AN7", "AN8"]));
});

describe("UNF tensile stress areas (domain.md §3)", () => {
  const rows: [string, number, number, number][] = [
    ["10-32", 0.19, 32, 0.02], // ASME B1.1 / handbook tables
    ["1/4-28", 0.25, 28, 0.0364], // ASME B1.1 / handbook tables
    ["5/16-24", 0.3125, 24, 0.058], // ASME B1.1 / handbook tables
    ["3/8-24", 0.375, 24, 0.0878], // ASME B1.1 / handbook tables
    ["7/16-20", 0.4375, 20, 0.1187], // ASME B1.1 / handbook tables
    ["1/2-20", 0.5, 20, 0.1599], // ASME B1.1 / handbook tables
  ];
  it.each(rows)("%s: A_t = 0.7854 (D − 0.9743/n)² matches the table within 1 %%", (name, d, n, area) => {
    const formula = 0.7854 * (d - 0.9743 / n) ** 2; // ASME B1.1 formula, typed here independently
    expect(tensileStressArea(d, n)).toBeCloseTo(formula, 12);
    expect(Math.abs(formula / area - 1)).toBeLessThan(0.01);
    const row = THREAD_TABLE.find((r) => r.thread === name)!;
    expect(row.tensileStressArea).toBe(area);
    expect(row.majorDiameter).toBe(d);
    expect(row.tpi).toBe(n);
  });
  it("1/4-28 by hand: (0.25 − 0.034796)² × 0.7854 = 0.03637 in²", () => {
    // 0.9743/28 = 0.034796; 0.215204² = 0.046313; × 0.7854 = 0.036374 (hand arithmetic)
    expect(tensileStressArea(0.25, 28)).toBeCloseTo(0.036374, 5);
  });
});

describe("tube materials (domain.md §3)", () => {
  it.each([
    ["4130N", 95_000, 75_000, 29.0e6], // from memory: MIL-HDBK-5 values
    ["6061-T6", 42_000, 35_000, 9.9e6], // from memory: MIL-HDBK-5 values
    ["2024-T3", 64_000, 42_000, 10.5e6], // from memory: MIL-HDBK-5 values
  ] as const)("%s: Ftu %s, Fty %s, E %s psi", (name, ftu, fty, e) => {
    const m = TUBE_MATERIALS_BY_NAME[name];
    expect([m.ftu, m.fty, m.e]).toEqual([ftu, fty, e]);
    expect(m.source.kind).toBe("fromMemory");
  });
});

describe("torque table (AC 43.13-1B table 7-1)", () => {
  it.each([
    ["10-32", 20, 25, 12, 15], // AC 43.13-1B table 7-1
    ["1/4-28", 50, 70, 30, 40], // AC 43.13-1B table 7-1
    ["5/16-24", 100, 140, 60, 85], // AC 43.13-1B table 7-1
    ["3/8-24", 160, 190, 95, 110], // AC 43.13-1B table 7-1
  ] as const)("%s: tension %s–%s, shear %s–%s in·lbf", (thread, tmin, tmax, smin, smax) => {
    expect(torqueRange(thread, "tension")).toMatchObject({ min: tmin, max: tmax });
    expect(torqueRange(thread, "shear")).toMatchObject({ min: smin, max: smax });
    expect(torqueRange(thread, "tension")!.source).toEqual({ kind: "published", text: "AC 43.13-1B table 7-1" });
  });
  // The rows not in domain.md and the maximum-allowable column, against the table as TM 9-6150-228-13&P (table H-1)
  // reproduces it: tension range, shear range, maximum allowable for a tension nut and a shear nut.
  it.each([
    ["10-32", 20, 25, 12, 15, 40, 25],
    ["1/4-28", 50, 70, 30, 40, 100, 60],
    ["5/16-24", 100, 140, 60, 85, 225, 140],
    ["3/8-24", 160, 190, 95, 110, 390, 240],
    ["7/16-20", 450, 500, 270, 300, 840, 500],
    ["1/2-20", 480, 690, 290, 410, 1100, 660],
  ] as const)("%s as reproduced: tension %s–%s, shear %s–%s, maximum %s / %s in·lbf", (thread, tmin, tmax, smin, smax, ct, cs) => {
    const r = TORQUE_TABLE.find((x) => x.thread === thread)!;
    expect(r).toMatchObject({ tension: { min: tmin, max: tmax }, shear: { min: smin, max: smax }, ceiling: { tension: ct, shear: cs } });
    expect(r.source.kind).toBe("published");
  });
});

describe("minimum breakaway torque of a used self-locking nut", () => {
  // TM 10-5430-237-12&P table 2 and TM 1-1500-204-23-6 table 2-8 (locknut breakaway torque values), in·lbf
  it.each([["10-32", 2], ["1/4-28", 3.5], ["5/16-24", 6.5], ["3/8-24", 9.5], ["7/16-20", 14], ["1/2-20", 18]] as const)("%s: %s in·lbf", (thread, min) => {
    expect(MIN_PREVAILING_TORQUE[thread]).toBe(min);
  });
  it("names its table as published", () => expect(PREVAILING_SRC).toMatchObject({ kind: "published", text: expect.stringContaining("TM 10-5430-237-12&P") }));
});

describe("control cable breaking strengths (AC 43.13-1B table 7-3)", () => {
  const lbf = (size: (typeof CABLE_SIZES)[number], c: "7x19" | "7x7" | "1x19", m: "carbon" | "stainless") => breakingStrength(size, c, m);
  it("7×19 carbon (MIL-W-83420 comp A), every row of the table", () => {
    const want = { "1/16": 480, "3/32": 1000, "1/8": 2000, "5/32": 2800, "3/16": 4200, "7/32": 5600, "1/4": 7000 }; // AC 43.13-1B table 7-3
    for (const size of CABLE_SIZES) expect(lbf(size, "7x19", "carbon"), size).toEqual({ lbf: want[size], source: expect.objectContaining({ kind: "published" }) });
  });
  it("7×19 corrosion-resisting (comp B), every row of the table", () => {
    const want = { "1/16": 480, "3/32": 920, "1/8": 1760, "5/32": 2400, "3/16": 3700, "7/32": 5000, "1/4": 6400 }; // AC 43.13-1B table 7-3
    for (const size of CABLE_SIZES) expect(lbf(size, "7x19", "stainless"), size).toEqual({ lbf: want[size], source: expect.objectContaining({ kind: "published" }) });
  });
  it("7×7: the table's two rows published, the larger recalled and said so, none past 3/16 in", () => {
    expect(lbf("1/16", "7x7", "carbon")).toEqual({ lbf: 480, source: expect.objectContaining({ kind: "published" }) }); // AC 43.13-1B table 7-3
    expect(lbf("3/32", "7x7", "stainless")).toEqual({ lbf: 920, source: expect.objectContaining({ kind: "published" }) }); // AC 43.13-1B table 7-3
    expect(lbf("1/8", "7x7", "carbon")).toEqual({ lbf: 1700, source: expect.objectContaining({ kind: "fromMemory" }) }); // from memory
    expect(lbf("7/32", "7x7", "carbon")).toBeNull();
  });
  it("1×19 strand: recalled only", () => {
    expect(lbf("1/16", "1x19", "carbon")).toEqual({ lbf: 500, source: expect.objectContaining({ kind: "fromMemory" }) }); // from memory
    expect(lbf("1/4", "1x19", "carbon")).toBeNull();
  });
});

describe("least pulley diameter", () => {
  it("20 × the cable for 7×19 and 42 × for 7×7, both common practice; none for 1×19 strand", () => {
    expect(minPulleyDiameter("1/8", "7x19")).toEqual({ inches: 2.5, source: expect.objectContaining({ kind: "commonPractice" }) }); // common practice, no source
    expect(minPulleyDiameter("1/8", "7x7")).toEqual({ inches: 5.25, source: expect.objectContaining({ kind: "commonPractice" }) }); // common practice, no source
    expect(PULLEY_RATIO["1x19"]).toBeNull(); // MIL-DTL-87161 1.1: not for use over sheaves
    expect(minPulleyDiameter("1/8", "1x19")).toBeNull();
  });
});
