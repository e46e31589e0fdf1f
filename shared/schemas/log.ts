/** The build log: dated entries with hours, systems, attached files and optionally the linkage revision they concern. */
import { z } from "zod";
import { SYSTEMS, systemSchema, type ControlSystem } from "../linkage/schema";
import { isoTime, pageFields, patchWithSomething, REVISION_MAX, severityCounts } from "./common";
import { storedFile } from "./files";

const isoDate = z.string({ error: "date is required (YYYY-MM-DD)" }).regex(/^\d{4}-\d{2}-\d{2}$/, "date must be YYYY-MM-DD")
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s) && s.slice(0, 4) !== "0000", "not a calendar date"); // Postgres has no year 0

const entryFields = z.object({
  date: isoDate,
  hours: z.number({ error: "hours must be a number" }).min(0, "hours cannot be negative").max(24, "at most 24 hours in one entry"),
  // Said to the person writing the entry (the form shows it under the Title box).
  title: z.string({ error: "Enter a title" }).trim().min(1, "Enter a title").max(200, "A title is at most 200 characters"),
  text: z.string().max(20_000, "text is at most 20,000 characters").default(""),
  systems: z.array(z.enum(SYSTEMS, { error: `systems are ${SYSTEMS.join(", ")}` })).max(6).default([]),
  /** Optionally the linkage revision this work concerns: its picture and findings show in the entry. */
  linkageId: z.string().uuid("linkageId must be a linkage id").nullable().optional(),
  revision: z.number().int().min(1).max(REVISION_MAX).nullable().optional(),
  /** Uploaded files (photos, PDFs) of this build to attach, in order. */
  fileIds: z.array(z.string().uuid("fileIds must be file ids")).max(40).default([]),
});
export const logEntryInput = entryFields.refine((v) => !v.revision || v.linkageId, { path: ["revision"], message: "a revision needs a linkageId" });
export const logEntryPatch = patchWithSomething(entryFields);
export type LogEntryValues = z.output<typeof logEntryInput>;

export const logFilter = z.object({
  system: z.enum(SYSTEMS).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  q: z.string().max(200).refine((s) => !s.includes("\u0000"), "must not contain NUL characters").optional(),
});
export type LogFilter = z.infer<typeof logFilter>;

export const logEntry = z.object({
  id: z.string(),
  date: z.string(),
  hours: z.number(),
  title: z.string(),
  text: z.string(),
  systems: z.array(systemSchema),
  linkageId: z.string().nullable(),
  linkageName: z.string().nullable(),
  revision: z.number().int().nullable(),
  /** Findings counts of the tied revision, as stored with it. */
  revisionSummary: severityCounts.nullable(),
  /** Whether a picture of the tied revision was kept for the log. */
  hasPicture: z.boolean(),
  /** The author's name (null once the account is gone). */
  author: z.string().nullable(),
  createdAt: isoTime,
  updatedAt: isoTime,
  files: z.array(storedFile),
});
export type LogEntry = z.infer<typeof logEntry>;
/** Hours by system and by month ("unassigned" for an entry without systems). */
export const logTotals = z.object({
  total: z.number(),
  bySystem: z.record(z.string(), z.number()),
  /** Per month ("2026-11"): its total and hours per system. */
  byMonth: z.array(z.custom<{ month: string; total: number } & Partial<Record<ControlSystem | "unassigned", number>>>((v) => !!v && typeof v === "object" && typeof (v as { month?: unknown }).month === "string")),
});
export type LogTotals = z.infer<typeof logTotals>;
/** A page of entries; the first page (no cursor) carries the hour totals over every matching entry. */
export const logResponse = z.object({ entries: z.array(logEntry), ...pageFields, totals: logTotals.optional() });
export const logEntryResponse = z.object({ entry: logEntry });
