import { defineKind } from "../types";
import type { Props } from "./schema";

export const pedal = defineKind<Props>()({
  kind: "pedal",
  name: "Rudder pedal",
  hint: "pilot input, yaw",
  ports: { attach: { side: "right", name: "attach" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ pedalArm: 8, attachArm: 3, travel: 20 }),
  engine: {
    role: "input",
    arms: (p) => [p.pedalArm, p.attachArm],
    // 14 CFR 23.397(b): the pedal force (the build's settings hold the figure).
    pilotForce: (p, system, f) => {
      if (p.designForce) return p.designForce;
      if (system === "flap" || system === "trim") return f.other;
      return f.yawPedal;
    },
  },
});
