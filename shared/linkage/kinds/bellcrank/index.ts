import { defineKind } from "../types";
import type { Props } from "./schema";

/** Resultant on a bellcrank pivot of two arm loads, arms at alpha degrees: |R|² = Fi² + Fo² − 2·Fi·Fo·cos α [from memory; statics]. */
export function bellcrankPivotLoad(fi: number, fo: number, alphaDeg: number): number {
  // |R|² = Fi² + Fo² − 2·Fi·Fo·cos α, written as (Fi − Fo)² + 4·Fi·Fo·sin²(α/2) (the same, by 1 − cos α = 2 sin²(α/2)):
  // with the arms nearly folded (α near 0) and equal loads the first form cancels to rounding noise, the second
  // does not, so the load scales exactly with the force.
  const s = Math.sin((alphaDeg * Math.PI) / 360);
  const d = fi - fo;
  return Math.sqrt(Math.max(0, d * d + 4 * fi * fo * s * s));
}

export const bellcrank = defineKind<Props>()({
  kind: "bellcrank",
  name: "Bellcrank",
  hint: "changes direction and ratio",
  ports: { in: { side: "left", name: "in" }, out: { side: "right", name: "out" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ inputArm: 3, outputArm: 3, armAngle: 90 }),
  engine: {
    role: "crank",
    arms: (p) => [p.inputArm, p.outputArm],
    pivotLoad: (fIn, fOut, p) => bellcrankPivotLoad(fIn, fOut, p.armAngle ?? 90),
  },
});
