import { z } from "zod";
import { degrees } from "../../fields";

/** The props of a fairlead part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  /** The change of the cable's direction through it, degrees. */
  turnAngle: degrees("turn angle").optional(),
});
export type Props = z.output<typeof props>;
