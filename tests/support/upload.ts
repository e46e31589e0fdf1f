/** Multipart uploads from tests, test images made with sharp, and a look into the local S3 fake. */
import { randomUUID } from "node:crypto";
import { S3Client, DeleteObjectCommand, PutObjectCommand } from "@aws-sdk/client-s3";
import { allKeys } from "@/lib/s3-keys";
import { APP_URL } from "./env";
import type { Client } from "./http";
import { testDb } from "./db";

/** The test-mode S3 fake started by scripts/services.mjs (LW_SERVICES_MODE=test). */
export const S3 = {
  endpoint: process.env.LW_TEST_S3_ENDPOINT || `http://127.0.0.1:${process.env.LW_S3_PORT || 4570}`,
  bucket: "linkwright",
};
export const s3Client = new S3Client({ endpoint: S3.endpoint, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } });

/** Every key in the bucket under a prefix (e.g. `builds/<id>/`). */
export async function s3Keys(prefix = ""): Promise<string[]> {
  return (await allKeys(s3Client, S3.bucket, prefix)).sort();
}

export async function upload(client: Client, path: string, file: { bytes: Buffer | Uint8Array; name: string; type?: string }, fields: Record<string, string> = {}, method = "POST") {
  const form = new FormData();
  form.set("file", new Blob([file.bytes as Uint8Array<ArrayBuffer>], { type: file.type ?? "application/octet-stream" }), file.name);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  const res = await fetch(`${APP_URL}${path}`, { method, headers: client.cookie ? { cookie: client.cookie } : {}, body: form, redirect: "manual" });
  return readJson(res);
}

/** A raw (non-multipart) body, as the editor posts its PNG. */
export async function uploadRaw(client: Client, path: string, bytes: Buffer | Uint8Array, type: string) {
  const res = await fetch(`${APP_URL}${path}`, { method: "POST", headers: { ...(client.cookie ? { cookie: client.cookie } : {}), "content-type": type }, body: bytes as Uint8Array<ArrayBuffer>, redirect: "manual" });
  return readJson(res);
}

async function readJson(res: Response) {
  const text = await res.text();
  let body: any = text;
  try { body = JSON.parse(text); } catch {}
  return { status: res.status, body };
}

export async function fetchBytes(client: Client, path: string) {
  const res = await fetch(`${APP_URL}${path}`, { headers: client.cookie ? { cookie: client.cookie } : {}, redirect: "manual" });
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) };
}

/** A small test photo: a two-colour JPEG/PNG/WebP of the given size, made with sharp. */
export async function testImage(format: "jpeg" | "png" | "webp" = "jpeg", width = 800, height = 600) {
  const sharp = (await import("sharp")).default;
  const half = await sharp({ create: { width: Math.ceil(width / 2), height, channels: 3, background: "#1f6f8b" } }).png().toBuffer();
  return sharp({ create: { width, height, channels: 3, background: "#e3b23c" } }).composite([{ input: half, left: 0, top: 0 }])[format]().toBuffer();
}

/** A stored file without going through the API (fixtures): the object in the fake and its row. */
export async function fixtureFile(buildId: string, userId: string | null, o: { kind?: "photo" | "linkage-picture"; bytes?: Buffer } = {}) {
  const id = randomUUID();
  const bytes = o.bytes ?? (await testImage("png", 64, 48));
  const key = `builds/${buildId}/files/${id}.png`;
  const thumbKey = `builds/${buildId}/thumbs/${id}.jpg`;
  await s3Client.send(new PutObjectCommand({ Bucket: S3.bucket, Key: key, Body: bytes, ContentType: "image/png" }));
  await s3Client.send(new PutObjectCommand({ Bucket: S3.bucket, Key: thumbKey, Body: bytes, ContentType: "image/jpeg" }));
  await testDb("files").insert({ id, build_id: buildId, key, kind: o.kind ?? "photo", content_type: "image/png", size: bytes.length, name: "fixture.png", thumb_key: thumbKey, width: 64, height: 48, uploaded_by: userId });
  return id;
}

/** Deletes objects from the S3 fake (a test's bulk fixtures, so later listings stay short). */
export async function deleteTestObjects(keys: string[]) {
  let next = 0;
  await Promise.all(Array.from({ length: 16 }, async () => {
    while (next < keys.length) await s3Client.send(new DeleteObjectCommand({ Bucket: S3.bucket, Key: keys[next++] })).catch(() => {});
  }));
}

/** An object put straight into the S3 fake (fixtures). */
export async function putTestObject(key: string, body: Buffer, contentType: string) {
  await s3Client.send(new PutObjectCommand({ Bucket: S3.bucket, Key: key, Body: body, ContentType: contentType }));
}
