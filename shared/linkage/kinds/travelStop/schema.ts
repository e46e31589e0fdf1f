import { z } from "zod";
import { degrees, inches } from "../../fields";

/** The props of a travelStop part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  /**
   * The deflection at which the stop contacts, degrees of the part it stops, signed by the way it stops it:
   * positive going up (a surface) or the input's positive way, negative the other way.
   */
  stopAt: degrees("stop angle").default(15),
  /** Distance from the pivot of the part it stops to the point of contact, in: the stop load is the moment over this arm. */
  arm: inches("stop arm").optional(),
});
export type Props = z.output<typeof props>;
