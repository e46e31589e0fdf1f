import { z } from "zod";
import { degrees, inches } from "../../fields";

/** The props of a controlHorn part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  hornArm: inches("horn arm"),
  /** Angle between the pushrod and the horn arm at neutral; 90 = perpendicular. */
  linkAngle: degrees("link angle").default(90),
  /** Bolts holding the horn to its surface (in one row), and the distance between neighbouring bolts, in. */
  boltCount: z.number({ error: "bolt count must be a whole number" }).int("bolt count must be a whole number").min(1, "at least one bolt").max(12, "more than 12 bolts").optional(),
  boltSpacing: inches("bolt spacing").optional(),
});
export type Props = z.output<typeof props>;
