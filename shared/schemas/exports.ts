/**
 * Exports made as background jobs: each kind with the zod schema of its parameters. A new kind
 * (a build archive, say) is one more entry here and one runner in lib/jobs/kinds.ts.
 */
import { z } from "zod";
import { logFilter } from "./log";
import { isoTime, pageFields, REVISION_MAX } from "./common";

export const EXPORT_KINDS = ["log-pdf", "checklist-pdf", "hardware-csv", "build-archive", "revision-record"] as const;
export type ExportKind = (typeof EXPORT_KINDS)[number];

export const exportParams = {
  "log-pdf": logFilter.strict(),
  "checklist-pdf": z.object({
    linkageId: z.string({ error: "linkageId is required" }).uuid("linkageId must be a linkage id"),
    revision: z.number().int().min(1).max(REVISION_MAX).optional(),
  }).strict(),
  "hardware-csv": z.object({}).strict(),
  "build-archive": z.object({}).strict(),
  /** The inspector's record of one signed-off revision (the newest sign-off of it). */
  "revision-record": z.object({
    linkageId: z.string({ error: "linkageId is required" }).uuid("linkageId must be a linkage id"),
    revision: z.number({ error: "revision is required" }).int().min(1).max(REVISION_MAX),
  }).strict(),
} satisfies Record<ExportKind, z.ZodTypeAny>;

export const exportRequest = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("log-pdf"), params: exportParams["log-pdf"].default({}) }),
  z.object({ kind: z.literal("checklist-pdf"), params: exportParams["checklist-pdf"] }),
  z.object({ kind: z.literal("hardware-csv"), params: exportParams["hardware-csv"].default({}) }),
  z.object({ kind: z.literal("build-archive"), params: exportParams["build-archive"].default({}) }),
  z.object({ kind: z.literal("revision-record"), params: exportParams["revision-record"] }),
], { error: `kind is one of ${EXPORT_KINDS.join(", ")}` });
export type ExportRequest = z.infer<typeof exportRequest>;

export type ExportStatus = "queued" | "running" | "done" | "failed";

/** What the API shows of a job. */
export const exportJob = z.object({
  id: z.string(), kind: z.enum(EXPORT_KINDS), label: z.string(), status: z.enum(["queued", "running", "done", "failed"]), progress: z.number(), progressNote: z.string(),
  estimatedBytes: z.number().nullable(), resultName: z.string().nullable(), resultSize: z.number().nullable(), error: z.string().nullable(),
  attempts: z.number().int(), createdAt: isoTime, startedAt: isoTime.nullable(), finishedAt: isoTime.nullable(), downloadUrl: z.string().nullable(),
});
export type ExportJobView = z.infer<typeof exportJob>;
export const exportJobResponse = z.object({ job: exportJob });
/** What a log PDF of a filter would hold, and about how large it would be. */
export const logEstimateResponse = z.object({
  estimate: z.object({ entries: z.number().int(), photos: z.number().int(), photoBytes: z.number(), revisions: z.number().int(), estimatedBytes: z.number(), large: z.boolean() }),
});


/**
 * A log PDF's size before it is made: each photo embedded once at thumbnail size, the text of each
 * entry, each tied revision's picture once. Measured on the bench's long build; an estimate, shown as "about".
 */
export const PDF_BYTES_PER_ENTRY = 1_200; // measured: text, rules and page furniture per entry (bench:scale)
export const PDF_BYTES_PER_REVISION_PICTURE = 60_000; // measured: a 1,000 px linkage picture as JPEG
/** Above this the page asks before it starts, and the finished job is e-mailed as well. */
export const LARGE_EXPORT_BYTES = 20 * 1024 * 1024;

/** "Larkspur LX-2" → "larkspur-lx-2" for file names. */
export const slug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 60) || "build";
