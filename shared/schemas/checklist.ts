/** The inspection checklist of a revision: its items (generated from the graph) with ticks and notes. */
import { z } from "zod";
import { ITEM_CODES } from "../records/checklist";
import type { SourceTag } from "../analysis/types";
import { isoTime, revisionNumber } from "./common";
import { linkage } from "./linkages";

export const checklistTick = z.object({
  revision: revisionNumber(),
  jointId: z.string().max(64).default(""),
  code: z.enum(ITEM_CODES, { error: "unknown checklist item" }),
  ticked: z.boolean({ error: "ticked must be true or false" }),
  note: z.string().max(2000, "a note is at most 2,000 characters").optional(),
});

/** A stored tick: who (a name; null when unticked) and when. */
export const tick = z.object({ jointId: z.string(), code: z.string(), tickedBy: z.string().nullable(), tickedAt: isoTime.nullable(), note: z.string() });
export type Tick = z.infer<typeof tick>;
export const checklistItem = z.object({
  jointId: z.string(),
  subject: z.enum(["joint", "part", "linkage"]),
  where: z.string(),
  code: z.enum(ITEM_CODES),
  text: z.string(),
  source: z.custom<SourceTag>(),
  tickedBy: z.string().nullable(),
  tickedAt: isoTime.nullable(),
  note: z.string(),
});
export type ChecklistItemView = z.infer<typeof checklistItem>;
export const checklistResponse = z.object({ linkage, revision: z.number().int(), currentRevision: z.number().int(), items: z.array(checklistItem) });
export const tickResponse = z.object({ item: tick.optional() });
