/**
 * Which design case sets the limit loads (domain.md §1), applied to the propagated loads:
 * - Dual controls: the 75 % each case (14 CFR 23.399) never lowers the single-pilot full-force case, which
 *   is always checked too; every load keeps the larger of the two.
 * - Hinge moments: where the designer gives a surface's hinge moment, the control system's limit loads are
 *   125 % of it (14 CFR 23.395), not below the minimum pilot forces and need not exceed the maximum ones of
 *   14 CFR 23.397(b). The run's loads scale linearly with the pilot force, so the case is a factor on them —
 *   except in a rigged cable circuit, whose pulling cable carries max(F, P + F/2) (P the rigging tension): there
 *   the cable system's loads are made again from the scaled pilot force (riggedCorrection).
 * - Settings below the published forces or factors give a caution that goes with every result.
 */
import { DESIGN_LOAD_SRC, FACTOR_MINIMUMS, PILOT_FORCE_TABLE, SRC } from "../hardware";
import type { AnalysisSettings, DesignCase, Finding, SurfaceResult } from "./types";
import { nodeLabel, type Ctx } from "./context";
import { propagate, type Loads } from "./loads";
import { finding, fmt, linkageSubject, nodeSubject } from "./format";
import { WHEEL_PITCH_DESIGN, WHEEL_PITCH_MIN, WHEEL_ROLL_DESIGN_PER_IN, WHEEL_ROLL_MIN_PER_IN } from "./cables";
import { CABLE_JOINT_FACTOR } from "./joints/factors";

/**
 * The lowest factor the hinge-moment case may put on the loads: each input's own minimum force over the force it
 * is driven with (14 CFR 23.397(b)) — a stick's or pedal's from the table, a wheel's 100 lbf in pitch and
 * 40 · D of its 50 · D couple in roll — the highest of the run's inputs (the floor none of them may go under).
 */
function minimumScale(ctx: Ctx, s: AnalysisSettings, key: "pitchStick" | "rollStick" | "yawPedal"): number {
  let floor = 0; // every input's floor is positive: 0 means the run has no input
  for (let n = 0; n < ctx.nodes.length; n++) {
    const node = ctx.nodes[n];
    if (ctx.nodeRole[n] !== "input") continue;
    let f: number;
    if (node.kind === "controlWheel") {
      f = node.props.axis === "roll" ? WHEEL_ROLL_MIN_PER_IN / s.pilotForce.rollWheel : WHEEL_PITCH_MIN / (node.props.designForce ?? s.pilotForce.pitchWheel);
    } else f = PILOT_FORCE_TABLE[key].min / s.pilotForce[key]; // 14 CFR 23.397(b) minimum
    if (f > floor) floor = f;
  }
  return floor > 0 ? floor : PILOT_FORCE_TABLE[key].min / s.pilotForce[key];
}

export const HINGE_MOMENT_FACTOR = 1.25; // 14 CFR 23.395

/** Keep, everywhere, the larger of two load sets (dual-control case and single-pilot case). */
export function maxLoads(into: Loads, other: Loads) {
  const m = (a: Float64Array, b: Float64Array) => { for (let i = 0; i < a.length; i++) if (b[i] > a[i]) a[i] = b[i]; };
  m(into.pushrodAxial, other.pushrodAxial);
  m(into.jointRadial, other.jointRadial);
  m(into.surfaceMoment, other.surfaceMoment);
  const t = (a: Int32Array, b: Int32Array) => { for (let i = 0; i < a.length; i++) if (b[i] && !a[i]) a[i] = b[i]; };
  t(into.jointFrom, other.jointFrom);
  t(into.nodeFrom, other.nodeFrom);
}

const TABLE_KEY = { pitch: "pitchStick", roll: "rollStick", yaw: "yawPedal" } as const;

/**
 * The hinge-moment case per surface, and the factor on every load. Surfaces without a hinge moment, and
 * runs of flaps, trim and other secondary controls, keep the maximum pilot force (factor 1).
 */
export function hingeMomentCase(ctx: Ctx, loads: Loads, surfaces: SurfaceResult[], s: AnalysisSettings, singlePilotChecked: boolean, out: Finding[]): DesignCase {
  const system = ctx.graph.system;
  const key = system === "pitch" || system === "roll" || system === "yaw" ? TABLE_KEY[system] : null;
  let scale = 0;
  let any = false;
  let governing: DesignCase["governing"] = "maximumPilotForce";
  let minScale: number | null = null; // made once, at the first surface with a hinge moment
  for (const sr of surfaces) {
    const n = ctx.nodeIndex.get(sr.nodeId)!;
    const node = ctx.nodes[n];
    const hm = node.kind === "controlSurface" ? node.props.hingeMoment : undefined;
    // A hinge moment whose link force rests on starting values (a horn's arm, say) cannot set the loads: the
    // maximum pilot force does (factor 1, the larger), and the unentered finding names what to enter.
    const tainted = loads.nodeFrom[n] !== 0;
    if (hm === undefined || !key || !(sr.hingeMomentLimit > 0) || tainted) {
      sr.designHingeMoment = hm ?? null;
      sr.loadCase = sr.hingeMomentLimit > 0 ? "maximumPilotForce" : null;
      scale = Math.max(scale, 1);
      if (hm !== undefined && key && tainted)
        out.push(finding("hinge-moment-waits", "advisory", nodeSubject(node.id),
          `The hinge moment of ${nodeLabel(node)} is not used yet: the force it would set passes through starting values (see the part that lists them). Loads come from the input's maximum force until they are entered.`, DESIGN_LOAD_SRC.hingeMoments));
      if (hm !== undefined && !key)
        out.push(finding("hinge-moment-not-used", "advisory", nodeSubject(node.id),
          `The hinge moment of ${nodeLabel(node)} is not used: 14 CFR 23.395 bounds it by the stick and pedal forces of 23.397(b), which do not cover a ${system} run. Loads come from the input's force.`, DESIGN_LOAD_SRC.hingeMoments));
      continue;
    }
    any = true;
    const want = HINGE_MOMENT_FACTOR * hm; // 14 CFR 23.395: 125 % of the hinge moment
    const raw = want / sr.hingeMomentLimit;
    const min = (minScale ??= minimumScale(ctx, s, key)); // 14 CFR 23.397(b) minimum of each input
    let f: number, c: DesignCase["governing"];
    if (raw >= 1) { f = 1; c = "maximumPilotForce"; }
    else if (raw <= min) { f = Math.min(1, min); c = "minimumPilotForce"; }
    else { f = raw; c = "hingeMoment"; }
    sr.designHingeMoment = hm;
    sr.loadCase = c;
    if (f > scale) { scale = f; governing = c; }
  }
  if (!any || scale <= 0) scale = 1;
  if (scale < 1) {
    const k = scale;
    const fix = riggedCorrection(ctx, loads, s, k); // before the loads are scaled: it is made from the full-force case
    for (const a of [loads.pushrodAxial, loads.jointRadial, loads.surfaceMoment]) for (let i = 0; i < a.length; i++) a[i] *= k;
    if (fix) {
      for (let i = 0; i < fix.axial.length; i++) loads.pushrodAxial[i] += fix.axial[i];
      for (let i = 0; i < fix.joint.length; i++) loads.jointRadial[i] += fix.joint[i];
    }
    for (const sr of surfaces) sr.hingeMomentLimit *= k;
    for (const inp of loads.inputs) { inp.gripForce *= k; inp.linkForce *= k; }
  } else governing = "maximumPilotForce";
  const text = !any
    ? "Limit loads from the maximum pilot force at the grip or pedal (14 CFR 23.397(b)); no hinge moment was given."
    : governing === "maximumPilotForce"
      ? "125 % of the given hinge moment needs at least the maximum pilot force, so the maximum pilot force governs (14 CFR 23.395, 23.397(b))."
      : governing === "minimumPilotForce"
        ? `125 % of the given hinge moment needs less than the minimum pilot force, so the minimum governs: loads are ${fmt(scale * 100, 0)} % of the maximum-force case (14 CFR 23.395, 23.397(b)).`
        : `125 % of the given hinge moment governs: loads are ${fmt(scale * 100, 0)} % of the maximum-force case (14 CFR 23.395).`;
  return { governing, scale, text: singlePilotChecked ? `${text} Dual controls: the single-pilot full-force case was checked too, and the larger load kept.` : text, singlePilotChecked };
}

/**
 * What a factor k on the loads misses in a rigged cable circuit. The pulling cable of a circuit rigged at P carries
 * max(F, P + F/2) (shared/hardware/cables.ts), which is not k times itself when F is scaled; its joints, pulleys,
 * fairleads and their mountings carry that tension. The loads are made again with k on every input's force (the
 * dual-control and single-pilot cases as in the run, 14 CFR 23.399) and the difference from k × the full-force
 * loads is returned, per node (axial) and per joint: 0 on every member whose load is linear in the force, so
 * the swept runs' loads (pushrods, cranks, hinges; never cables) keep the factor alone. Null when no driven
 * tension member has a rigging tension (then every load is linear in the force).
 */
function riggedCorrection(ctx: Ctx, loads: Loads, s: AnalysisSettings, k: number): { axial: Float64Array; joint: Float64Array } | null {
  const p = loads.pretension;
  if (!p || !p.some((v, n) => v > 0 && loads.driven[n] === 1)) return null; // NaN (none recorded) is not > 0
  const at = (f: number) => {
    const l = propagate(ctx, s, p, f);
    if (s.dualControls) maxLoads(l, propagate(ctx, { ...s, dualControls: false }, p, f));
    return l;
  };
  const scaled = at(k), full = at(1);
  const diff = (a: Float64Array, b: Float64Array) => {
    const d = new Float64Array(a.length);
    for (let i = 0; i < a.length; i++) {
      const v = a[i] - k * b[i];
      // Rounding in a load that is linear in the force is not a correction (relative 1e-9, common practice, no source).
      if (Math.abs(v) > 1e-9 * Math.max(1, a[i])) d[i] = v;
    }
    return d;
  };
  return { axial: diff(scaled.pushrodAxial, full.pushrodAxial), joint: diff(scaled.jointRadial, full.jointRadial) };
}

/** Settings below the published forces or factors: one caution with every result. */
export function settingsCautions(s: AnalysisSettings, out: Finding[]): string[] {
  const msgs: string[] = [];
  for (const k of ["pitchStick", "rollStick", "yawPedal"] as const) {
    const pub = PILOT_FORCE_TABLE[k].max; // 14 CFR 23.397(b)
    if (s.pilotForce[k] < pub)
      msgs.push(`The ${k === "pitchStick" ? "pitch stick" : k === "rollStick" ? "roll stick" : "pedal"} force is set to ${fmt(s.pilotForce[k], 0)} lbf, below the ${pub} lbf of 14 CFR 23.397(b); only the hinge-moment case of 23.395 may lower it, and never below ${PILOT_FORCE_TABLE[k].min} lbf.`);
  }
  const f = (v: number, min: number, what: string, src: string) => {
    if (v < min) msgs.push(`The ${what} is set to ${v}, below the ${min} of ${src}.`);
  };
  f(s.ultimateFactor, FACTOR_MINIMUMS.ultimateFactor, "ultimate factor", "14 CFR 23.303");
  f(s.fittingFactor, FACTOR_MINIMUMS.fittingFactor, "fitting factor", "14 CFR 23.625");
  f(s.bearingFactor, FACTOR_MINIMUMS.bearingFactor, "bearing factor", "14 CFR 23.693");
  f(s.cableFactor ?? CABLE_JOINT_FACTOR, CABLE_JOINT_FACTOR, "cable-system factor", "14 CFR 23.693");
  if (s.pilotForce.pitchWheel < WHEEL_PITCH_DESIGN)
    msgs.push(`The wheel's pitch force is set to ${fmt(s.pilotForce.pitchWheel, 0)} lbf, below the ${WHEEL_PITCH_DESIGN} lbf of 14 CFR 23.397(b); only the hinge-moment case of 23.395 may lower it, and never below ${WHEEL_PITCH_MIN} lbf.`);
  if (s.pilotForce.rollWheel < WHEEL_ROLL_DESIGN_PER_IN)
    msgs.push(`The wheel's roll couple is set to ${fmt(s.pilotForce.rollWheel, 0)} × D in·lbf, below the ${WHEEL_ROLL_DESIGN_PER_IN} × D of 14 CFR 23.397(b); only the hinge-moment case of 23.395 may lower it, and never below ${WHEEL_ROLL_MIN_PER_IN} × D.`);
  if (msgs.length)
    out.push(finding("settings-below-minimum", "caution", linkageSubject("settings"),
      `${msgs.join(" ")} Every result of this check is computed with these settings.`, SRC.pilotForces));
  return msgs;
}
