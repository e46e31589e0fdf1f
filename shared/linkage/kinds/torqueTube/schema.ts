import { z } from "zod";
import { inches } from "../../fields";

/** The props of a torqueTube part (the other half of the kind, its name, ports, defaults and role, is index.ts beside this file). */
export const props = z.object({
  inputArm: inches("input arm"),
  outputArm: inches("output arm"),
});
export type Props = z.output<typeof props>;
