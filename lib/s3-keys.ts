import { ListObjectsV2Command, type S3Client } from "@aws-sdk/client-s3";

/** Every key in a bucket under a prefix, in key order, page by page (one listing answers at most 1,000 keys). */
export async function* eachKey(s3: S3Client, bucket: string, prefix = ""): AsyncGenerator<string> {
  let token: string | undefined;
  do {
    const r = await s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix || undefined, ContinuationToken: token }));
    for (const o of r.Contents ?? []) if (o.Key) yield o.Key;
    token = r.IsTruncated ? r.NextContinuationToken : undefined;
  } while (token);
}

export async function allKeys(s3: S3Client, bucket: string, prefix = ""): Promise<string[]> {
  const out: string[] = [];
  for await (const k of eachKey(s3, bucket, prefix)) out.push(k);
  return out;
}
