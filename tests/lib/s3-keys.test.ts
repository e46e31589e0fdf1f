// The bucket listing behind backup, restore and the tests: every key past the 1,000 that one listing answers.
import { randomUUID } from "node:crypto";
import { DeleteObjectCommand, PutObjectCommand } from "@aws-sdk/client-s3";
import { afterAll, describe, expect, it } from "vitest";
import { allKeys, eachKey } from "@/lib/s3-keys";
import { S3, s3Client } from "../support/upload";

const prefix = `tests/s3-keys-${randomUUID()}/`;
const N = 1_205; // more than one listing page (S3 answers at most 1,000 keys a request)
const keys = Array.from({ length: N }, (_, i) => `${prefix}${String(i).padStart(5, "0")}.txt`);

describe("listing every key of the bucket", () => {
  afterAll(async () => {
    for (let i = 0; i < keys.length; i += 50) await Promise.all(keys.slice(i, i + 50).map((Key) => s3Client.send(new DeleteObjectCommand({ Bucket: S3.bucket, Key }))));
  }, 120_000);

  it("returns all of them, each once and in key order, past the first page", async () => {
    for (let i = 0; i < keys.length; i += 50) await Promise.all(keys.slice(i, i + 50).map((Key) => s3Client.send(new PutObjectCommand({ Bucket: S3.bucket, Key, Body: "x" }))));
    const listed = await allKeys(s3Client, S3.bucket, prefix);
    expect(listed).toHaveLength(N);
    expect(listed).toEqual(keys);
    // Under another prefix nothing of these shows.
    const other: string[] = [];
    for await (const k of eachKey(s3Client, S3.bucket, `${prefix}none/`)) other.push(k);
    expect(other).toEqual([]);
  }, 120_000);
});
