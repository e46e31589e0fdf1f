import { z } from "zod";
import { inches } from "../fields";
import { defineKind } from "./types";

export const torqueTube = defineKind({
  kind: "torqueTube",
  name: "Torque tube",
  hint: "turns one arm into another",
  props: z.object({
    inputArm: inches("input arm"),
    outputArm: inches("output arm"),
  }),
  ports: { in: { side: "left", name: "in" }, out: { side: "right", name: "out" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ inputArm: 3, outputArm: 3 }),
  engine: {
    role: "crank",
    arms: (p) => [p.inputArm, p.outputArm],
    // No arm angle in the format: the arms are taken as opposite, the largest resultant (loads.ts).
    pivotLoad: (fIn, fOut) => fIn + fOut,
  },
});
