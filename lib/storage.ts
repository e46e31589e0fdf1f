import "server-only";
import { S3Client, PutObjectCommand, GetObjectCommand, DeleteObjectCommand, HeadObjectCommand, ListObjectsV2Command } from "@aws-sdk/client-s3";

/**
 * File storage through the S3 API. S3_ENDPOINT, S3_BUCKET, S3_REGION, S3_ACCESS_KEY_ID and
 * S3_SECRET_ACCESS_KEY configure it; in dev and test they point at the local S3-compatible fake.
 */
const g = globalThis as unknown as { __lwS3?: S3Client };

function client() {
  g.__lwS3 ??= new S3Client({
    endpoint: process.env.S3_ENDPOINT,
    region: process.env.S3_REGION || "us-east-1",
    forcePathStyle: true,
    // Checksums only where the API requires them: a streamed upload otherwise goes out in the SDK's chunked
    // encoding with a trailing checksum, which S3-compatible stores (the local fake among them) keep as part of the object.
    requestChecksumCalculation: "WHEN_REQUIRED",
    credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID || "", secretAccessKey: process.env.S3_SECRET_ACCESS_KEY || "" },
  });
  return g.__lwS3;
}
const bucket = () => {
  if (!process.env.S3_BUCKET) throw new Error("S3_BUCKET is not set");
  return process.env.S3_BUCKET;
};

export async function putObject(key: string, body: Buffer, contentType: string) {
  await client().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType }));
}

/** A file on disk streamed to storage (its size known, so nothing is held in memory). */
export async function putObjectFile(key: string, file: string, size: number, contentType: string) {
  const { createReadStream } = await import("node:fs");
  await client().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: createReadStream(file), ContentLength: size, ContentType: contentType }));
}

export async function getObject(key: string): Promise<Buffer | null> {
  try {
    const r = await client().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    return Buffer.from(await r.Body!.transformToByteArray());
  } catch (e) {
    if ((e as { name?: string }).name === "NoSuchKey") return null;
    throw e;
  }
}

export async function deleteObject(key: string) {
  await client().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}

/** The object as a web stream (for streaming it to the browser without holding it in memory). */
export async function getObjectStream(key: string): Promise<{ body: ReadableStream; length: number | undefined } | null> {
  try {
    const r = await client().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    return { body: r.Body!.transformToWebStream() as ReadableStream, length: r.ContentLength };
  } catch (e) {
    if ((e as { name?: string }).name === "NoSuchKey") return null;
    throw e;
  }
}

/** When the object was last written, or null when there is none. */
export async function objectWrittenAt(key: string): Promise<Date | null> {
  try {
    const r = await client().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }));
    return r.LastModified ?? null;
  } catch (e) {
    const name = (e as { name?: string }).name;
    if (name === "NotFound" || name === "NoSuchKey") return null;
    throw e;
  }
}

/** The objects under a prefix, a listing page (at most 1,000) at a time, each with when it was written. */
export async function* eachObjectPage(prefix: string): AsyncGenerator<{ key: string; writtenAt: Date }[]> {
  let token: string | undefined;
  do {
    const r = await client().send(new ListObjectsV2Command({ Bucket: bucket(), Prefix: prefix, ContinuationToken: token }));
    const page = (r.Contents ?? []).filter((o) => o.Key && o.LastModified).map((o) => ({ key: o.Key!, writtenAt: o.LastModified! }));
    if (page.length) yield page;
    token = r.IsTruncated ? r.NextContinuationToken : undefined;
  } while (token);
}
