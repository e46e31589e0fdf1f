/**
 * The fingerprint of a signed-off revision: SHA-256 over what the reviewer signed — the build, the linkage,
 * the revision number, the revision's graph exactly as stored, and the sign-off (who, when, the statement) —
 * in one canonical text (object keys sorted). Printed on the revision's record PDF and kept with the
 * sign-off, so the verification page can say whether a record matches a signed revision.
 * Plain Node (no "server-only"): the migration that fills it in for older sign-offs uses it too.
 */
import { createHash } from "node:crypto";
import { stableStringify } from "@/shared/review/fingerprint";

export type SignedRevision = {
  buildId: string;
  linkageId: string;
  revision: number;
  graph: unknown;
  signoff: { id: string; reviewerId: string | null; statement: string; signedAt: string };
};

export function recordFingerprint(s: SignedRevision): string {
  return createHash("sha256").update(stableStringify({ v: 1, ...s }), "utf8").digest("hex");
}

/** "3f2a 9c01 …": 16 groups of four, as printed and as a person types it. */
export const groupFingerprint = (hex: string) => hex.match(/.{1,4}/g)?.join(" ") ?? hex;

/** What a person typed or pasted: spaces, dashes and case ignored; null unless it is 64 hex digits. */
export function normaliseFingerprint(s: string): string | null {
  const hex = s.replace(/[\s-]/g, "").toLowerCase();
  return /^[0-9a-f]{64}$/.test(hex) ? hex : null;
}
