import { z } from "zod";
import { degrees, inches } from "../fields";
import { defineKind } from "./types";

export const controlHorn = defineKind({
  kind: "controlHorn",
  name: "Control horn",
  hint: "arm on the surface",
  props: z.object({
    hornArm: inches("horn arm"),
    /** Angle between the pushrod and the horn arm at neutral; 90 = perpendicular. */
    linkAngle: degrees("link angle").default(90),
    /** Bolts holding the horn to its surface (in one row), and the distance between neighbouring bolts, in. */
    boltCount: z.number({ error: "bolt count must be a whole number" }).int("bolt count must be a whole number").min(1, "at least one bolt").max(12, "more than 12 bolts").optional(),
    boltSpacing: inches("bolt spacing").optional(),
  }),
  ports: { attach: { side: "left", name: "attach" }, surface: { side: "right", name: "surface" } },
  defaults: () => ({ hornArm: 2.5 }),
  engine: {
    role: "horn",
    // The effective arm of a link at an angle to the horn: hornArm · sin(linkAngle) [from memory; statics].
    effectiveArm: (p) => p.hornArm * Math.abs(Math.sin(((p.linkAngle ?? 90) * Math.PI) / 180)),
  },
});
