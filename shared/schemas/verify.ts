/** The verification of a revision record: a fingerprint typed (or read from the record PDF) and what it names. */
import { z } from "zod";
import { isoTime } from "./common";

export const verifyRequest = z.object({
  fingerprint: z.string({ error: "Enter the fingerprint printed on the record" }).max(200, "A fingerprint is 64 hexadecimal digits"),
}).strict();

export const verifyResponse = z.object({
  /** The fingerprint as read, 64 hex digits. */
  fingerprint: z.string(),
  match: z.boolean(),
  record: z.object({
    buildName: z.string(),
    registration: z.string().nullable(),
    linkageName: z.string(),
    revision: z.number().int(),
    signedBy: z.string(),
    signedAt: isoTime,
    currentRevision: z.number().int(),
    /** No later revision: the sign-off still covers the linkage as it is. */
    current: z.boolean(),
  }).nullable(),
});
export type VerifyResponse = z.infer<typeof verifyResponse>;
