/**
 * Plate, fitting and bushing materials at a bolt hole: bearing (Fbru at e/D 1.5 and 2.0) and shear (Fsu)
 * allowables, psi, for the bearing and tear-out checks (domain.md §3). [from memory: MIL-HDBK-5 values as
 * recalled, not checked against the tables — they sit near 1.5 × Ftu and 1.9 × Ftu, as domain.md expects]
 */
import type { SourceTag } from "../analysis/types";

export const PLATE_SRC: SourceTag = { kind: "fromMemory", text: "MIL-HDBK-5 Fbru at e/D 1.5 and 2.0 and Fsu, values recalled" };
export const TEAR_OUT_SRC: SourceTag = { kind: "published", text: "lug shear tear-out 2·t·(e − D/2)·Fsu, any strength-of-materials text" };
export const BEARING_SRC: SourceTag = { kind: "published", text: "bearing at the hole Fbru · D · t, any strength-of-materials text" };

export type PlateRow = { name: string; ftu: number; fsu: number; fbru15: number; fbru20: number; source: SourceTag };

export const PLATE_TABLE: Readonly<Record<"4130N" | "2024-T3" | "6061-T6" | "7075-T6", PlateRow>> = {
  "4130N": { name: "4130N", ftu: 95_000, fsu: 57_000, fbru15: 145_000, fbru20: 180_000, source: PLATE_SRC }, // from memory
  "2024-T3": { name: "2024-T3", ftu: 64_000, fsu: 39_000, fbru15: 104_000, fbru20: 129_000, source: PLATE_SRC }, // from memory
  "6061-T6": { name: "6061-T6", ftu: 42_000, fsu: 27_000, fbru15: 67_000, fbru20: 88_000, source: PLATE_SRC }, // from memory
  "7075-T6": { name: "7075-T6", ftu: 78_000, fsu: 47_000, fbru15: 121_000, fbru20: 156_000, source: PLATE_SRC }, // from memory
};

/**
 * Bushings: the bolt bears on the bushing's bore, not near an edge, so the e/D 2.0 value is used.
 * Steel is taken as 4130N, aluminium as 2024-T3 — the lower of the common bushing alloys. [from memory]
 */
export const BUSHING_TABLE: Readonly<Record<"steel" | "aluminium", PlateRow>> = {
  steel: { ...PLATE_TABLE["4130N"], name: "steel bushing (taken as 4130N)" },
  aluminium: { ...PLATE_TABLE["2024-T3"], name: "aluminium bushing (taken as 2024-T3)" },
};

/** Edge distance ratio below which the bearing table does not apply (MIL-HDBK-5 tabulates from e/D 1.5). [from memory] */
export const MIN_EDGE_RATIO = 1.5;

/** Fbru at edge ratio e/D: the e/D 1.5 value up to 1.5, linear to the e/D 2.0 value, held above 2.0. [from memory: linear interpolation between tabulated e/D] */
export function bearingUltimate(row: PlateRow, edgeRatio: number): number {
  if (edgeRatio <= 1.5) return row.fbru15;
  if (edgeRatio >= 2) return row.fbru20;
  return row.fbru15 + ((edgeRatio - 1.5) / 0.5) * (row.fbru20 - row.fbru15);
}

/** Shear tear-out of a lug, lbf: 2 · t · (e − D/2) · Fsu. */
export function tearOutStrength(thickness: number, edge: number, diameter: number, fsu: number): number {
  return 2 * thickness * Math.max(0, edge - diameter / 2) * fsu;
}

/** Rod-end body materials, ultimate tensile strength, psi, for the shank thread in tension. [from memory] */
export const ROD_END_BODY_FTU: Readonly<Record<"alloySteel" | "stainlessSteel" | "carbonSteel" | "aluminium", number>> = {
  alloySteel: 125_000, // from memory: heat-treated alloy steel, as the AN bolt
  stainlessSteel: 85_000, // from memory: 300-series stainless, annealed bar
  carbonSteel: 60_000, // from memory: low-carbon steel bar
  aluminium: 62_000, // from memory: 2024-T4 bar
};
export const ROD_END_BODY_SRC: SourceTag = { kind: "fromMemory", text: "rod-end body Ftu: alloy steel 125, stainless 85, carbon steel 60, aluminium 62 ksi" };

/** Bolt bending: Fb = Ftu × plastic shape factor of a round bar. [from memory: 1.5–1.7; the low end is used] */
export const ROUND_SHAPE_FACTOR = 1.5;
/** Ultimate tensile strength of 2024-T4 aluminium bolts, psi. [from memory] */
export const ALUMINIUM_BOLT_FTU = 62_000;
export const BENDING_SRC: SourceTag = { kind: "fromMemory", text: "bolt bending M ≤ Ftu · k · πD³/32, round-bar shape factor k = 1.5 (1.5–1.7)" };

/**
 * Minimum prevailing (drag) torque of a re-used self-locking nut, in·lbf: first recalled, then read from the
 * published locknut tables named below (PREVAILING_SRC); every figure agreed.
 */
export const MIN_PREVAILING_TORQUE: Readonly<Record<string, number>> = {
  // Minimum breakaway torque of a used self-locking nut, in·lbf: the locknut table of U.S. Army maintenance manuals
  // (TM 10-5430-237-12&P table 2, TM 1-1500-204-23-6 table 2-8); first recalled, every figure agrees.
  "10-32": 2,
  "1/4-28": 3.5,
  "5/16-24": 6.5,
  "3/8-24": 9.5,
  "7/16-20": 14,
  "1/2-20": 18,
};
export const PREVAILING_SRC: SourceTag = { kind: "published", text: "AC 43.13-1B 7-64 (re-used self-locking nuts); minimum breakaway torques from the locknut table of TM 10-5430-237-12&P (table 2) and TM 1-1500-204-23-6 (table 2-8): a used nut under its minimum is not to be used" };
