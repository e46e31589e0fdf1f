import "server-only";
import { z } from "zod";
import type { NextRequest } from "next/server";
import { parseBody } from "./http";
import { getObjectStream } from "./storage";
import { fieldError, notFound } from "./errors";

/** Upload routes take multipart/form-data (or a raw image); a JSON body is answered with a 400 that says so. */
const noJson = z.object({ file: z.never({ error: "send the file as multipart/form-data in a field named \"file\"" }) });

export async function refuseJsonUpload(req: NextRequest) {
  if ((req.headers.get("content-type") || "").includes("application/json")) {
    await parseBody(req, noJson);
    throw fieldError("file", "not a file upload", "Send the file as multipart/form-data.");
  }
}

/** Streams a stored object to a member, with headers that keep the browser from sniffing or executing it. */
export async function streamObject(key: string, o: { contentType: string; name: string; download?: boolean }) {
  const obj = await getObjectStream(key);
  if (!obj) throw notFound("file");
  const headers = new Headers({
    "content-type": o.contentType,
    "content-disposition": `${o.download ? "attachment" : "inline"}; filename="${o.name.replace(/[^\x20-\x7e]|"/g, "_")}"; filename*=UTF-8''${encodeURIComponent(o.name)}`,
    "x-content-type-options": "nosniff",
    "cache-control": "private, max-age=3600",
  });
  if (o.contentType.startsWith("image/")) headers.set("content-security-policy", "default-src 'none'; style-src 'unsafe-inline'");
  if (obj.length !== undefined) headers.set("content-length", String(obj.length));
  return new Response(obj.body, { status: 200, headers });
}

export const jointIdParam = z.string().min(1).max(64).regex(/^[A-Za-z0-9._:-]+$/);

export const csvResponse = (csv: string, filename: string) =>
  new Response(csv, { status: 200, headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${filename}"`, "x-content-type-options": "nosniff" } });

export const pdfResponse = (bytes: Uint8Array, filename: string) =>
  new Response(Buffer.from(bytes), { status: 200, headers: { "content-type": "application/pdf", "content-disposition": `inline; filename="${filename}"`, "x-content-type-options": "nosniff", "cache-control": "private, no-store" } });

export { slug } from "@/shared/schemas/exports";
