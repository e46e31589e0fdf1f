import { z } from "zod";
import { degrees, force, inches } from "../../fields";

/** The props of a stick part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file).
 * Arms are measured pivot centre to grip centre and to the attach-hole centre. */
export const props = z.object({
  gripArm: inches("grip arm"),
  attachArm: inches("attach arm"),
  axis: z.enum(["pitch", "roll"]).default("pitch"),
  /** Override of the design pilot force at the grip; absent = the build's setting for the axis. */
  designForce: force("design force").optional(),
  /** Where a flap, trim or other secondary input's force comes from: the designer's figure, or the lever rule (its grip arm is the lever). */
  forceSource: z.enum(["designer", "leverRule"]).optional(),
  travelFwd: degrees("forward travel").default(15),
  travelAft: degrees("aft travel").default(15),
});
export type Props = z.output<typeof props>;
