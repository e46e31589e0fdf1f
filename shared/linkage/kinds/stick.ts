import { z } from "zod";
import { degrees, force, inches } from "../fields";
import { defineKind } from "./types";
import { leverRuleForce } from "../../hardware/design-loads";

export const stick = defineKind({
  kind: "stick",
  name: "Control stick",
  hint: "pilot input, pitch or roll",
  /** Arms are measured pivot centre to grip centre and to the attach-hole centre. */
  props: z.object({
    gripArm: inches("grip arm"),
    attachArm: inches("attach arm"),
    axis: z.enum(["pitch", "roll"]).default("pitch"),
    /** Override of the design pilot force at the grip; absent = the build's setting for the axis. */
    designForce: force("design force").optional(),
    /** Where a flap, trim or other secondary input's force comes from: the designer's figure, or the lever rule (its grip arm is the lever). */
    forceSource: z.enum(["designer", "leverRule"]).optional(),
    travelFwd: degrees("forward travel").default(15),
    travelAft: degrees("aft travel").default(15),
  }),
  ports: { attach: { side: "right", name: "attach" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: (system) => ({ gripArm: 18, attachArm: 4, axis: system === "roll" ? ("roll" as const) : ("pitch" as const) }),
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
