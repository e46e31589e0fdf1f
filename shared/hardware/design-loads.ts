/**
 * Published design loads and factors the settings are compared with (domain.md §1), and the force rule for
 * secondary-control levers.
 */
import type { SourceTag } from "../analysis/types";

export const DESIGN_LOAD_SRC = {
  pilotForces: { kind: "published", text: "14 CFR 23.397(b) (text before amendment 23-64)" },
  hingeMoments: { kind: "published", text: "14 CFR 23.395" },
  lever: { kind: "published", text: "14 CFR 25.405 table: crank, wheel or lever of radius R in, (1 + R)/3 × 50 lbf, 50–150 lbf, within 20° of the control's plane (flap, tab, stabilizer, spoiler and landing-gear controls)" },
  factors: { kind: "published", text: "14 CFR 23.303, 23.625, 23.693" },
} as const satisfies Record<string, SourceTag>;

/** Pilot forces of 14 CFR 23.397(b), limit, lbf: the maximum (the design force) and the minimum a hinge-moment analysis may go down to. */
export const PILOT_FORCE_TABLE = {
  pitchStick: { max: 167, min: 100 }, // 14 CFR 23.397(b)
  rollStick: { max: 67, min: 40 }, // 14 CFR 23.397(b)
  yawPedal: { max: 200, min: 150 }, // 14 CFR 23.397(b)
} as const;

/** Published factors the settings may not go below. */
export const FACTOR_MINIMUMS = {
  ultimateFactor: 1.5, // 14 CFR 23.303
  fittingFactor: 1.15, // 14 CFR 23.625
  bearingFactor: 3.33, // 14 CFR 23.693
} as const;

/**
 * Force a pilot is taken to put on a secondary-control lever, crank or wheel of radius R in:
 * (1 + R)/3 × 50 lbf, not less than 50 nor more than 150 lbf [published: the 14 CFR 25.405 table, for a force within 20° of the
 * control's plane on flap, tab, stabilizer, spoiler and landing-gear controls].
 */
export function leverRuleForce(radius: number): number {
  const f = ((1 + radius) / 3) * 50;
  return Math.min(150, Math.max(50, f));
}
