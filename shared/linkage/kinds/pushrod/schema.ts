import { z } from "zod";
import { inches, tubeMaterialSchema } from "../../fields";

/** The props of a pushrod part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  material: tubeMaterialSchema.default("4130N"),
  outsideDiameter: inches("outside diameter"),
  wall: inches("wall thickness"),
  /** Centre to centre of the rod-end balls. */
  length: inches("length"),
});
export type Props = z.output<typeof props>;
