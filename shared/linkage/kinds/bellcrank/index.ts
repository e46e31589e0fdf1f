import { defineKind } from "../types";
import type { Props } from "./schema";

/** Resultant on a bellcrank pivot of two arm loads, arms at alpha degrees: |R|² = Fi² + Fo² − 2·Fi·Fo·cos α [from memory; statics]. */
export function bellcrankPivotLoad(fi: number, fo: number, alphaDeg: number): number {
  const c = Math.cos((alphaDeg * Math.PI) / 180);
  return Math.sqrt(Math.max(0, fi * fi + fo * fo - 2 * fi * fo * c));
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
