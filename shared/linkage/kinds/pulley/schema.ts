import { z } from "zod";
import { degrees, force, inches } from "../../fields";
import { CABLE_SIZES } from "../../../hardware/cables";

/** The props of a pulley part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  /** Diameter at the bottom of the groove, in. */
  diameter: inches("diameter"),
  /** The cable size its groove is made for. */
  grooveFor: z.enum(CABLE_SIZES).optional(),
  /** The angle the cable turns through over it (0 = straight on, 180 = back the way it came). */
  wrapAngle: degrees("wrap angle").default(90),
  bearing: z.enum(["ball", "plain"]).default("ball"),
  /** Guard pins (or a guard) at the groove: fitted or missing. */
  guards: z.enum(["fitted", "missing"]).optional(),
  /** Widest gap between a guard and the pulley's flange, in. */
  guardGap: inches("guard gap").optional(),
  /** The maker's allowable load on the pulley, lbf. */
  ratedLoad: force("rated load").optional(),
});
export type Props = z.output<typeof props>;
