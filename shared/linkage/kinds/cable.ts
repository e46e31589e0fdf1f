import { z } from "zod";
import { fahrenheit, force, inches } from "../fields";
import { CABLE_CONSTRUCTIONS, CABLE_MATERIALS, CABLE_SIZES, CABLE_TERMINALS } from "../../hardware/cables";
import { defineKind } from "./types";

/**
 * A control cable between two terminals. It carries tension only. Pulleys and fairleads join its `run`.
 * The rigging tension of a circuit (measured with a tensiometer at a temperature) and the designer's range
 * are recorded on either cable of the circuit; the circuit takes the highest tension recorded on it.
 */
export const cable = defineKind({
  kind: "cable",
  name: "Control cable",
  hint: "tension only, terminal to terminal",
  props: z.object({
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
  }),
  ports: { a: { side: "left", name: "A", end: true }, b: { side: "right", name: "B", end: true }, run: { side: "top", name: "run" } },
  defaults: () => ({ size: "1/8" as const, construction: "7x19" as const, material: "carbon" as const }),
  engine: { role: "tension" },
});
