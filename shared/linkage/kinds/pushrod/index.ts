import { defineKind } from "../types";
import type { Props } from "./schema";

export const pushrod = defineKind<Props>()({
  kind: "pushrod",
  name: "Pushrod",
  hint: "push–pull tube, two ends",
  ports: { a: { side: "left", name: "A", end: true }, b: { side: "right", name: "B", end: true } },
  defaults: () => ({ material: "4130N" as const, outsideDiameter: 0.5, wall: 0.035, length: 36 }),
  engine: { role: "link" },
});
