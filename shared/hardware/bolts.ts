/** AN steel bolts (domain.md §3). [from memory; the tables agree with 75 ksi · πD²/4 within 1 %] */
import type { SourceTag } from "../analysis/types";
import { SRC } from "./sources";

export type AnBoltSize = "AN3" | "AN4" | "AN5" | "AN6" | "AN7" | "AN8";

export type AnBoltRow = {
  size: AnBoltSize;
  /** Shank diameter, in. */
  diameter: number;
  /** UNF thread of the bolt. */
  thread: "10-32" | "1/4-28" | "5/16-24" | "3/8-24" | "7/16-20" | "1/2-20";
  /** Single-shear ultimate strength, lbf, as tabulated. */
  singleShear: number;
  /** Tension ultimate strength, lbf, as tabulated. */
  tension: number;
  source: SourceTag;
};

/** Ultimate shear strength of AN alloy-steel bolts, psi. [from memory] */
export const STEEL_BOLT_FSU = 75_000;
/** Ultimate tensile strength of AN alloy-steel bolts, psi. [from memory] */
export const STEEL_BOLT_FTU = 125_000;
/**
 * Ultimate shear strength of 2024 aluminium bolts, psi. domain.md is silent on aluminium bolts;
 * 37 ksi is the MIL-HDBK-5 value for 2024-T4 as we recall it. [from memory]
 */
export const ALUMINIUM_BOLT_FSU = 37_000;

export const AN_BOLT_TABLE: readonly AnBoltRow[] = [
  { size: "AN3", diameter: 0.19, thread: "10-32", singleShear: 2126, tension: 2210, source: SRC.anBolts },
  { size: "AN4", diameter: 0.25, thread: "1/4-28", singleShear: 3680, tension: 4080, source: SRC.anBolts },
  { size: "AN5", diameter: 0.3125, thread: "5/16-24", singleShear: 5750, tension: 6500, source: SRC.anBolts },
  { size: "AN6", diameter: 0.375, thread: "3/8-24", singleShear: 8280, tension: 10100, source: SRC.anBolts },
  { size: "AN7", diameter: 0.4375, thread: "7/16-20", singleShear: 11250, tension: 13600, source: SRC.anBolts },
  { size: "AN8", diameter: 0.5, thread: "1/2-20", singleShear: 14700, tension: 18500, source: SRC.anBolts },
];

export const AN_BOLTS_BY_SIZE: Readonly<Record<AnBoltSize, AnBoltRow>> = Object.fromEntries(
  AN_BOLT_TABLE.map((r) => [r.size, r]),
) as Record<AnBoltSize, AnBoltRow>;

/** Smallest bolt diameter allowed in primary structure, in (10-32 / AN3). [published: AC 43.13-1B 7-41] */
export const MIN_BOLT_DIAMETER = 0.19;

/** Shear strength of a round pin, lbf: Fsu · πD²/4 per shear plane. */
export function boltShearStrength(diameter: number, fsu: number, planes: 1 | 2): number {
  return fsu * ((Math.PI * diameter * diameter) / 4) * planes;
}

/**
 * A bolt's material: as entered; not entered, an AN size is steel (from memory: AN bolts without "DD" in the part
 * number are alloy steel) and a custom bolt is unknown (null). The one place that reads an unentered material.
 */
export function boltMaterialOf(b: { size: string; material?: "steel" | "aluminium" }): "steel" | "aluminium" | null {
  return b.material ?? (b.size === "custom" ? null : "steel");
}
