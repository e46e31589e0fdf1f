import { defineKind } from "../types";
import type { Props } from "./schema";

/**
 * A control cable between two terminals. It carries tension only. Pulleys and fairleads join its `run`.
 * The rigging tension of a circuit (measured with a tensiometer at a temperature) and the designer's range
 * are recorded on either cable of the circuit; the circuit takes the highest tension recorded on it.
 */
export const cable = defineKind<Props>()({
  kind: "cable",
  name: "Control cable",
  hint: "tension only, terminal to terminal",
  ports: { a: { side: "left", name: "A", end: true }, b: { side: "right", name: "B", end: true }, run: { side: "top", name: "run" } },
  defaults: () => ({ size: "1/8" as const, construction: "7x19" as const, material: "carbon" as const, terminalA: "swaged" as const, terminalB: "swaged" as const }),
  engine: { role: "tension" },
});
