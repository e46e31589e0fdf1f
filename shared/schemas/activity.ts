/** A build's activity (its audit events), a page at a time. */
import { z } from "zod";
import { isoTime, pageFields } from "./common";

/** One row of a build's activity. */
export const activityRow = z.object({ id: z.string(), action: z.string(), detail: z.record(z.string(), z.unknown()), at: isoTime, who: z.string() });
export const activityResponse = z.object({ activity: z.array(activityRow), ...pageFields });
