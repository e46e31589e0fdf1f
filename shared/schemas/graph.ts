/** A linkage's graph: one revision read, the next one saved (optimistic: only on top of `baseRevision`), a check without saving. */
import { z } from "zod";
import { graphSchema } from "../linkage/schema";
import { settingsSchema, type Report } from "../analysis/types";
import { isoTime, person, revisionNumber } from "./common";

export const graphPut = z.object({ baseRevision: revisionNumber("baseRevision"), graph: graphSchema });
export const analyzeInput = z.object({ graph: graphSchema, settings: settingsSchema.partial().optional() });

/** A stored revision: the graph, the engine's report saved with it (null before the engine ran), who and when. */
export const revision = z.object({
  revision: z.number().int(),
  graph: graphSchema,
  analysis: z.custom<Report>().nullable(),
  author: person,
  createdAt: isoTime,
});
export type Revision = z.infer<typeof revision>;
/**
 * The answer to a save: the new revision number and the report of what was saved. A client that asks with
 * `Prefer: return=minimal` (RFC 7240; the editor, which runs the same engine itself) gets the report's
 * summary instead of the whole report (25 KB for the demo pitch run, on every autosave).
 */
export const graphSaved = z.object({
  revision: z.number().int(),
  createdAt: isoTime,
  analysis: z.custom<Report>().optional(),
  summary: z.custom<Report["summary"]>().optional(),
});
export type GraphSaved = z.infer<typeof graphSaved>;
