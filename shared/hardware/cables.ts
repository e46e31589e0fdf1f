/**
 * Control cables, terminals, pulleys and turnbuckles (domain.md §6), each row with its source tag.
 * Breaking strengths: AC 43.13-1B table 7-3 (MIL-W-83420 comp A carbon / comp B corrosion-resisting) where
 * the table has the row; the rows it does not have (7×7 from 1/8 in up, and 1×19 nonflexible strand) are
 * recalled and tagged so.
 */
import type { SourceTag } from "../analysis/types";

export const CABLE_SIZES = ["1/16", "3/32", "1/8", "5/32", "3/16", "7/32", "1/4"] as const;
export type CableSize = (typeof CABLE_SIZES)[number];
export const CABLE_CONSTRUCTIONS = ["7x19", "7x7", "1x19"] as const;
export type CableConstruction = (typeof CABLE_CONSTRUCTIONS)[number];
export const CABLE_MATERIALS = ["carbon", "stainless"] as const;
export type CableMaterial = (typeof CABLE_MATERIALS)[number];
export const CABLE_TERMINALS = ["swaged", "nicopress", "thimble"] as const;
export type CableTerminal = (typeof CABLE_TERMINALS)[number];

/** Nominal diameter of each size, in. */
export const CABLE_DIAMETER: Record<CableSize, number> = {
  "1/16": 1 / 16, "3/32": 3 / 32, "1/8": 1 / 8, "5/32": 5 / 32, "3/16": 3 / 16, "7/32": 7 / 32, "1/4": 1 / 4,
};

export const CABLE_SRC = {
  table73: { kind: "published", text: "AC 43.13-1B table 7-3 (MIL-W-83420 comp A / comp B)" },
  // Not found in a text we could read (2026-12-05), but 3/16 in 7×7 = 3,700 lbf agrees with a maker's catalogue.
  recalled7x7: { kind: "fromMemory", text: "7×7 breaking strengths from 1/8 in up (MIL-W-83420), recalled, not checked against the text" },
  // Not found in a text we could read (2026-12-05), but 1/16 in 1×19 = 500 lbf agrees with a maker's catalogue.
  recalled1x19: { kind: "fromMemory", text: "1×19 nonflexible strand breaking strengths (MIL-DTL-87161), recalled, not checked against the text" },
  terminals: { kind: "fromMemory", text: "terminal efficiency: swaged and nicopress sleeve about 100 % when made right, thimble and bushing about 80 %" },
  smallCable: { kind: "published", text: "14 CFR 23.689(a)(1): no cable under 1/8 in in the primary controls" },
  // Not in domain.md: (f) is the tab-cable exception to (a)(1) (read in a reprint of the pre-2017 text).
  tabCable: { kind: "published", text: "14 CFR 23.689(f): tab control cables may be under 1/8 in in airplanes safely controllable with the tabs in the most adverse positions" },
  pulleyFit: { kind: "published", text: "14 CFR 23.689(b): pulleys correspond to the cable, closely fitted guards" },
  fairlead: { kind: "published", text: "14 CFR 23.689(c): a fairlead changes the cable direction by at most 3°" },
  turnbuckleBind: { kind: "published", text: "14 CFR 23.689(e): turnbuckles cannot bind over the range of travel" },
  turnbuckleThreads: { kind: "published", text: "AC 43.13-1B 7-166, 7-179: no more than three threads exposed at either end of the barrel" },
  turnbuckleSafety: { kind: "published", text: "AC 43.13-1B 7-179 to 7-184: every turnbuckle safetied, by wire or a locking clip" },
  // Compared on 2026-12-05 with one wire-rope maker's sheave table (a maker's figures, not a regulation): for 7×19 it
  // gives 24 × the rope diameter as desirable and 18 × as the least; for 7×7, 42 × desirable and 28 × the least.
  pulleyRatio7x19: { kind: "commonPractice", text: "pulley at least 20 × the cable diameter for 7×19: a builders' convention, between a wire-rope maker's least (18 ×) and desirable (24 ×) sheave diameters" },
  pulleyRatio7x7: { kind: "commonPractice", text: "pulley at least 42 × the cable diameter for 7×7: a wire-rope maker's desirable sheave diameter (its least is 28 ×)" },
  nonflexible: { kind: "published", text: "MIL-DTL-87161 1.1: 1×19 strand is for uses other than over sheaves" },
  cableFactor: { kind: "published", text: "14 CFR 23.693: special factor 2.0 on joints in cable systems" },
  tensionOnly: { kind: "commonPractice", text: "a cable carries tension only; a reversible control needs a closed circuit" },
  preloadedCircuit: { kind: "fromMemory", text: "statics of a preloaded closed circuit, legs of equal stiffness: T = max(F, P + F/2)" },
  pulleyLoad: { kind: "fromMemory", text: "statics: the resultant of two cable legs of tension T turned through θ is 2·T·sin(θ/2)" },
  rigging: { kind: "commonPractice", text: "rigging tension set and measured with a tensiometer at a recorded temperature, within the designer's range" },
  guardGap: { kind: "commonPractice", text: "a guard closer to the flange than the cable's diameter keeps the cable in the groove" },
} as const satisfies Record<string, SourceTag>;

type Row = Partial<Record<CableSize, number>>;
/** Minimum breaking strength, lbf, by construction and material. */
const MBS: Record<CableConstruction, Record<CableMaterial, { rows: Row; source: SourceTag; recalled?: { rows: Row; source: SourceTag } }>> = {
  "7x19": {
    // AC 43.13-1B table 7-3, MIL-W-83420 comp A (carbon) and comp B (corrosion-resisting).
    carbon: { rows: { "1/16": 480, "3/32": 1000, "1/8": 2000, "5/32": 2800, "3/16": 4200, "7/32": 5600, "1/4": 7000 }, source: CABLE_SRC.table73 },
    stainless: { rows: { "1/16": 480, "3/32": 920, "1/8": 1760, "5/32": 2400, "3/16": 3700, "7/32": 5000, "1/4": 6400 }, source: CABLE_SRC.table73 },
  },
  "7x7": {
    // AC 43.13-1B table 7-3 lists 7×7 at 1/16 and 3/32 only; the larger rows are recalled.
    carbon: {
      rows: { "1/16": 480, "3/32": 920 }, source: CABLE_SRC.table73,
      recalled: { rows: { "1/8": 1700, "5/32": 2600, "3/16": 3700 }, source: CABLE_SRC.recalled7x7 }, // from memory
    },
    stainless: {
      rows: { "1/16": 480, "3/32": 920 }, source: CABLE_SRC.table73,
      recalled: { rows: { "1/8": 1700, "5/32": 2600, "3/16": 3700 }, source: CABLE_SRC.recalled7x7 }, // from memory
    },
  },
  "1x19": {
    // from memory: MIL-DTL-87161 strand, both compositions taken alike.
    carbon: { rows: {}, source: CABLE_SRC.recalled1x19, recalled: { rows: { "1/16": 500, "3/32": 1200, "1/8": 2100, "5/32": 3300, "3/16": 4700 }, source: CABLE_SRC.recalled1x19 } },
    stainless: { rows: {}, source: CABLE_SRC.recalled1x19, recalled: { rows: { "1/16": 500, "3/32": 1200, "1/8": 2100, "5/32": 3300, "3/16": 4700 }, source: CABLE_SRC.recalled1x19 } },
  },
};

/** The minimum breaking strength of a cable with its source, or null when no table has the row. */
export function breakingStrength(size: CableSize, construction: CableConstruction, material: CableMaterial): { lbf: number; source: SourceTag } | null {
  const m = MBS[construction]?.[material];
  if (!m) return null;
  const v = m.rows[size];
  if (v !== undefined) return { lbf: v, source: m.source };
  const r = m.recalled?.rows[size];
  return r !== undefined && m.recalled ? { lbf: r, source: m.recalled.source } : null;
}

/** Fraction of the cable's strength a terminal develops. from memory (domain.md §6). */
export const TERMINAL_EFFICIENCY: Record<CableTerminal, number> = {
  swaged: 1.0, // from memory: swaged terminals develop the cable's full strength
  nicopress: 1.0, // from memory: nicopress sleeve, full strength when made and gauged right
  thimble: 0.8, // from memory: thimble and bushing, about 80 %
};
export const TERMINAL_NAMES: Record<CableTerminal, string> = { swaged: "swaged terminal", nicopress: "nicopress sleeve and thimble", thimble: "thimble and bushing" };

/** Smallest cable in a primary control system, in. 14 CFR 23.689(a)(1). */
export const MIN_PRIMARY_CABLE = 1 / 8;
/** Largest change of direction at a fairlead, degrees. 14 CFR 23.689(c). */
export const MAX_FAIRLEAD_TURN = 3;
/** Threads of a terminal allowed outside the barrel at each end. AC 43.13-1B 7-166. */
export const MAX_TURNBUCKLE_THREADS = 3;

/** Minimum pulley diameter as a multiple of the cable diameter, by construction (null: not for pulleys). */
export const PULLEY_RATIO: Record<CableConstruction, { ratio: number; source: SourceTag } | null> = {
  "7x19": { ratio: 20, source: CABLE_SRC.pulleyRatio7x19 }, // common practice: builders' 20:1, inside a maker's 18–24 ×
  "7x7": { ratio: 42, source: CABLE_SRC.pulleyRatio7x7 }, // common practice: a maker's desirable 42 ×, 5-1/4 in for 1/8 in 7×7
  "1x19": null, // MIL-DTL-87161 1.1: nonflexible strand is not run over sheaves
};

/** The minimum pulley diameter for a cable, in, or null when the cable must not run over a pulley. */
export function minPulleyDiameter(size: CableSize, construction: CableConstruction): { inches: number; source: SourceTag } | null {
  const r = PULLEY_RATIO[construction];
  return r ? { inches: r.ratio * CABLE_DIAMETER[size], source: r.source } : null;
}

/**
 * The tension of the pulling cable of a preloaded closed circuit when a force F is put through it:
 * the pulling leg gains F/2 and the slack leg loses F/2 until it goes slack (F = 2P); from then on the
 * pulling leg carries F alone. T = max(F, P + F/2). from memory: statics, legs of equal stiffness.
 */
export function pullingTension(force: number, pretension: number): number {
  return Math.max(force, pretension + force / 2);
}

/** The resultant on a pulley or fairlead of two legs of tension T turned through θ degrees: 2·T·sin(θ/2). from memory: statics. */
export function guideLoad(tension: number, turnDeg: number): number {
  const t = Math.min(180, Math.abs(turnDeg));
  return 2 * tension * Math.sin((t * Math.PI) / 360);
}
