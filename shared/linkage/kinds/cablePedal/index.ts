import { defineKind } from "../types";
import type { Props } from "./schema";

/** A rudder pedal whose arm pulls a cable: the pedal force at the pedal arm, the cable on the cable arm. */
export const cablePedal = defineKind<Props>()({
  kind: "cablePedal",
  name: "Pedal, cable arm",
  hint: "pilot input, yaw, pulls a cable",
  ports: { attach: { side: "right", name: "cable" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ pedalArm: 9, cableArm: 3, travel: 20 }),
  engine: {
    role: "input",
    arms: (p) => [p.pedalArm, p.cableArm],
    // 14 CFR 23.397(b): the pedal force (the build's settings hold the figure). A foot pushes only.
    pilotForce: (p, system, f) => {
      if (p.designForce) return p.designForce;
      if (system === "flap" || system === "trim") return f.other;
      return f.yawPedal;
    },
  },
});
