/**
 * Allowables and margins (domain.md §3): pushrod column (Euler / Johnson, pinned-pinned K = 1) and tension,
 * rod-end rating against the required ultimate, AN bolt shear single/double. MS = allowable / required − 1.
 * The column and section formulas are unit-agnostic (tests run them in SI); the engine calls them in in, lbf, psi.
 */
import type { LinkageNode } from "../linkage/schema";
import {
  ALUMINIUM_BOLT_FSU,
  AN_BOLTS_BY_SIZE,
  SRC,
  STEEL_BOLT_FSU,
  TUBE_MATERIALS_BY_NAME,
  boltShearStrength,
  type AnBoltSize,
} from "../hardware";
import type { JointHardware } from "../linkage/schema";
import type { AnalysisSettings, Finding, JointResult, PushrodResult } from "./types";
import { type Ctx, jointLabel, nodeLabel } from "./context";
import type { Loads } from "./loads";
import { finding, fmt, fmtMargin, jointSubject, nodeSubject, num } from "./format";

/** Margins are capped so a report stays finite and JSON-safe (an unloaded part has "infinite" margin). */
export const MARGIN_CAP = 999;

export function marginOfSafety(allowable: number, required: number): number {
  if (!(required > 0)) return MARGIN_CAP;
  const ms = allowable / required - 1;
  return Number.isFinite(ms) ? Math.min(ms, MARGIN_CAP) : MARGIN_CAP;
}

export type TubeSection = { area: number; inertia: number; radiusOfGyration: number; insideDiameter: number; solid: boolean };

/** Round tube: A = π(Do² − Di²)/4, I = π(Do⁴ − Di⁴)/64, r = √(I/A). A wall of half the diameter or more is a solid rod. */
export function tubeSection(outsideDiameter: number, wall: number): TubeSection {
  const solid = !(2 * wall < outsideDiameter);
  const di = solid ? 0 : outsideDiameter - 2 * wall;
  const d2 = outsideDiameter * outsideDiameter, i2 = di * di;
  const area = (Math.PI * (d2 - i2)) / 4;
  const inertia = (Math.PI * (d2 * d2 - i2 * i2)) / 64;
  return { area, inertia, radiusOfGyration: Math.sqrt(inertia / area), insideDiameter: di, solid };
}

/** Euler critical load, P = π²EI/(KL)². */
export function eulerLoad(e: number, inertia: number, effectiveLength: number): number {
  return (Math.PI * Math.PI * e * inertia) / (effectiveLength * effectiveLength);
}

/** Johnson parabola, P = A·Fty·[1 − Fty·(KL/r)²/(4π²E)]. */
export function johnsonLoad(area: number, fty: number, e: number, slenderness: number): number {
  return area * fty * (1 - (fty * slenderness * slenderness) / (4 * Math.PI * Math.PI * e));
}

/** Transition slenderness C_c = √(2π²E/Fty). */
export function transitionSlenderness(e: number, fty: number): number {
  return Math.sqrt((2 * Math.PI * Math.PI * e) / fty);
}

export type ColumnInput = { area: number; inertia: number; length: number; e: number; fty: number; k?: number };
export type ColumnResult = { load: number; mode: "euler" | "johnson"; slenderness: number; transition: number };

/** Column allowable: Euler when KL/r ≥ C_c, else Johnson (domain.md §3). */
export function columnAllowable({ area, inertia, length, e, fty, k = 1 }: ColumnInput): ColumnResult {
  const kl = k * length;
  const slenderness = kl / Math.sqrt(inertia / area);
  const transition = transitionSlenderness(e, fty);
  if (slenderness >= transition) return { load: eulerLoad(e, inertia, kl), mode: "euler", slenderness, transition };
  return { load: johnsonLoad(area, fty, e, slenderness), mode: "johnson", slenderness, transition };
}

export function pushrodResult(node: Extract<LinkageNode, { kind: "pushrod" }>, limitAxial: number, driven: boolean, settings: AnalysisSettings): PushrodResult {
  const p = node.props;
  const mat = TUBE_MATERIALS_BY_NAME[p.material] ?? TUBE_MATERIALS_BY_NAME["4130N"];
  const sec = tubeSection(p.outsideDiameter, p.wall);
  const col = columnAllowable({ area: sec.area, inertia: sec.inertia, length: p.length, e: mat.e, fty: mat.fty, k: 1 });
  const tension = mat.ftu * sec.area;
  const ultimate = limitAxial * settings.ultimateFactor;
  return {
    nodeId: node.id,
    limitAxial,
    ultimateAxial: ultimate,
    columnAllowable: col.load,
    columnMode: col.mode,
    tensionAllowable: tension,
    marginCompression: marginOfSafety(col.load, ultimate),
    marginTension: marginOfSafety(tension, ultimate),
    area: sec.area,
    slenderness: col.slenderness,
    driven,
  };
}

/** Bolt diameter, in: from the AN size, or the recorded diameter for a custom bolt. */
export function boltDiameter(bolt: NonNullable<JointHardware["bolt"]>): number | null {
  if (bolt.size !== "custom") return AN_BOLTS_BY_SIZE[bolt.size as AnBoltSize]?.diameter ?? bolt.diameter ?? null;
  return bolt.diameter ?? null;
}

/** The one special factor of a joint: only the highest applies (14 CFR 23.619). */
export function specialFactor(hw: JointHardware | undefined, settings: AnalysisSettings): number {
  let sf = settings.fittingFactor; // 14 CFR 23.625: fittings, their attachment and bearing on joined members
  if (hw && (hw.bearing === "plainBushing" || hw.bearing === "clevisPin")) sf = Math.max(sf, settings.bearingFactor); // 14 CFR 23.693
  if (hw?.rodEnd && settings.bearingFactorOnRodEnds) sf = Math.max(sf, settings.bearingFactor);
  return sf;
}

/** `cableJoint`: the joint is in a cable system, whose factor (14 CFR 23.693) competes as one more special factor. */
export function jointResult(ctx: Ctx, j: number, loads: Loads, settings: AnalysisSettings, cableJoint = false): JointResult {
  const jt = ctx.joints[j];
  const hw = jt.hardware;
  const radialLimit = loads.jointRadial[j];
  const sf = cableJoint ? Math.max(specialFactor(hw, settings), settings.cableFactor) : specialFactor(hw, settings);
  const radialUltimate = radialLimit * settings.ultimateFactor * sf;
  const rating = hw?.rodEnd?.ratedUltimate ?? null;
  let boltAllow: number | null = null;
  if (hw?.bolt) {
    const d = boltDiameter(hw.bolt);
    if (d) boltAllow = boltShearStrength(d, hw.bolt.material === "aluminium" ? ALUMINIUM_BOLT_FSU : STEEL_BOLT_FSU, hw.shear === "single" ? 1 : 2);
  }
  return {
    jointId: jt.id,
    radialLimit,
    radialUltimate,
    rodEndRating: rating,
    rodEndMargin: rating === null ? null : marginOfSafety(rating, radialUltimate),
    boltShearAllowable: boltAllow,
    boltMargin: boltAllow === null ? null : marginOfSafety(boltAllow, radialUltimate),
    role: ctx.roles[j],
    specialFactor: sf,
  };
}

function factorText(settings: AnalysisSettings, sf: number): string {
  return `limit × ${fmt(settings.ultimateFactor, 2)} ultimate factor × ${fmt(sf, 2)} special factor`;
}

/** Findings of strength: negative margins (hazard), unknown ratings, single-shear bending (caution). */
export function strengthFindings(ctx: Ctx, pushrodNodes: number[], pushrods: PushrodResult[], jointResults: JointResult[], settings: AnalysisSettings, out: Finding[]) {
  for (let i = 0; i < pushrods.length; i++) {
    const pr = pushrods[i];
    const n = ctx.nodes[pushrodNodes[i]];
    const name = nodeLabel(n);
    if (n.kind === "pushrod" && !(2 * n.props.wall < n.props.outsideDiameter)) {
      out.push(finding("pushrod-wall-too-thick", "caution", nodeSubject(pr.nodeId),
        `Pushrod ${name}: a wall of ${fmt(n.props.wall, 3)} in on a ${fmt(n.props.outsideDiameter, 3)} in tube leaves no bore. The check treats it as a solid rod; check the entered size.`,
        SRC.engineering, [num("outside diameter", n.props.outsideDiameter, "in"), num("wall", n.props.wall, "in")]));
    }
    if (pr.marginCompression < 0) {
      out.push(finding("pushrod-buckles", "hazard", nodeSubject(pr.nodeId),
        `Pushrod ${name} can buckle: pushed at the design force it must carry ${fmt(pr.ultimateAxial)} lbf ultimate (${fmt(pr.limitAxial)} lbf limit × ${fmt(settings.ultimateFactor, 2)}), but as a pinned-end column (${pr.columnMode === "euler" ? "Euler" : "Johnson"}, KL/r ${fmt(pr.slenderness, 0)}) the tube holds only ${fmt(pr.columnAllowable)} lbf — margin ${fmtMargin(pr.marginCompression)}. Use a larger-diameter tube or a shorter run (add an idler).`,
        SRC.column, [num("required ultimate", pr.ultimateAxial, "lbf"), num("column allowable", pr.columnAllowable, "lbf"), num("margin", pr.marginCompression, "")]));
    }
    if (pr.marginTension < 0) {
      out.push(finding("pushrod-tension-weak", "hazard", nodeSubject(pr.nodeId),
        `Pushrod ${name} is too weak in tension: it must carry ${fmt(pr.ultimateAxial)} lbf ultimate but the tube section (${fmt(pr.area, 4)} in² × Ftu) holds ${fmt(pr.tensionAllowable)} lbf — margin ${fmtMargin(pr.marginTension)}.`,
        SRC.tubes, [num("required ultimate", pr.ultimateAxial, "lbf"), num("tension allowable", pr.tensionAllowable, "lbf"), num("margin", pr.marginTension, "")]));
    }
  }
  for (let j = 0; j < jointResults.length; j++) {
    const r = jointResults[j];
    const hw = ctx.joints[j].hardware;
    const subj = jointSubject(r.jointId);
    if (hw?.rodEnd) {
      if (r.rodEndRating === null) {
        out.push(finding("rod-end-rating-missing", "caution", subj,
          `The rod end at joint ${jointLabel(ctx, j)} has no rated ultimate radial load on its card, so it cannot be checked against the ${fmt(r.radialUltimate)} lbf it must carry (${factorText(settings, r.specialFactor)}). Enter the maker's rating.`,
          SRC.rodEndRating, [num("required ultimate", r.radialUltimate, "lbf")]));
      } else if (r.rodEndMargin !== null && r.rodEndMargin < 0) {
        out.push(finding("rod-end-underrated", "hazard", subj,
          `The rod end at joint ${jointLabel(ctx, j)} is rated ${fmt(r.rodEndRating)} lbf but must carry ${fmt(r.radialUltimate)} lbf ultimate (${fmt(r.radialLimit)} lbf limit, ${factorText(settings, r.specialFactor)}) — margin ${fmtMargin(r.rodEndMargin)}. Use a rod end with a higher rating.`,
          SRC.rodEndRating, [num("required ultimate", r.radialUltimate, "lbf"), num("rating", r.rodEndRating, "lbf"), num("margin", r.rodEndMargin, "")]));
      }
      if (hw.shear === "single") {
        out.push(finding("rod-end-single-shear", "caution", subj,
          `The rod end at joint ${jointLabel(ctx, j)} hangs on one side of its arm, so the bolt works in single shear with bending. Double shear (a clevis or a bolt supported on both sides) is better; if single shear is the design, check the bolt for bending and keep the retaining washer.`,
          SRC.singleShear));
      }
    }
    if (hw?.bolt) {
      if (r.boltShearAllowable === null) {
        out.push(finding("bolt-diameter-unknown", "caution", subj,
          `The custom bolt at joint ${jointLabel(ctx, j)} has no diameter recorded, so its shear strength cannot be checked. Enter the shank diameter.`,
          SRC.anBolts));
      } else if (r.boltMargin !== null && r.boltMargin < 0) {
        out.push(finding("bolt-shear-weak", "hazard", subj,
          `The bolt at joint ${jointLabel(ctx, j)} is too small: in ${hw.shear} shear it holds ${fmt(r.boltShearAllowable)} lbf but must carry ${fmt(r.radialUltimate)} lbf ultimate (${factorText(settings, r.specialFactor)}) — margin ${fmtMargin(r.boltMargin)}. Use a larger bolt or double shear.`,
          hw.bolt.material === "aluminium" ? SRC.aluminiumBolts : SRC.anBolts,
          [num("required ultimate", r.radialUltimate, "lbf"), num("bolt shear allowable", r.boltShearAllowable, "lbf"), num("margin", r.boltMargin, "")]));
      }
    }
  }
}
