/** Sign-offs: a reviewer signs the current revision with a statement; a later revision makes it stale. */
import { z } from "zod";
import { isoTime, person, revisionNumber, text } from "./common";

export const signoffCreate = z.object({ revision: revisionNumber(), statement: text("Statement", 4000) });

export const signoff = z.object({
  id: z.string(),
  revision: z.number().int(),
  reviewer: person,
  statement: z.string(),
  createdAt: isoTime,
  /** A later revision exists: the sign-off no longer covers the linkage as it is. */
  stale: z.boolean(),
  /** The fingerprint printed on the revision's record PDF (lib/record-fingerprint.ts). */
  fingerprint: z.string().nullable(),
});
export type Signoff = z.infer<typeof signoff>;
export const signoffStatus = z.object({ state: z.enum(["none", "signed", "stale"]), latest: signoff.nullable() });
export const signoffsResponse = z.object({ currentRevision: z.number().int(), status: signoffStatus, signoffs: z.array(signoff) });
