import { defineKind } from "../types";
import type { Props } from "./schema";

/**
 * A control wheel on its column (yoke). Pitch: the pilot pushes or pulls the wheel; the column turns on its
 * pivot, the wheel `columnArm` above it, the run leaving `attach` at `attachArm`. Roll: the pilot turns the
 * wheel with a couple of rollWheel × D in·lbf (D the wheel diameter; 14 CFR 23.397(b): 50·D, minimum 40·D),
 * the run leaving the shaft's drum, sprocket or crank of radius `attachArm`: F = couple / attachArm.
 */
export const controlWheel = defineKind<Props>()({
  kind: "controlWheel",
  name: "Control wheel",
  hint: "pilot input, wheel and column",
  ports: { attach: { side: "right", name: "attach" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: (system) => ({ axis: system === "pitch" ? ("pitch" as const) : ("roll" as const), diameter: 12, columnArm: 20, attachArm: 2 }),
  engine: {
    role: "input",
    // Roll: the couple taken as a force at the rim (radius D/2), so force × D/2 = the couple.
    arms: (p) => (p.axis === "roll" ? [p.diameter / 2, p.attachArm] : [p.columnArm, p.attachArm]),
    pilotForce: (p, system, f) => wheelForce(p, system, f),
  },
});

/** The pilot's force at the wheel, lbf: pitch the push or pull, roll the couple over the rim radius. */
export function wheelForce(
  p: { axis: "pitch" | "roll"; diameter: number; designForce?: number; designCouple?: number },
  system: string,
  f: { pitchWheel: number; rollWheel: number; other: number },
): number {
  if (system === "flap" || system === "trim") return p.designForce ?? f.other;
  if (p.axis === "roll") return wheelCouple(p, f) / (p.diameter / 2);
  return p.designForce ?? f.pitchWheel; // 14 CFR 23.397(b): wheel, pitch
}

/** The roll couple at the wheel, in·lbf: the override, else rollWheel × D. 14 CFR 23.397(b): 50·D (minimum 40·D). */
export function wheelCouple(p: { diameter: number; designCouple?: number }, f: { rollWheel: number }): number {
  return p.designCouple ?? f.rollWheel * p.diameter;
}
