/**
 * The special factor of a joint (domain.md §1). Only the highest that applies is used (14 CFR 23.619):
 * - 1.15 fitting factor on fittings, their attachment and bearing on joined members (14 CFR 23.625);
 * - 3.33 on the bearing of plain bearings in push-pull joints with angular motion (14 CFR 23.693);
 * - 2.0 (the build's cable factor) in place of 3.33 for such joints in cable systems (14 CFR 23.693; analyze
 *   passes `cable` for the joints the cable module marks);
 * - 6.67 on the bearing of hinges other than ball or roller bearing hinges (14 CFR 23.657(a)).
 * The fitting factor goes on every check of the joint; the higher bearing factors go on bearing at the holes
 * (the softest material at the hole), not on the bolt's shear.
 */
import type { JointHardware } from "../../linkage/schema";
import type { AnalysisSettings, JointRole, SourceTag, SpecialFactor } from "../types";

export const HINGE_BEARING_FACTOR = 6.67; // 14 CFR 23.657(a)
export const CABLE_JOINT_FACTOR = 2.0; // 14 CFR 23.693

const SRC = {
  fitting: { kind: "published", text: "14 CFR 23.625" },
  bearing: { kind: "published", text: "14 CFR 23.693" },
  hinge: { kind: "published", text: "14 CFR 23.657(a)" },
} as const satisfies Record<string, SourceTag>;

/** Joints whose parts move relative to each other as the control moves. */
export function movingRole(role: JointRole): boolean {
  return role === "link" || role === "pivot" || role === "hinge";
}

/**
 * Whether a part turns directly on the bolt or pin at this joint (a plain bearing with angular motion):
 * a plain bushing or clevis pin, a bolt set free to turn, a moving joint whose bearing is recorded as `none`,
 * or a moving joint (pivot, hinge, or a link end without a rod end) with no bearing recorded.
 */
export function turnsOnBolt(hw: JointHardware | undefined, role: JointRole): boolean {
  if (!hw) return false;
  if (hw.fit === "freeToRotate" || hw.bearing === "plainBushing" || hw.bearing === "clevisPin") return true;
  if (hw.rodEnd || hw.bearing === "ballBearing" || hw.bearing === "rodEnd") return false;
  if (!(hw.bolt || hw.clevisPin)) return false;
  // Nothing recorded at a moving joint with no rod end: a pivot or hinge turns on something, and so does a link end
  // (a fork or a terminal on a horn or a crank arm) — on the bolt, until a bearing is recorded.
  if (hw.bearing === undefined) return movingRole(role);
  return movingRole(role) && hw.bearing === "none";
}

export type FactorOptions = { /** The joint is in a cable system (the cable module sets it). */ cable?: boolean };

/** The factors of one analysis, made once (a joint picks one of these objects; no allocation per joint). */
export type FactorTable = { fitting: SpecialFactor; bearing: SpecialFactor; cable: SpecialFactor; hinge: SpecialFactor };
const tables = new WeakMap<AnalysisSettings, FactorTable>();
export function factorTable(settings: AnalysisSettings): FactorTable {
  let t = tables.get(settings);
  if (!t) {
    t = {
      fitting: { value: settings.fittingFactor, name: "fitting factor", source: SRC.fitting },
      bearing: { value: settings.bearingFactor, name: "bearing factor (plain bearing, angular motion)", source: SRC.bearing },
      cable: { value: settings.cableFactor ?? CABLE_JOINT_FACTOR, name: "cable-system joint factor", source: SRC.bearing },
      hinge: { value: HINGE_BEARING_FACTOR, name: "hinge bearing factor", source: SRC.hinge },
    };
    tables.set(settings, t);
  }
  return t;
}

/** The special factor on bearing at a joint, and which one it is: the highest that applies (14 CFR 23.619). */
export function selectSpecialFactor(hw: JointHardware | undefined, role: JointRole, settings: AnalysisSettings, opts: FactorOptions = {}): SpecialFactor {
  const t = factorTable(settings);
  let other: SpecialFactor | null = null;
  // A rod end as a hinge bearing is a ball in a plain race: with the setting that treats rod ends as plain bearings,
  // the hinge factor applies to it as to any hinge that is not a ball or roller bearing (14 CFR 23.657(a)).
  if (role === "hinge" && hw && hw.bearing !== "ballBearing" && (!hw.rodEnd || settings.bearingFactorOnRodEnds) && (hw.bolt || hw.clevisPin || hw.bearing)) other = t.hinge;
  // A joint of a cable system takes the cable factor (14 CFR 23.693) — in place of 3.33 where a part turns on it.
  else if (opts.cable) other = t.cable;
  else if (turnsOnBolt(hw, role) || (!!hw?.rodEnd && settings.bearingFactorOnRodEnds)) other = t.bearing;
  return other && other.value > t.fitting.value ? other : t.fitting;
}
