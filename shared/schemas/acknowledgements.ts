/** Acknowledgements: a reviewer or the owner accepts a finding with a reason; a change to its subject lapses it. */
import { z } from "zod";
import type { Finding } from "../analysis/types";
import { isoTime, person, subjectSchema, text } from "./common";

export const acknowledgementCreate = z.object({
  code: z.string({ error: "Finding code is required" }).trim().min(1, "Finding code is required").max(80),
  subject: subjectSchema,
  reason: text("Reason", 4000),
});

export const acknowledgement = z.object({
  id: z.string(),
  code: z.string(),
  subject: subjectSchema,
  reason: z.string(),
  by: person,
  revision: z.number().int(),
  /** What the subject looked like when acknowledged: a different fingerprint lapses the acknowledgement. */
  fingerprint: z.string(),
  createdAt: isoTime,
});
export type Acknowledgement = z.infer<typeof acknowledgement>;
export const ackView = acknowledgement.extend({ status: z.enum(["active", "lapsed"]) });
export type AckView = z.infer<typeof ackView>;

/** A finding of the current revision, its subject by name, with the acknowledgement that covers it, or the one that lapsed. */
export const findingView = z.custom<Finding>().and(
  z.object({ subjectName: z.string(), acknowledgement: acknowledgement.nullable(), lapsed: acknowledgement.nullable() }),
);
export type FindingView = Finding & { subjectName: string; acknowledgement: Acknowledgement | null; lapsed: Acknowledgement | null };

export const acknowledgementsResponse = z.object({ revision: z.number().int(), findings: z.array(findingView), acknowledgements: z.array(ackView) });
