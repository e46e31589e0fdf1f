import { json, withErrors } from "@/lib/http";
import { PDF_MAX_BYTES, readUpload } from "@/lib/uploads";
import { fingerprintOfPdf, verifyFingerprint } from "@/lib/verify";

/** Public: the same check from an uploaded record PDF (the fingerprint is in its keywords); nothing is kept. */
export const POST = withErrors(async ({ req }) => {
  const { bytes } = await readUpload(req, PDF_MAX_BYTES);
  return json(await verifyFingerprint(await fingerprintOfPdf(bytes)));
});
