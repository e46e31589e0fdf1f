/** Request bodies of the build-records API (log, parts, hardware, checklist), one zod schema per boundary. */
import { z } from "zod";
import { SYSTEMS } from "./linkage/schema";
import { partInput } from "./records/parts";
import { HARDWARE_STATES } from "./records/hardware";
import { ITEM_CODES } from "./records/checklist";
import { REVISION_MAX } from "./api";

export { partInput };

const isoDate = z.string({ error: "date is required (YYYY-MM-DD)" }).regex(/^\d{4}-\d{2}-\d{2}$/, "date must be YYYY-MM-DD")
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s) && s.slice(0, 4) !== "0000", "not a calendar date"); // Postgres has no year 0

export const logEntryInput = z.object({
  date: isoDate,
  hours: z.number({ error: "hours must be a number" }).min(0, "hours cannot be negative").max(24, "at most 24 hours in one entry"),
  title: z.string({ error: "title is required" }).trim().min(1, "title is required").max(200, "title is at most 200 characters"),
  text: z.string().max(20_000, "text is at most 20,000 characters").default(""),
  systems: z.array(z.enum(SYSTEMS, { error: `systems are ${SYSTEMS.join(", ")}` })).max(6).default([]),
  /** Optionally the linkage revision this work concerns: its picture and findings show in the entry. */
  linkageId: z.string().uuid("linkageId must be a linkage id").nullable().optional(),
  revision: z.number().int().min(1).max(REVISION_MAX).nullable().optional(),
  /** Uploaded files (photos, PDFs) of this build to attach, in order. */
  fileIds: z.array(z.string().uuid("fileIds must be file ids")).max(40).default([]),
}).refine((v) => !v.revision || v.linkageId, { path: ["revision"], message: "a revision needs a linkageId" });
export const logEntryPatch = z.object({
  date: isoDate.optional(),
  hours: z.number({ error: "hours must be a number" }).min(0).max(24).optional(),
  title: z.string().trim().min(1, "title is required").max(200).optional(),
  text: z.string().max(20_000).optional(),
  systems: z.array(z.enum(SYSTEMS)).max(6).optional(),
  linkageId: z.string().uuid().nullable().optional(),
  revision: z.number().int().min(1).max(REVISION_MAX).nullable().optional(),
  fileIds: z.array(z.string().uuid()).max(40).optional(),
}).refine((v) => Object.keys(v).length > 0, "Nothing to change");

export const logFilter = z.object({
  system: z.enum(SYSTEMS).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  q: z.string().max(200).refine((s) => !s.includes("\u0000"), "must not contain NUL characters").optional(),
});

export const partPatch = partInput;

export const partsImport = z.object({
  csv: z.string({ error: "csv is required (the file's text)" }).min(1, "the file is empty").max(2_000_000, "a parts file is at most 2 MB"),
  skipBadRows: z.boolean().default(false),
  /** Check only: report what would be imported, import nothing. */
  dryRun: z.boolean().default(false),
});

export const hardwareStatePut = z.object({
  key: z.string({ error: "key is required" }).min(1).max(200),
  state: z.enum(HARDWARE_STATES, { error: `state is one of ${HARDWARE_STATES.join(", ")}` }),
});

export const checklistTick = z.object({
  revision: z.number({ error: "revision is required" }).int().min(1).max(REVISION_MAX),
  jointId: z.string().max(64).default(""),
  code: z.enum(ITEM_CODES, { error: "unknown checklist item" }),
  ticked: z.boolean({ error: "ticked must be true or false" }),
  note: z.string().max(2000, "a note is at most 2,000 characters").optional(),
});

export const jointPhotoLink = z.object({ fileId: z.string({ error: "fileId is required" }).uuid("fileId must be a file id") });
