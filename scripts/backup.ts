/**
 * `npm run backup [-- DIR | FILE.tar]`: one dated tar file (default backups/linkwright-<UTC time>.tar) holding
 *   manifest.json    each table's row count, each object's key, size and SHA-256, the dump's SHA-256
 *   database.dump    pg_dump, custom format, taken from one snapshot (the row counts come from the same one)
 *   objects/NNNNNN   every object of the bucket, read through the S3 API
 *   manifest.sha256  the manifest's SHA-256, written last: a file cut short lacks it
 * It works while the app is serving: the snapshot is consistent, and objects uploaded meanwhile are
 * kept too. The file appears under its name only once complete (written as .partial, then renamed).
 */
import { chmodSync, createWriteStream, existsSync, mkdirSync, renameSync, rmSync, statSync, writeFileSync } from "node:fs";
import { createHash } from "node:crypto";
import { pipeline } from "node:stream/promises";
import { Transform, type Readable } from "node:stream";
import path from "node:path";
import pg from "pg";
import * as tar from "tar";
import { GetObjectCommand } from "@aws-sdk/client-s3";
import { allKeys } from "../lib/s3-keys";
import { DUMP, FORMAT, MANIFEST, MANIFEST_SUM, VERSION, mb, pgTool, progress, sha256File, targets, type Manifest, type ObjectEntry } from "./backup-common";

const started = Date.now();
const arg = process.argv.slice(2).find((a) => !a.startsWith("-"));
const stamp = new Date().toISOString().replace(/\.\d+Z$/, "Z").replace(/:/g, "-");
const outFile = path.resolve(arg?.endsWith(".tar") ? arg : path.join(arg || "backups", `linkwright-${stamp}.tar`));
const staging = `${outFile}.staging`;
const partial = `${outFile}.partial`;

async function main() {
  if (existsSync(outFile)) throw new Error(`${outFile} already exists`);
  mkdirSync(path.join(staging, "objects"), { recursive: true, mode: 0o700 });
  const t = await targets();
  try {
    console.log(`Backing up ${t.dbLabel} and ${t.s3Label}`);

    // 1. One snapshot for the dump and the row counts, held open until pg_dump has read it.
    console.log("▸ Database");
    const conn = new pg.Client({ connectionString: t.dbUrl });
    await conn.connect();
    let tables: Record<string, number> = {};
    let referenced: string[] = [];
    let migrations: string[] = [];
    try {
      await conn.query("begin isolation level repeatable read read only");
      const snapshot = (await conn.query("select pg_export_snapshot() as s")).rows[0].s as string;
      const names = (await conn.query("select tablename from pg_tables where schemaname = 'public' order by 1")).rows.map((r) => r.tablename as string);
      for (const n of names) tables[n] = Number((await conn.query(`select count(*) as n from public."${n.replace(/"/g, '""')}"`)).rows[0].n);
      if (names.includes("files")) referenced = (await conn.query("select key from files union select thumb_key from files where thumb_key is not null")).rows.map((r) => r.key);
      if (names.includes("knex_migrations")) migrations = (await conn.query("select name from knex_migrations order by id")).rows.map((r) => r.name);
      const dump = await pgTool("pg_dump", ["--format=custom", `--snapshot=${snapshot}`, "--no-owner", "--no-privileges", "--no-toast-compression", `--file=${path.join(staging, DUMP)}`], t.dbUrl);
      if (dump.code !== 0) throw new Error(`pg_dump failed: ${dump.stderr.trim()}`);
      await conn.query("commit");
    } finally {
      await conn.end();
    }
    const dump = await sha256File(path.join(staging, DUMP));
    const rows = Object.values(tables).reduce((a, b) => a + b, 0);
    console.log(`  ${Object.keys(tables).length} tables, ${rows} rows, dump ${mb(dump.bytes)}`);

    // 2. Every object, hashed as it is written.
    console.log("▸ Files");
    const keys = await allKeys(t.s3, t.bucket);
    const objects: ObjectEntry[] = [];
    const show = progress("objects", keys.length);
    let total = 0;
    for (const [i, key] of keys.entries()) {
      const r = await t.s3.send(new GetObjectCommand({ Bucket: t.bucket, Key: key }));
      const file = `objects/${String(i + 1).padStart(6, "0")}`;
      const h = createHash("sha256");
      let bytes = 0;
      const tap = new Transform({ transform(c, _e, cb) { h.update(c); bytes += c.length; cb(null, c); } });
      await pipeline(r.Body as Readable, tap, createWriteStream(path.join(staging, file)));
      objects.push({ key, file, bytes, sha256: h.digest("hex"), contentType: r.ContentType ?? null });
      total += bytes;
      show(i + 1, total);
    }
    if (keys.length === 0) console.log("  no objects");
    const have = new Set(keys);
    const missing = referenced.filter((k) => !have.has(k));
    if (missing.length) console.warn(`  warning: ${missing.length} file(s) the database names are not in the bucket (listed in the manifest): ${missing.slice(0, 5).join(", ")}${missing.length > 5 ? ", …" : ""}`);

    // 3. Manifest, then one tar file, renamed into place when complete.
    const manifest: Manifest = {
      format: FORMAT,
      version: VERSION,
      createdAt: new Date().toISOString(),
      database: { file: DUMP, bytes: dump.bytes, sha256: dump.sha256, tables, migrations },
      bucket: t.bucket,
      objects,
      missing,
    };
    const json = JSON.stringify(manifest, null, 1);
    writeFileSync(path.join(staging, MANIFEST), json);
    writeFileSync(path.join(staging, MANIFEST_SUM), createHash("sha256").update(json).digest("hex") + "\n");
    console.log("▸ Writing the file");
    await tar.c({ file: partial, cwd: staging, portable: true }, [MANIFEST, DUMP, ...objects.map((o) => o.file), MANIFEST_SUM]);
    chmodSync(partial, 0o600); // it holds every record and password hash
    renameSync(partial, outFile);
    const secs = ((Date.now() - started) / 1000).toFixed(1);
    console.log(`\n✓ Backup written: ${outFile} (${mb(statSync(outFile).size)}: ${rows} rows in ${Object.keys(tables).length} tables, ${objects.length} files) in ${secs} s`);
    const shown = path.relative(process.cwd(), outFile);
    console.log(`  Restore it with: npm run restore -- ${shown.startsWith("..") ? outFile : shown}`);
  } finally {
    await t.stop();
  }
}

main()
  .catch((e) => {
    console.error(`\n✗ Backup failed: ${e instanceof Error ? e.message : e}`);
    rmSync(partial, { force: true });
    process.exitCode = 1;
  })
  .finally(() => rmSync(staging, { recursive: true, force: true }));
