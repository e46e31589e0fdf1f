import { defineKind } from "../types";
import { leverRuleForce } from "../../../hardware/design-loads";
import type { Props } from "./schema";

export const stick = defineKind<Props>()({
  kind: "stick",
  name: "Control stick",
  hint: "pilot input, pitch or roll",
  ports: { attach: { side: "right", name: "attach" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: (system) => ({ gripArm: 18, attachArm: 4, axis: system === "roll" ? ("roll" as const) : ("pitch" as const), travelFwd: 15, travelAft: 15 }),
  engine: {
    role: "input",
    arms: (p) => [p.gripArm, p.attachArm],
    // 14 CFR 23.397(b): the stick force of the axis it moves (the build's settings hold the figures).
    pilotForce: (p, system, f) => {
      const secondary = system === "flap" || system === "trim";
      // A secondary lever's force by the lever rule, its grip arm the radius (shared/hardware/design-loads.ts).
      if (secondary && p.forceSource === "leverRule") return leverRuleForce(p.gripArm);
      if (p.designForce) return p.designForce;
      if (secondary) return f.other;
      if (system === "roll" || (system !== "pitch" && p.axis === "roll")) return f.rollStick;
      return f.pitchStick;
    },
  },
});
