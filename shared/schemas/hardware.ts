/** The build's hardware list: a line per distinct part with where it is used, and its ordering state. */
import { z } from "zod";
import { HARDWARE_STATES, type HardwareLine } from "../records/hardware";
import { isoTime } from "./common";

export const hardwareStatePut = z.object({
  key: z.string({ error: "key is required" }).min(1).max(200),
  state: z.enum(HARDWARE_STATES, { error: `state is one of ${HARDWARE_STATES.join(", ")}` }),
});

/** How many places a line of the list names at first; the rest come with `?line=KEY` (the page's "show all"). */
export const USED_IN_SHOWN = 3;
export const hardwareQuery = z.object({ line: z.string().min(1, "line is a hardware line's key").max(200).optional() });

export const hardwareLine = z.custom<HardwareLine>().and(
  z.object({
    key: z.string(), state: z.enum(HARDWARE_STATES), stateBy: z.string().nullable(), stateAt: isoTime.nullable(),
    /** Places in all; `usedIn` holds the first USED_IN_SHOWN of them in the list, all of them for `?line=`. */
    usedInCount: z.number().int(),
  }),
);
export type HardwareLineView = z.infer<typeof hardwareLine>;
export const hardwareResponse = z.object({ lines: z.array(hardwareLine) });
