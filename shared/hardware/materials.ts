/** Pushrod tube materials (domain.md §3). [from memory: MIL-HDBK-5 values] */
import type { SourceTag } from "../analysis/types";
import { SRC } from "./sources";

export type TubeMaterialName = "4130N" | "6061-T6" | "2024-T3";

export type TubeMaterial = {
  name: TubeMaterialName;
  /** Ultimate tensile strength, psi. */
  ftu: number;
  /** Tensile yield strength, psi. */
  fty: number;
  /** Modulus of elasticity, psi. */
  e: number;
  /** Steel or aluminium, for the thread-engagement rule of thumb. */
  family: "steel" | "aluminium";
  source: SourceTag;
};

export const TUBE_MATERIAL_TABLE: readonly TubeMaterial[] = [
  { name: "4130N", ftu: 95_000, fty: 75_000, e: 29.0e6, family: "steel", source: SRC.tubes },
  { name: "6061-T6", ftu: 42_000, fty: 35_000, e: 9.9e6, family: "aluminium", source: SRC.tubes },
  { name: "2024-T3", ftu: 64_000, fty: 42_000, e: 10.5e6, family: "aluminium", source: SRC.tubes },
];

export const TUBE_MATERIALS_BY_NAME: Readonly<Record<TubeMaterialName, TubeMaterial>> = Object.fromEntries(
  TUBE_MATERIAL_TABLE.map((m) => [m.name, m]),
) as Record<TubeMaterialName, TubeMaterial>;
