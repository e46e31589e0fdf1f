import "server-only";
/** The verification page's lookup: a fingerprint (typed, or read from a record PDF's keywords) → the signed revision. */
import { PDFDocument } from "pdf-lib";
import { signedRevisionByFingerprint } from "@/db/signoffs";
import { fieldError } from "./errors";
import { normaliseFingerprint } from "./record-fingerprint";
import type { VerifyResponse } from "@/shared/schemas/verify";

export async function verifyFingerprint(typed: string): Promise<VerifyResponse> {
  const fp = normaliseFingerprint(typed);
  if (!fp) throw fieldError("fingerprint", "must be the 64 hexadecimal digits printed on the record (spaces are fine)", "That is not a record fingerprint.");
  const record = await signedRevisionByFingerprint(fp);
  return { fingerprint: fp, match: !!record, record };
}

const MARK = "linkwright-record-fingerprint:";

/** The fingerprint in a record PDF's keywords (lib/records-pdf.ts revisionRecordPdf writes it there). */
export async function fingerprintOfPdf(bytes: Buffer): Promise<string> {
  if (bytes.subarray(0, 5).toString("latin1") !== "%PDF-") throw fieldError("file", "is not a PDF", "Upload the record PDF as it was downloaded.");
  let keywords: string | undefined;
  try {
    const pdf = await PDFDocument.load(bytes, { updateMetadata: false, ignoreEncryption: true });
    keywords = pdf.getKeywords();
  } catch {
    throw fieldError("file", "could not be read as a PDF", "The PDF could not be read; type the fingerprint printed on it instead.");
  }
  const at = keywords?.indexOf(MARK) ?? -1;
  if (!keywords || at < 0) throw fieldError("file", "has no revision-record fingerprint", "This PDF is not a revision record from this site (it has no fingerprint); type the fingerprint printed on it instead.");
  return keywords.slice(at + MARK.length, at + MARK.length + 64);
}
