/**
 * "Suggest a part" for a joint: the library parts that fit the joint (rod ends: same thread, hand and
 * ball bore; bolts: the bore's diameter) and carry its required ultimate load, ordered by margin.
 * Pure: the required load comes from the stored analysis of the revision (JointResult.radialUltimate).
 */
import { AN_BOLTS_BY_SIZE, ALUMINIUM_BOLT_FSU, STEEL_BOLT_FSU, boltMaterialOf, boltShearStrength, type AnBoltSize } from "../hardware";
import type { Joint } from "../linkage/schema";
import type { JointResult } from "../analysis/types";
import type { Part, PartSpec } from "./parts";

/** Two bores within 0.001 in are the same size (a measurement tolerance). [common practice, no source] */
export const BORE_TOLERANCE = 0.001;

export type Suggestion = {
  part: Part;
  /** The part's capacity in this joint, lbf ultimate. */
  capacity: number;
  /** capacity / required − 1; ≥ 0 carries the load. */
  margin: number;
  what: "rod end rating" | "bolt shear";
};
export type NearMiss = { part: Part; reason: string };
export type SuggestResult = {
  jointId: string;
  /** Required ultimate load at the joint, lbf, from the analysis. */
  required: number | null;
  fit: { thread?: string; hand?: string; bore?: number };
  /** Shear planes the bolts' strength is taken at: the joint's, or one when they are not entered (the lower strength). */
  planes: 1 | 2;
  planesEntered: boolean;
  rodEnds: Suggestion[];
  bolts: Suggestion[];
  /** Parts that fit but are too weak, or that carry the load but do not fit, with the reason. */
  nearMisses: NearMiss[];
};

const sameBore = (a: number, b: number) => Math.abs(a - b) <= BORE_TOLERANCE;

function boltDiameterOf(spec: PartSpec<"bolt">): number | null {
  if (spec.size !== "custom") return AN_BOLTS_BY_SIZE[spec.size as AnBoltSize].diameter;
  return spec.diameter ?? null;
}

const byMargin = (a: Suggestion, b: Suggestion) => b.margin - a.margin || a.part.partNumber.localeCompare(b.part.partNumber);

export function suggestParts(joint: Joint, result: JointResult | null | undefined, library: Part[]): SuggestResult {
  const hw = joint.hardware;
  const re = hw.rodEnd;
  // A load that rests on values nobody entered (starting values, a stop's arm) is no requirement to rank parts by.
  const required = result && result.loadKnown !== false && result.radialUltimate > 0 ? result.radialUltimate : null;
  const bore = re?.ballBore ?? (hw.bolt ? (hw.bolt.size === "custom" ? hw.bolt.diameter : AN_BOLTS_BY_SIZE[hw.bolt.size as AnBoltSize]?.diameter) : undefined);
  const fit = { thread: re?.thread, hand: re?.hand, bore };
  // Shear planes not entered: a bolt is rated in single shear, the strength it has in either case.
  const planes: 1 | 2 = hw.shear === "double" ? 2 : 1;
  const out: SuggestResult = { jointId: joint.id, required, fit, planes, planesEntered: hw.shear !== undefined, rodEnds: [], bolts: [], nearMisses: [] };

  for (const part of library) {
    if (part.kind === "rodEnd" && re) {
      const s = part.spec as PartSpec<"rodEnd">;
      const misfit = [
        s.thread !== re.thread ? `thread ${s.thread}, the joint needs ${re.thread}` : null,
        re.hand && s.hand !== re.hand ? `${s.hand} thread, the joint needs ${re.hand}` : null,
        !sameBore(s.ballBore, re.ballBore) ? `bore ${s.ballBore} in, the joint needs ${re.ballBore} in` : null,
      ].filter(Boolean) as string[];
      if (misfit.length) {
        // Only parts that share the thread are worth naming as near misses.
        if (s.thread === re.thread) out.nearMisses.push({ part, reason: misfit.join("; ") });
        continue;
      }
      const capacity = s.ratedUltimate;
      if (required === null) { out.rodEnds.push({ part, capacity, margin: Infinity, what: "rod end rating" }); continue; }
      const margin = capacity / required - 1;
      if (margin >= 0) out.rodEnds.push({ part, capacity, margin, what: "rod end rating" });
      else out.nearMisses.push({ part, reason: `rated ${capacity} lbf, below the ${Math.round(required)} lbf required (margin ${margin.toFixed(2)})` });
    } else if (part.kind === "bolt" && bore !== undefined) {
      const s = part.spec as PartSpec<"bolt">;
      const d = boltDiameterOf(s);
      if (d === null || !sameBore(d, bore)) continue;
      const material = boltMaterialOf(s);
      if (material === null) { out.nearMisses.push({ part, reason: "a custom bolt with no material recorded: its strength is not known" }); continue; }
      const capacity = boltShearStrength(d, material === "aluminium" ? ALUMINIUM_BOLT_FSU : STEEL_BOLT_FSU, planes);
      if (required === null) { out.bolts.push({ part, capacity, margin: Infinity, what: "bolt shear" }); continue; }
      const margin = capacity / required - 1;
      if (margin >= 0) out.bolts.push({ part, capacity, margin, what: "bolt shear" });
      else out.nearMisses.push({ part, reason: `${planes === 1 ? "single" : "double"}-shear strength ${Math.round(capacity)} lbf, below the ${Math.round(required)} lbf required` });
    }
  }
  out.rodEnds.sort(byMargin);
  out.bolts.sort(byMargin);
  return out;
}
