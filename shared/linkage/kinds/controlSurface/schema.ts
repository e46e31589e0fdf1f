import { z } from "zod";
import { degrees } from "../../fields";

/** The props of a controlSurface part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  travelUp: degrees("up travel").default(25),
  travelDown: degrees("down travel").default(20),
  /** Hinge moment at design condition, in·lbf, if the designer gives one. */
  hingeMoment: z.number().positive().optional(),
});
export type Props = z.output<typeof props>;
