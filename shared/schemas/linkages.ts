/** The linkages of a build: create (empty or from a file), rename or re-file, and their revision history. */
import { z } from "zod";
import { graphSchema, systemSchema } from "../linkage/schema";
import type { Report } from "../analysis/types";
import { isoTime, notEmpty, pageFields, person, severityCounts, text } from "./common";

export const linkageCreate = z.object({ name: text("Linkage name", 120), system: systemSchema, graph: graphSchema.optional() });
export const linkagePatch = linkageCreate.pick({ name: true, system: true }).partial().refine(notEmpty, "Nothing to change");

export const linkage = z.object({
  id: z.string(),
  buildId: z.string(),
  name: z.string(),
  system: systemSchema,
  revision: z.number().int(),
  createdAt: isoTime,
  updatedAt: isoTime,
  /** Who saved the current revision (in lists only). */
  lastAuthor: z.string().nullable(),
  /** Findings of the current revision (in lists only). */
  summary: z.custom<Report["summary"]>().nullable(),
  /** Parts drawn in the current revision (in lists and on creation; null where not read): 0 is an empty drawing, which has no findings to count. */
  parts: z.number().int().nullable(),
});
export type Linkage = z.infer<typeof linkage>;
export const linkagesResponse = z.object({ linkages: z.array(linkage) });
export const linkageResponse = z.object({ linkage });

/** One row of the revision history. */
export const revisionRow = z.object({ revision: z.number().int(), author: person, createdAt: isoTime, summary: severityCounts.nullable() });
export type RevisionRow = z.infer<typeof revisionRow>;
/** A page of the revision history, newest first. */
export const revisionsResponse = z.object({ currentRevision: z.number().int(), revisions: z.array(revisionRow), ...pageFields });

const revisionStamp = z.object({ revision: z.number().int(), author: person, createdAt: isoTime });
export const diffResponse = z.object({ from: revisionStamp, to: revisionStamp, diff: z.custom<import("../review/diff").GraphDiff>() });
