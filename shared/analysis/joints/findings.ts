/**
 * Findings of the joint checks: a negative margin is a hazard; a check not made is a caution that says what
 * to enter (never a pass). Also: a hole too near its edge, a clevis pin held only by a cotter pin, and the
 * single-shear rod end.
 */
import { MIN_EDGE_RATIO, SRC } from "../../hardware";
import type { AnalysisSettings, CheckId, Finding, JointCheck, JointResult } from "../types";
import { type Ctx, jointLabel, nodeLabel } from "../context";
import { finding, fmt, fmtMargin, jointSubject, num } from "../format";
import { boltDiameter, UNDRIVEN_TODO } from "../allowables";
import { BOLT_DIAMETER_TODO, NO_FASTENER_TODO, fastenerDiameter } from "./checks";
import { factorTable, movingRole } from "./factors";

const jl = jointLabel, fastenerDia = fastenerDiameter, boltDia = boltDiameter, MIN_ED = MIN_EDGE_RATIO;

const WEAK: Record<CheckId, string> = {
  rodEndRating: "rod-end-underrated",
  boltShear: "bolt-shear-weak",
  pinShear: "pin-shear-weak",
  boltBending: "bolt-bending-weak",
  bearingFrom: "hole-bearing-weak",
  bearingTo: "hole-bearing-weak",
  tearOutFrom: "hole-tear-out-weak",
  tearOutTo: "hole-tear-out-weak",
  bearingRating: "bearing-rating-exceeded",
  threadTension: "thread-tension-weak",
};

const REMEDY: Record<CheckId, string> = {
  rodEndRating: "Use a rod end with a higher rating.",
  boltShear: "Use a larger bolt or double shear.",
  pinShear: "Use a larger or stronger pin, or double shear.",
  boltBending: "Support the bolt on both sides (double shear), shorten the stack, or use a larger bolt.",
  bearingFrom: "Use a thicker member, a larger bolt, or a bushing of a harder material.",
  bearingTo: "Use a thicker member, a larger bolt, or a bushing of a harder material.",
  tearOutFrom: "Increase the edge distance or the member's thickness.",
  tearOutTo: "Increase the edge distance or the member's thickness.",
  bearingRating: "Use a bearing with a higher rating.",
  threadTension: "Use a larger thread or a stronger body material.",
};

const NO_CHECKS: readonly JointCheck[] = [];
const SIDES = ["from", "to"] as const;

/** The factor a check used, by name: the joint's own special factor (a rod end's rating at a hinge takes the hinge's 6.67), the bearing factor, or the fitting factor. */
function factorWords(c: JointCheck, r: JointResult, s: AnalysisSettings): string {
  const t = factorTable(s);
  const which = c.factor === s.fittingFactor ? t.fitting.name : c.factor === r.factor.value ? r.factor.name : c.factor === t.bearing.value ? t.bearing.name : "special factor";
  return `limit × ${fmt(s.ultimateFactor, 2)} ultimate × ${fmt(c.factor, 2)} ${which}`;
}

function partOf(ctx: Ctx, j: number, side: "from" | "to"): string {
  const n = side === "from" ? ctx.jFrom[j] : ctx.jTo[j];
  return n >= 0 ? nodeLabel(ctx.nodes[n]) : `the ${side} member`;
}

export function jointFindings(ctx: Ctx, results: JointResult[], s: AnalysisSettings, out: Finding[]) {
  for (let j = 0; j < results.length; j++) {
    const r = results[j];
    const hw = ctx.joints[j].hardware;
    if (!hw) continue;
    const subj = jointSubject(r.jointId);
    // Lists made only for a joint that has a check not made (most have none).
    let open: JointCheck[] | null = null;
    for (const c of r.checks) {
      if (c.status === "computed" && c.margin !== null && c.margin < 0) {
        const u = c.unit;
        out.push(finding(WEAK[c.id], "hazard", subj,
          `Joint ${jl(ctx, j)}, ${c.label}: it must carry ${fmt(c.required!)} ${u} ultimate (${factorWords(c, r, s)}) but holds ${fmt(c.allowable!)} ${u} (${c.basis}) — margin ${fmtMargin(c.margin)}. ${REMEDY[c.id]}`,
          c.source, [num("required ultimate", c.required!, u), num("allowable", c.allowable!, u), num("margin", c.margin, "")]));
      } else if (c.status === "notChecked") (open ??= []).push(c);
    }
    const rest: JointCheck[] = [];
    for (const c of open ?? NO_CHECKS) {
      const own = c.todo && !c.todo.includes(";") && c.required !== null;
      if (own && c.id === "rodEndRating")
        out.push(finding("rod-end-rating-missing", "caution", subj,
          `Not checked: the rod end at joint ${jl(ctx, j)} has no rated ultimate radial load on its card, so it cannot be compared with the ${fmt(c.required!)} lbf it must carry (${factorWords(c, r, s)}). Enter the maker's rating.`,
          SRC.rodEndRating, [num("required ultimate", c.required!, "lbf")]));
      else if (own && c.id === "bearingRating")
        out.push(finding("bearing-rating-missing", "caution", subj,
          `Not checked: the ball or roller bearing at joint ${jl(ctx, j)} has no rating recorded, so it cannot be compared with the ${fmt(c.required!)} lbf it must carry. Enter the bearing's rated radial load from its maker.`,
          c.source, [num("required ultimate", c.required!, "lbf")]));
      else if (own && c.id === "boltShear" && c.todo === BOLT_DIAMETER_TODO)
        out.push(finding("bolt-diameter-unknown", "caution", subj,
          `Not checked: the custom bolt at joint ${jl(ctx, j)} has no diameter recorded, so its shear, bending and the bearing at its holes cannot be checked. Enter the shank diameter.`, SRC.anBolts));
      else if (c.id === "boltShear" && c.todo?.endsWith(NO_FASTENER_TODO))
        out.push(finding("fastener-not-recorded", "caution", subj,
          `Not checked: no bolt or clevis pin is recorded at joint ${jl(ctx, j)}, so its shear and bending, the bearing at the holes, and its nut, safetying and retention are not checked. Record the bolt (or pin), its washers and nut, and how the nut is locked.`,
          SRC.anBolts));
      else rest.push(c);
    }
    // A joint nothing drives is told once per part (part-not-driven), not again per joint; its card says "not checked".
    if (rest.length && !rest.every((c) => c.todo === UNDRIVEN_TODO))
      out.push(finding("joint-checks-not-made", "caution", subj,
        `Not checked at joint ${jl(ctx, j)}: ${rest.map((c) => c.label).join(", ")}. To check ${rest.length === 1 ? "it" : "them"}: ${r.todo.filter((t) => rest.some((c) => c.todo?.includes(t))).join("; ")}.`,
        { kind: "commonPractice", text: "a check without its inputs is not made" }));

    // A hole nearer its edge than the bearing tables go.
    const d = fastenerDia(hw, boltDia);
    if (d !== null) {
      for (const side of SIDES) {
        const m = hw.holes?.[side];
        if (m?.edgeDistance !== undefined && m.edgeDistance / d < MIN_ED - 1e-9)
          out.push(finding("hole-edge-short", "hazard", subj,
            `At joint ${jl(ctx, j)} the hole in ${partOf(ctx, j, side)} is ${fmt(m.edgeDistance, 3)} in from the edge, ${fmt(m.edgeDistance / d, 2)} × the ${fmt(d, 3)} in bolt — under ${MIN_EDGE_RATIO} × D, where the bearing allowables start. Use a member with more edge distance.`,
            { kind: "fromMemory", text: "MIL-HDBK-5 bearing allowables start at e/D 1.5" }, [num("edge distance", m.edgeDistance, "in"), num("e/D", m.edgeDistance / d, "")]));
      }
    }

    // A clevis pin under load or motion is held by more than a cotter pin alone.
    if (hw.clevisPin || hw.bearing === "clevisPin") {
      const ret = hw.clevisPin?.retention;
      const loaded = r.radialLimit > 0 || movingRole(r.role);
      if (ret === "cotterPinOnly" && loaded)
        out.push(finding("clevis-pin-cotter-only", "hazard", subj,
          `The clevis pin at joint ${jl(ctx, j)} is under load or motion and retained only by a cotter pin. Hold the joint by more than a cotter pin alone: a bolt with a castellated nut and a new cotter pin in its place, or a pin the designer's drawing retains by other means as well.`,
          { kind: "published", text: "14 CFR 23.689(d)" }));
      else if (ret === undefined)
        out.push(finding("clevis-pin-retention-unrecorded", "caution", subj,
          `Record how the clevis pin at joint ${jl(ctx, j)} is retained: a pin under load or motion must be held by more than a cotter pin alone.`,
          { kind: "published", text: "14 CFR 23.689(d)" }));
    }

    if (hw.rodEnd && hw.shear === "single") {
      const bend = r.checks.find((c) => c.id === "boltBending");
      out.push(finding("rod-end-single-shear", "caution", subj,
        `The rod end at joint ${jl(ctx, j)} hangs on one side of its arm, so the bolt works in single shear with bending${bend?.status === "computed" ? ` (bending margin ${fmtMargin(bend.margin!)})` : " (bending not checked yet: see the joint's to-do)"}. Double shear (a clevis or a bolt supported on both sides) is better; if single shear is the design, keep the retaining washer on the rod end's free side.`,
        SRC.singleShear));
    }
  }
}
