import { z } from "zod";
import { degrees } from "../fields";
import { defineKind } from "./types";

export const controlSurface = defineKind({
  kind: "controlSurface",
  name: "Control surface",
  hint: "the end of the run",
  props: z.object({
    travelUp: degrees("up travel").default(25),
    travelDown: degrees("down travel").default(20),
    /** Hinge moment at design condition, in·lbf, if the designer gives one. */
    hingeMoment: z.number().positive().optional(),
  }),
  ports: { horn: { side: "left", name: "horn" }, hinge: { side: "bottom", name: "hinge" } },
  defaults: () => ({}),
  engine: { role: "surface" },
});
