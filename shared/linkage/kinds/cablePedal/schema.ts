import { z } from "zod";
import { degrees, force, inches } from "../../fields";

/** The props of a cablePedal part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  pedalArm: inches("pedal arm"),
  /** Pivot to the cable's attach hole. */
  cableArm: inches("cable arm"),
  designForce: force("design force").optional(),
  travel: degrees("travel").default(20),
});
export type Props = z.output<typeof props>;
