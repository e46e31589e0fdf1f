import "server-only";
import { randomUUID } from "node:crypto";
import type { Knex } from "knex";
import type { NextRequest } from "next/server";
import { db } from "@/db/index";
import { insertFile, type FileKind, type StoredFile } from "@/db/files";
import { ApiError } from "./errors";
import { readBodyCapped } from "./body";
import { deleteObject, putObject } from "./storage";

/** Size caps by kind, bytes. */
export const PHOTO_MAX_BYTES = 10 * 1024 * 1024;
export const PDF_MAX_BYTES = 20 * 1024 * 1024;
/** Accepted photo formats (detected from the bytes). HEIC is refused: sharp's prebuilt libvips has no HEVC decoder. */
export const PHOTO_TYPES: Record<string, string> = { "image/jpeg": "jpg", "image/png": "png", "image/webp": "webp" };
const THUMB_SIZE = 320;

export type Upload = { bytes: Buffer; name: string };

/** Room a multipart form needs around its file (boundaries, part headers, small fields). */
const FORM_OVERHEAD_BYTES = 64 * 1024;
/**
 * The most pixels a photo may declare in its header: a 48-megapixel phone photo fits; more is refused
 * before it is decoded (a small compressed file can declare a huge, memory-filling picture).
 */
export const PHOTO_MAX_PIXELS = 50_000_000; // common practice, no source

/**
 * Reads the one file of a request: multipart/form-data with a `file` field, or a raw image body
 * (the editor posts the PNG blob as is). The cap is counted while the body streams in (a declared
 * Content-Length over it is refused before reading), so no more than the cap is ever held.
 */
export async function readUpload(req: NextRequest, maxBytes = PDF_MAX_BYTES): Promise<Upload & { fields: Record<string, string> }> {
  const type = req.headers.get("content-type") || "";
  if (type.startsWith("multipart/form-data")) {
    const body = await readBodyCapped(req, maxBytes + FORM_OVERHEAD_BYTES, () => tooLarge(maxBytes));
    let form: FormData;
    try {
      form = await new Response(new Uint8Array(body), { headers: { "content-type": type } }).formData();
    } catch {
      throw new ApiError("invalid_upload", "The upload could not be read as a form.", { file: "missing or unreadable" });
    }
    const file = form.get("file");
    if (!file || typeof file === "string") throw new ApiError("invalid_upload", "Choose a file to upload.", { file: "no file in the form's \"file\" field" });
    if (file.size > maxBytes) throw tooLarge(maxBytes);
    const fields: Record<string, string> = {};
    for (const [k, v] of form.entries()) if (typeof v === "string") fields[k] = v;
    return { bytes: Buffer.from(await file.arrayBuffer()), name: file.name || "", fields };
  }
  const bytes = await readBodyCapped(req, maxBytes, () => tooLarge(maxBytes));
  if (!bytes.length) throw new ApiError("invalid_upload", "The upload is empty.", { file: "empty" });
  return { bytes, name: req.headers.get("x-file-name") || "", fields: {} };
}

const tooLarge = (max: number) => new ApiError("too_large", `The file is larger than ${Math.round(max / 1024 / 1024)} MB.`, { file: "too large" });

/**
 * A display name safe to keep and to send back in Content-Disposition: no path parts, no control
 * characters. Names that try to leave their folder ("../", "/", "\", NUL) are refused outright.
 */
export function sanitizeName(raw: string, ext: string): string {
  const name = raw.normalize("NFC");
  if (/[\/\\\u0000]/.test(name) || /(^|[\/\\])\.\.([\/\\]|$)/.test(name) || name === "..") {
    throw new ApiError("invalid_name", "The file name contains a path; upload the file under its own name.", { file: "name has a path in it" });
  }
  let base = name.replace(/[\u0000-\u001f\u007f]/g, "").replace(/[^\p{L}\p{N} ._()+,-]/gu, "_").replace(/\s+/g, " ").replace(/^[.\s]+/, "").trim();
  base = base.replace(/\.[A-Za-z0-9]{1,5}$/, "");
  if (!base) base = ext === "pdf" ? "document" : "photo";
  return `${base.slice(0, 120)}.${ext}`;
}

export type Detected = { kind: "photo" | "pdf"; mime: string; ext: string };

/** The type by the file's bytes; the name and the client's content type are ignored. */
export async function detectType(bytes: Buffer): Promise<Detected> {
  const { fileTypeFromBuffer } = await import("file-type");
  const t = await fileTypeFromBuffer(bytes);
  if (t && PHOTO_TYPES[t.mime]) return { kind: "photo", mime: t.mime, ext: PHOTO_TYPES[t.mime] };
  if (t?.mime === "application/pdf") return { kind: "pdf", mime: t.mime, ext: "pdf" };
  if (t && (t.mime === "image/heic" || t.mime === "image/heif" || t.ext === "heic")) {
    throw new ApiError("unsupported_type", "HEIC photos cannot be read here. Export the photo as JPEG (on a phone: share it as JPEG or set the camera to “most compatible”) and upload that.", { file: "HEIC is not accepted" });
  }
  throw new ApiError("unsupported_type", `This file is ${t ? `a ${t.ext.toUpperCase()} file` : "not a recognised photo or PDF"}. Upload a JPEG, PNG or WebP photo, or a PDF.`, { file: "not a JPEG, PNG, WebP or PDF" });
}

/**
 * Stores one upload: checks the type by content and the size cap, makes the thumbnail, writes the
 * objects, then inserts the row (and `attach` links it) in one transaction. Anything failing on the way
 * removes the objects already written, so a failed upload leaves no row and no object behind.
 */
export async function storeUpload(o: {
  buildId: string;
  userId: string;
  upload: Upload;
  accept: ("photo" | "pdf")[];
  kind?: FileKind;
  attach?: (trx: Knex.Transaction, file: StoredFile) => Promise<void>;
}): Promise<StoredFile> {
  const { bytes } = o.upload;
  const t = await detectType(bytes);
  if (!o.accept.includes(t.kind)) {
    throw new ApiError("unsupported_type", o.accept.includes("photo") ? "Upload a JPEG, PNG or WebP image here." : "Upload a PDF here.", { file: `a ${t.kind} is not accepted here` });
  }
  const cap = t.kind === "pdf" ? PDF_MAX_BYTES : PHOTO_MAX_BYTES;
  if (bytes.length > cap) throw tooLarge(cap);
  const name = sanitizeName(o.upload.name, t.ext);

  const id = randomUUID();
  const key = `builds/${o.buildId}/files/${id}.${t.ext}`;
  let thumbKey: string | null = null;
  let thumb: Buffer | null = null;
  let width: number | null = null;
  let height: number | null = null;
  if (t.kind === "photo") {
    const sharp = (await import("sharp")).default;
    // The header alone first (no pixels decoded): how big the picture says it is.
    let meta: Awaited<ReturnType<ReturnType<typeof sharp>["metadata"]>>;
    try {
      meta = await sharp(bytes, { limitInputPixels: false }).metadata();
    } catch {
      throw new ApiError("unreadable_image", "The image is damaged or cannot be decoded.", { file: "cannot be decoded" });
    }
    if (!meta.width || !meta.height) throw new ApiError("unreadable_image", "The image is damaged or cannot be decoded.", { file: "cannot be decoded" });
    if (meta.width * meta.height > PHOTO_MAX_PIXELS) {
      throw new ApiError("too_large", `The image is ${meta.width} × ${meta.height} pixels; photos of up to ${PHOTO_MAX_PIXELS / 1e6} megapixels are accepted.`, { file: "too many pixels" });
    }
    try {
      const img = sharp(bytes, { failOn: "error", limitInputPixels: PHOTO_MAX_PIXELS }).rotate();
      width = meta.autoOrient?.width ?? meta.width ?? null;
      height = meta.autoOrient?.height ?? meta.height ?? null;
      thumb = await img.resize(THUMB_SIZE, THUMB_SIZE, { fit: "inside", withoutEnlargement: true }).jpeg({ quality: 78 }).toBuffer();
    } catch {
      throw new ApiError("unreadable_image", "The image is damaged or cannot be decoded.", { file: "cannot be decoded" });
    }
    thumbKey = `builds/${o.buildId}/thumbs/${id}.jpg`;
  }

  const written: string[] = [];
  try {
    await putObject(key, bytes, t.mime);
    written.push(key);
    if (thumb && thumbKey) {
      await putObject(thumbKey, thumb, "image/jpeg");
      written.push(thumbKey);
    }
    return await db.transaction(async (trx) => {
      const file = await insertFile({ id, buildId: o.buildId, key, kind: o.kind ?? t.kind, contentType: t.mime, size: bytes.length, name, thumbKey, thumbSize: thumb?.length ?? null, width, height, uploadedBy: o.userId }, trx, thumb);
      if (o.attach) await o.attach(trx, file);
      return file;
    });
  } catch (e) {
    await Promise.all(written.map((k) => deleteObject(k).catch(() => {})));
    throw e;
  }
}

/** Removes a file's objects (after its row is gone). */
export async function removeObjects(keys: { key: string; thumbKey: string | null }) {
  await deleteObject(keys.key).catch(() => {});
  if (keys.thumbKey) await deleteObject(keys.thumbKey).catch(() => {});
}
