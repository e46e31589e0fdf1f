/**
 * `npm run restore -- FILE [--replace]`: puts a backup made by `npm run backup` into DATABASE_URL and the
 * S3_* bucket (else the local app database and the local S3 fake).
 *  1. The whole file is read and checked first (every entry against the manifest's SHA-256 and size, the
 *     manifest against its own checksum, the dump readable by pg_restore). A truncated or altered file is
 *     refused here, before anything is written.
 *  2. The target must be empty (no tables, no objects) unless --replace is given.
 *  3. Objects are put; then the database is loaded in ONE transaction that ends by checking every
 *     table's row count against the manifest. If that fails, the objects put are taken out again (and
 *     any that were replaced are put back), so nothing is left half-restored. With --replace, objects
 *     that are not in the backup are deleted only after the database has committed.
 */
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync, statSync } from "node:fs";
import { createHash } from "node:crypto";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import * as tar from "tar";
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand } from "@aws-sdk/client-s3";
import { allKeys } from "../lib/s3-keys";
import { DUMP, FORMAT, MANIFEST, MANIFEST_SUM, VERSION, mb, pgTool, progress, sha256File, targets, type Manifest, type Targets } from "./backup-common";

class Refused extends Error {}
const started = Date.now();
const args = process.argv.slice(2);
const replace = args.includes("--replace");
const file = args.find((a) => !a.startsWith("-"));
const work = mkdtempSync(path.join(os.tmpdir(), "linkwright-restore-"));
const q = (name: string) => `"${name.replace(/"/g, '""')}"`;

/** Extracts into a private folder and checks every byte against the manifest. */
async function verify(archive: string): Promise<Manifest> {
  const bad = (why: string) => new Refused(`${archive} is truncated or altered (${why}). Nothing was written.`);
  const entries: string[] = [];
  try {
    await tar.x({ file: archive, cwd: work, strict: true, onReadEntry: (e) => void entries.push(e.path) });
  } catch (e) {
    throw bad(e instanceof Error ? e.message : String(e));
  }
  if (!entries.includes(MANIFEST_SUM)) throw bad(`it ends before ${MANIFEST_SUM}, the last entry`);
  if (!entries.includes(MANIFEST)) throw bad(`no ${MANIFEST}`);
  const json = readFileSync(path.join(work, MANIFEST), "utf8");
  if (createHash("sha256").update(json).digest("hex") !== readFileSync(path.join(work, MANIFEST_SUM), "utf8").trim()) throw bad(`${MANIFEST} does not match its checksum`);
  const m = JSON.parse(json) as Manifest;
  if (m.format !== FORMAT || m.version !== VERSION) throw new Refused(`${archive} is not a Linkwright backup of version ${VERSION}. Nothing was written.`);
  const expected = [MANIFEST, m.database.file, ...m.objects.map((o) => o.file), MANIFEST_SUM];
  const extra = entries.filter((e) => !expected.includes(e));
  if (extra.length || entries.length !== expected.length) throw bad(`entries differ from the manifest${extra.length ? `: ${extra.slice(0, 3).join(", ")}` : ""}`);
  const check = async (f: string, want: { bytes: number; sha256: string }, what: string) => {
    const got = await sha256File(path.join(work, f));
    if (got.bytes !== want.bytes) throw bad(`${what} has ${got.bytes} bytes, the manifest says ${want.bytes}`);
    if (got.sha256 !== want.sha256) throw bad(`${what} does not match its SHA-256`);
  };
  await check(m.database.file, m.database, "the database dump");
  const show = progress("checked", m.objects.length);
  let bytes = 0;
  for (const [i, o] of m.objects.entries()) {
    await check(o.file, o, `file ${o.key}`);
    show(i + 1, (bytes += o.bytes));
  }
  const list = await pgTool("pg_restore", ["--list", path.join(work, m.database.file)]);
  if (list.code !== 0) throw bad(`pg_restore cannot read the dump: ${list.stderr.trim()}`);
  return m;
}

const bucketKeys = (t: Targets) => allKeys(t.s3, t.bucket);

const getBytes = async (t: Targets, key: string) => {
  const r = await t.s3.send(new GetObjectCommand({ Bucket: t.bucket, Key: key }));
  return { bytes: Buffer.from(await r.Body!.transformToByteArray()), contentType: r.ContentType };
};

async function main() {
  if (!file) throw new Refused("usage: npm run restore -- FILE [--replace]");
  if (!existsSync(file)) throw new Refused(`${file} does not exist`);
  console.log(`▸ Checking ${file} (${mb(statSync(file).size)})`);
  const m = await verify(file);
  const rows = Object.values(m.database.tables).reduce((a, b) => a + b, 0);
  console.log(`  intact: backup of ${m.createdAt}, ${Object.keys(m.database.tables).length} tables, ${rows} rows, ${m.objects.length} files`);

  const t = await targets();
  try {
    console.log(`▸ Target: ${t.dbLabel} and ${t.s3Label}`);
    const conn = new pg.Client({ connectionString: t.dbUrl });
    await conn.connect();
    const existingTables = await conn.query("select tablename from pg_tables where schemaname = 'public'").finally(() => conn.end());
    const existingKeys = await bucketKeys(t);
    if (!replace && (existingTables.rowCount || existingKeys.length)) {
      throw new Refused(
        `the target is not empty (database: ${existingTables.rowCount} tables; bucket: ${existingKeys.length} objects). ` +
          "Restore into an empty database and bucket, or pass --replace to replace what is there (stop the app first). Nothing was written.",
      );
    }

    // Objects first; what they replace is kept aside to put back if the database step fails.
    console.log("▸ Files");
    const had = new Set(existingKeys);
    const put: string[] = [];
    const previous: { key: string; file: string; contentType?: string }[] = [];
    const show = progress("put", m.objects.length);
    let bytes = 0;
    const undo = async () => {
      for (const key of put) if (!had.has(key)) await t.s3.send(new DeleteObjectCommand({ Bucket: t.bucket, Key: key })).catch(() => {});
      for (const p of previous) await t.s3.send(new PutObjectCommand({ Bucket: t.bucket, Key: p.key, Body: readFileSync(p.file), ContentType: p.contentType })).catch(() => {});
    };
    try {
      for (const [i, o] of m.objects.entries()) {
        if (had.has(o.key)) {
          const old = await getBytes(t, o.key);
          if (createHash("sha256").update(old.bytes).digest("hex") !== o.sha256) {
            const keep = path.join(work, `previous-${i}`);
            writeFileSync(keep, old.bytes);
            previous.push({ key: o.key, file: keep, contentType: old.contentType });
          }
        }
        await t.s3.send(new PutObjectCommand({ Bucket: t.bucket, Key: o.key, Body: readFileSync(path.join(work, o.file)), ContentType: o.contentType ?? undefined }));
        put.push(o.key);
        show(i + 1, (bytes += o.bytes));
      }
      if (!m.objects.length) console.log("  no objects");

      console.log("▸ Database (one transaction)");
      const sql = path.join(work, "restore.sql");
      const script = await pgTool("pg_restore", ["--no-owner", "--no-privileges", `--file=${sql}`, path.join(work, m.database.file)]);
      if (script.code !== 0) throw new Error(`pg_restore failed: ${script.stderr.trim()}`);
      const before = path.join(work, "before.sql");
      // The export queue (pg-boss) keeps its tables in a schema of its own: replaced with the rest.
      writeFileSync(before, replace ? "drop schema if exists public cascade;\ndrop schema if exists pgboss cascade;\ncreate schema public;\n" : "");
      const after = path.join(work, "after.sql");
      writeFileSync(
        after,
        `do $$ declare n bigint; begin\n${Object.entries(m.database.tables)
          .map(([name, count]) => `  select count(*) into n from public.${q(name)}; if n <> ${count} then raise exception 'table ${name.replace(/'/g, "''")} has % rows after loading, the backup says ${count}', n; end if;`)
          .join("\n")}\nend $$;\n`,
      );
      const load = await pgTool("psql", ["-X", "-q", "-v", "ON_ERROR_STOP=1", "--single-transaction", "-f", before, "-f", sql, "-f", after], t.dbUrl);
      if (load.code !== 0) throw new Error(`loading the database failed, rolled back: ${load.stderr.trim().split("\n").slice(-3).join(" ")}`);
      console.log(`  ${Object.keys(m.database.tables).length} tables, ${rows} rows, row counts checked`);
    } catch (e) {
      console.error("  undoing: taking the files put back out");
      await undo();
      throw new Error(`${e instanceof Error ? e.message : e}. The database and the bucket are as they were.`);
    }

    if (replace) {
      const keep = new Set(m.objects.map((o) => o.key));
      const extra = existingKeys.filter((k) => !keep.has(k));
      for (const key of extra) await t.s3.send(new DeleteObjectCommand({ Bucket: t.bucket, Key: key }));
      if (extra.length) console.log(`  removed ${extra.length} object(s) not in the backup`);
    }
    const secs = ((Date.now() - started) / 1000).toFixed(1);
    console.log(`\n✓ Restored ${file}: ${rows} rows, ${m.objects.length} files, in ${secs} s. Run \`npm start\` to migrate it to this version and serve it.`);
  } finally {
    await t.stop();
  }
}

main()
  .catch((e) => {
    console.error(`\n✗ Restore ${e instanceof Refused ? "refused" : "failed"}: ${e instanceof Error ? e.message : e}`);
    process.exitCode = e instanceof Refused ? 2 : 1;
  })
  .finally(() => {
    // An extraction refused half-way may still be closing files in the folder: retry, and never let the
    // clean-up change what the restore answered.
    try {
      rmSync(work, { recursive: true, force: true, maxRetries: 10, retryDelay: 100 });
    } catch (e) {
      console.error(`(could not remove the working folder ${work}: ${e instanceof Error ? e.message : e})`);
    }
  });
