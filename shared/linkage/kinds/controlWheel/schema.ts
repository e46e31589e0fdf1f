import { z } from "zod";
import { force, inches } from "../../fields";

/** The props of a controlWheel part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  axis: z.enum(["pitch", "roll"]).default("roll"),
  /** Wheel diameter, in (the roll couple is proportional to it). */
  diameter: inches("wheel diameter"),
  /** Pitch: column pivot to the wheel's centre. */
  columnArm: inches("column arm"),
  /** Pitch: pivot to the link's hole; roll: radius of the drum, sprocket or crank on the wheel's shaft. */
  attachArm: inches("attach arm"),
  /** Override of the pitch force at the wheel, lbf. */
  designForce: force("design force").optional(),
  /** Override of the roll couple, in·lbf. */
  designCouple: z.number({ error: "design couple must be a number (in·lbf)" }).positive("design couple must be greater than 0 in·lbf").max(1_000_000, "design couple is out of range").optional(),
});
export type Props = z.output<typeof props>;
