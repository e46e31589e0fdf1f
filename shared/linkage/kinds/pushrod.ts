import { z } from "zod";
import { inches, tubeMaterialSchema } from "../fields";
import { defineKind } from "./types";

export const pushrod = defineKind({
  kind: "pushrod",
  name: "Pushrod",
  hint: "push–pull tube, two ends",
  props: z.object({
    material: tubeMaterialSchema.default("4130N"),
    outsideDiameter: inches("outside diameter"),
    wall: inches("wall thickness"),
    /** Centre to centre of the rod-end balls. */
    length: inches("length"),
  }),
  ports: { a: { side: "left", name: "A", end: true }, b: { side: "right", name: "B", end: true } },
  defaults: () => ({ material: "4130N" as const, outsideDiameter: 0.5, wall: 0.035, length: 36 }),
  engine: { role: "link" },
});
