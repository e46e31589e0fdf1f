import { z } from "zod";
import { degrees, force, inches } from "../fields";
import { defineKind } from "./types";

export const pedal = defineKind({
  kind: "pedal",
  name: "Rudder pedal",
  hint: "pilot input, yaw",
  props: z.object({
    pedalArm: inches("pedal arm"),
    attachArm: inches("attach arm"),
    designForce: force("design force").optional(),
    travel: degrees("travel").default(20),
  }),
  ports: { attach: { side: "right", name: "attach" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ pedalArm: 8, attachArm: 3 }),
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
