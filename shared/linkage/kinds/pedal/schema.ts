import { z } from "zod";
import { degrees, force, inches } from "../../fields";

/** The props of a pedal part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  pedalArm: inches("pedal arm"),
  attachArm: inches("attach arm"),
  designForce: force("design force").optional(),
  travel: degrees("travel").default(20),
});
export type Props = z.output<typeof props>;
