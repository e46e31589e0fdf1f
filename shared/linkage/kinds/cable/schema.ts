import { z } from "zod";
import { fahrenheit, force, inches } from "../../fields";
import { CABLE_CONSTRUCTIONS, CABLE_MATERIALS, CABLE_SIZES, CABLE_TERMINALS } from "../../../hardware/cables";

/** The props of a cable part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  size: z.enum(CABLE_SIZES).default("1/8"),
  construction: z.enum(CABLE_CONSTRUCTIONS).default("7x19"),
  material: z.enum(CABLE_MATERIALS).default("carbon"),
  /** Terminal to terminal, in. */
  length: inches("length").optional(),
  terminalA: z.enum(CABLE_TERMINALS).default("swaged"),
  terminalB: z.enum(CABLE_TERMINALS).default("swaged"),
  /** Rigging tension measured with a tensiometer, lbf, and the temperature it was measured at. */
  riggingTension: force("rigging tension").optional(),
  riggingTemperature: fahrenheit("rigging temperature").optional(),
  /** The designer's rigging range, lbf, and the temperature it is given for. */
  tensionMin: force("lowest rigging tension").optional(),
  tensionMax: force("highest rigging tension").optional(),
  rangeTemperature: fahrenheit("temperature of the range").optional(),
});
export type Props = z.output<typeof props>;
