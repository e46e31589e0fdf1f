import { defineKind } from "../types";
import type { Props } from "./schema";

export const idlerArm = defineKind<Props>()({
  kind: "idlerArm",
  name: "Idler arm",
  hint: "supports and guides a run",
  ports: { in: { side: "left", name: "in" }, out: { side: "right", name: "out" }, pivot: { side: "bottom", name: "pivot" } },
  defaults: () => ({ inputArm: 3, outputArm: 3 }),
  engine: {
    role: "crank",
    arms: (p) => [p.inputArm, p.outputArm],
    // No arm angle in the format: the arms are taken as opposite, the largest resultant (loads.ts).
    pivotLoad: (fIn, fOut) => fIn + fOut,
  },
});
