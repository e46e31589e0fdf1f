/** The build's hardware list: a line per distinct part with where it is used, and its ordering state. */
import { z } from "zod";
import { HARDWARE_STATES, type HardwareLine } from "../records/hardware";
import { isoTime } from "./common";

export const hardwareStatePut = z.object({
  key: z.string({ error: "key is required" }).min(1).max(200),
  state: z.enum(HARDWARE_STATES, { error: `state is one of ${HARDWARE_STATES.join(", ")}` }),
});

export const hardwareLine = z.custom<HardwareLine>().and(
  z.object({ key: z.string(), state: z.enum(HARDWARE_STATES), stateBy: z.string().nullable(), stateAt: isoTime.nullable() }),
);
export type HardwareLineView = z.infer<typeof hardwareLine>;
export const hardwareResponse = z.object({ lines: z.array(hardwareLine) });
