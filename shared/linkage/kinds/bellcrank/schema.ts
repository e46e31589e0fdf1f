import { z } from "zod";
import { degrees, inches } from "../../fields";

/** The props of a bellcrank part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  inputArm: inches("input arm"),
  outputArm: inches("output arm"),
  /** Angle between the two arms at the pivot. */
  armAngle: degrees("arm angle").default(90),
});
export type Props = z.output<typeof props>;
