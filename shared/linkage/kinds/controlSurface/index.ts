import { defineKind } from "../types";
import type { Props } from "./schema";

export const controlSurface = defineKind<Props>()({
  kind: "controlSurface",
  name: "Control surface",
  hint: "the end of the run",
  ports: { horn: { side: "left", name: "horn" }, hinge: { side: "bottom", name: "hinge" } },
  defaults: () => ({ travelUp: 25, travelDown: 20 }),
  engine: { role: "surface" },
});
