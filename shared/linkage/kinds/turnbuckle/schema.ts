import { z } from "zod";
import { threadCount } from "../../fields";
import { CABLE_SIZES } from "../../../hardware/cables";

/** The props of a turnbuckle part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  /** The cable size it is made for. */
  size: z.enum(CABLE_SIZES).default("1/8"),
  /** Whole threads of each terminal showing outside the barrel. */
  threadsShowingA: threadCount("threads showing at end A").optional(),
  threadsShowingB: threadCount("threads showing at end B").optional(),
  /** How the barrel is locked: a locking clip at each end, safety wire, or not yet. */
  locking: z.enum(["clip", "wire", "none"]).optional(),
  /** Checked at both ends of the travel: it lines up with the cable and cannot bind against the part it joins ("free"), or it binds. */
  travelCheck: z.enum(["free", "binds"]).optional(),
});
export type Props = z.output<typeof props>;
