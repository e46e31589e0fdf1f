import { json, parseBody, withErrors } from "@/lib/http";
import { verifyFingerprint } from "@/lib/verify";
import { verifyRequest } from "@/shared/schemas/verify";

/** Public: does a typed fingerprint name a signed revision, and does that sign-off still cover the linkage? */
export const POST = withErrors(async ({ req }) => {
  const body = await parseBody(req, verifyRequest);
  return json(await verifyFingerprint(body.fingerprint));
});
