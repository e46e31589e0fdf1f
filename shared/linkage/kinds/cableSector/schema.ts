import { z } from "zod";
import { inches } from "../../fields";

/** The props of a cableSector part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  inputArm: inches("input arm"),
  /** Pivot to where the cables leave the sector (or to the cable holes of a double horn). */
  sectorRadius: inches("sector radius"),
});
export type Props = z.output<typeof props>;
