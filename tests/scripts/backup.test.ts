/**
 * `npm run backup` / `npm run restore` round trip on the real test database and the local S3 fake, while
 * the app is serving: the demo build gets photos and log entries through the API, the backup goes into a
 * fresh database and bucket, and every table's rows and every object's checksum are compared. An altered
 * or truncated file, and a non-empty target without --replace, are refused and leave the target unchanged.
 */
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import knex, { type Knex } from "knex";
import { CreateBucketCommand, DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { eachKey } from "@/lib/s3-keys";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_BUILD, DEMO_USERS } from "@/db/demo-accounts";
import { testDb } from "../support/db";
import { TEST_DB_URL, testClusterUrl } from "../support/env";
import { signIn } from "../support/http";
import { S3, testImage, upload } from "../support/upload";

const ROOT = path.resolve(__dirname, "../..");
const OUT = path.join(ROOT, "tests/artifacts/backups");
const TARGET_DB = "linkwright_restore_test";
const TARGET_BUCKET = `restore-${process.pid}`;
const s3 = new S3Client({ endpoint: S3.endpoint, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } });
const s3env = { S3_ENDPOINT: S3.endpoint, S3_REGION: "us-east-1", S3_ACCESS_KEY_ID: "S3RVER", S3_SECRET_ACCESS_KEY: "S3RVER" };
let target: Knex;
let file = "";

function run(script: string, args: string[], env: Record<string, string>) {
  const r = spawnSync(process.execPath, ["--import", "tsx", script, ...args], { cwd: ROOT, encoding: "utf8", env: { ...process.env, ...env }, timeout: 180_000 });
  return { status: r.status, out: r.stdout + r.stderr };
}
const restore = (f: string, ...flags: string[]) => run("scripts/restore.ts", [f, ...flags], { ...s3env, DATABASE_URL: testClusterUrl(TARGET_DB), S3_BUCKET: TARGET_BUCKET });

/** Every table's rows (count and digest of the rows in order). */
async function tables(conn: Knex) {
  const names = ((await conn.raw("select tablename from pg_tables where schemaname = 'public' order by 1")).rows as { tablename: string }[]).map((r) => r.tablename);
  const out: Record<string, string> = {};
  for (const n of names) {
    const r = await conn.raw(`select count(*)::int as n, coalesce(md5(string_agg(t::text, '|' order by t::text)), '') as h from "${n}" t`);
    out[n] = `${r.rows[0].n}:${r.rows[0].h}`;
  }
  return out;
}

/** Every object's SHA-256, by key. */
async function objects(bucket: string) {
  const out: Record<string, string> = {};
  for await (const key of eachKey(s3, bucket)) {
    const body = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    out[key] = createHash("sha256").update(await body.Body!.transformToByteArray()).digest("hex");
  }
  return out;
}

/** Offset of an entry's data in a tar file (512-byte headers; size in octal at 124). */
function entryOffset(tarBytes: Buffer, name: string) {
  for (let at = 0; at + 512 <= tarBytes.length; ) {
    const entry = tarBytes.subarray(at, at + 100).toString("utf8").replace(/\0.*$/s, "");
    const size = parseInt(tarBytes.subarray(at + 124, at + 136).toString("utf8").replace(/\0.*$/s, "").trim() || "0", 8);
    if (entry === name) return at + 512;
    at += 512 + Math.ceil(size / 512) * 512;
  }
  throw new Error(`${name} not in the tar`);
}

beforeAll(async () => {
  rmSync(OUT, { recursive: true, force: true });
  mkdirSync(OUT, { recursive: true });
  const reset = spawnSync(process.execPath, ["--import", "tsx", "scripts/reset-db.ts", TARGET_DB], { cwd: ROOT, encoding: "utf8" });
  expect(reset.status, reset.stderr).toBe(0);
  await s3.send(new CreateBucketCommand({ Bucket: TARGET_BUCKET }));
  target = knex({ client: "pg", connection: testClusterUrl(TARGET_DB), pool: { min: 0, max: 2 } });

  // The demo build gets photos and log entries, through the app.
  const dana = DEMO_USERS[0];
  const owner = await signIn(dana.email, dana.password);
  const build = await testDb("builds").where({ name: DEMO_BUILD.name }).orderBy("created_at").first("id");
  const B = `/api/builds/${build.id}`;
  const photos = [];
  for (const [i, format] of (["jpeg", "png"] as const).entries()) {
    const r = await upload(owner, `${B}/files`, { bytes: await testImage(format, 640 + i * 16, 480), name: `pushrod ${i}.${format}` });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    photos.push(r.body.file.id);
  }
  const entry = await owner.request("POST", `${B}/log`, { date: "2026-11-20", hours: 2.5, title: "Fitted the aft pushrod", text: "Jam nut torqued, witness hole checked.", systems: ["pitch"], fileIds: photos });
  expect(entry.status, JSON.stringify(entry.body)).toBe(201);
  // Exports that earlier test files started change their rows as the worker runs them: let it finish,
  // so the source compared after the backup is the source that was backed up.
  for (const until = Date.now() + 300_000; Date.now() < until; await new Promise((r) => setTimeout(r, 500))) {
    const [{ n }] = await testDb("export_jobs").whereIn("status", ["queued", "running"]).count<{ n: string }[]>("* as n");
    if (Number(n) === 0) break;
  }
}, 360_000);

afterAll(async () => {
  await target?.destroy();
  await testDb.destroy();
});

describe("backup and restore", () => {
  it("backs up while the app serves and restores into a fresh database and bucket, row for row and byte for byte", async () => {
    const b = run("scripts/backup.ts", [OUT], { ...s3env, DATABASE_URL: TEST_DB_URL, S3_BUCKET: S3.bucket });
    expect(b.status, b.out).toBe(0);
    expect(b.out).toMatch(/objects \d+\/\d+ \([\d.]+ MB\)/); // progress
    const made = readdirSync(OUT);
    expect(made).toHaveLength(1);
    expect(made[0]).toMatch(/^linkwright-\d{4}-\d\d-\d\dT\d\d-\d\d-\d\dZ\.tar$/);
    file = path.join(OUT, made[0]);

    const source = await tables(testDb);
    const sourceObjects = await objects(S3.bucket);
    expect(Number(source.log_entry_files.split(":")[0])).toBeGreaterThanOrEqual(2);
    expect(Object.keys(sourceObjects).length).toBeGreaterThanOrEqual(4); // two photos and their thumbnails at least

    const r = restore(file);
    expect(r.status, r.out).toBe(0);
    expect(await tables(target)).toEqual(source);
    expect(await objects(TARGET_BUCKET)).toEqual(sourceObjects);
  });

  it("refuses a target that is not empty unless asked to replace it", async () => {
    const before = { db: await tables(target), objects: await objects(TARGET_BUCKET) };
    const r = restore(file);
    expect(r.status, r.out).toBe(2);
    expect(r.out).toContain("the target is not empty");
    expect({ db: await tables(target), objects: await objects(TARGET_BUCKET) }).toEqual(before);

    // --replace brings back what the backup holds: a deleted row, a stray object and an overwritten one are put right.
    await target("log_entry_files").del();
    const [someKey] = Object.keys(before.objects);
    await s3.send(new PutObjectCommand({ Bucket: TARGET_BUCKET, Key: someKey, Body: "overwritten" }));
    await s3.send(new PutObjectCommand({ Bucket: TARGET_BUCKET, Key: "stray/object.txt", Body: "not in the backup" }));
    const again = restore(file, "--replace");
    expect(again.status, again.out).toBe(0);
    expect({ db: await tables(target), objects: await objects(TARGET_BUCKET) }).toEqual(before);
  });

  it("refuses an altered or truncated file before writing anything", async () => {
    const bytes = readFileSync(file);
    const manifest = JSON.parse(bytes.subarray(entryOffset(bytes, "manifest.json")).toString("utf8").split("\0")[0]);
    const photo = manifest.objects.find((o: { contentType: string }) => o.contentType === "image/jpeg");
    // An emptied target shows that nothing is written at all (a non-empty one would be refused anyway without --replace).
    await target.raw("drop schema public cascade; create schema public");
    for (const key of Object.keys(await objects(TARGET_BUCKET))) await s3.send(new DeleteObjectCommand({ Bucket: TARGET_BUCKET, Key: key }));

    const altered = Buffer.from(bytes);
    altered[entryOffset(altered, photo.file) + 200] ^= 0xff;
    writeFileSync(path.join(OUT, "altered.tar"), altered);
    const a = restore(path.join(OUT, "altered.tar"), "--replace");
    expect(a.status, a.out).toBe(2);
    expect(a.out).toContain(`is truncated or altered (file ${photo.key} does not match its SHA-256). Nothing was written.`);

    writeFileSync(path.join(OUT, "truncated.tar"), bytes.subarray(0, Math.floor(bytes.length * 0.6)));
    const t = restore(path.join(OUT, "truncated.tar"));
    expect(t.status, t.out).toBe(2);
    expect(t.out).toContain("is truncated or altered");

    expect(await tables(target)).toEqual({});
    expect(await objects(TARGET_BUCKET)).toEqual({});
  });
});
