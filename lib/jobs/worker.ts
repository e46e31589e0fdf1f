import "server-only";
import os from "node:os";
import type PgBoss from "pg-boss";
import { db } from "@/db/index";
import { toBuild, type BuildRow } from "@/db/builds";
import { claimExport, failExport, finishExport, heartbeat, markMailed, orphanedExports, reportProgress, requeueOrphan, type ExportRow } from "@/db/exports";
import { deleteObject, putObject, putObjectFile } from "@/lib/storage";
import { sendMail } from "@/lib/mail";
import { appUrl } from "@/lib/urls";
import { exportParams, LARGE_EXPORT_BYTES } from "@/shared/schemas/exports";
import { sweepOrphans } from "@/lib/orphan-sweep";
import { ExportFailure, KINDS } from "./kinds";
import { QUEUE, enqueue, ensureQueue, newBoss, newQueueJobId } from "./queue";

/**
 * The export worker: a process of its own (started beside each app instance by lib/jobs/supervisor.ts,
 * or alone with `npm run worker`), so making a PDF never holds the app's requests. It takes one job at
 * a time from the pg-boss queue, makes the file, writes it to storage, and records progress, the result
 * or why it failed in export_jobs. A job whose worker died is put back in the queue.
 */
const ME = `${os.hostname()}:${process.pid}`;
/** A running job whose worker has not beaten for this long is taken to be orphaned. */
const STALE_SECONDS = 90;
const MAX_ATTEMPTS = 3;
/** The person has left the page when it has not asked for the progress for this long: the result is e-mailed. */
const LEFT_AFTER_MS = 20_000;

const alive = (pid: number) => {
  try { process.kill(pid, 0); return true; } catch (e) { return (e as NodeJS.ErrnoException).code === "EPERM"; }
};

async function runExport(exportId: string, queueJobId: string) {
  const row = await claimExport(exportId, queueJobId, ME);
  if (!row) return; // an older delivery of a row that has moved on
  const beat = setInterval(() => void heartbeat(row.id, ME).catch(() => {}), 5_000);
  let last = 0;
  try {
    const b = await db<BuildRow>("builds").where({ id: row.build_id }).first();
    if (!b) throw new ExportFailure("The build was deleted.");
    const kind = KINDS[row.kind];
    if (!kind) throw new ExportFailure(`This server does not know exports of the kind "${row.kind}".`);
    const params = exportParams[row.kind].parse(row.params);
    const result = await kind.run({
      build: toBuild(b),
      params: params as never,
      progress: async (fraction, note) => {
        if (Date.now() - last < 400 && fraction < 1) return;
        last = Date.now();
        await reportProgress(row.id, ME, fraction, note);
      },
    });
    const key = `builds/${row.build_id}/exports/${row.id}/${result.filename}`;
    if (row.result_key && row.result_key !== key) await deleteObject(row.result_key).catch(() => {});
    await reportProgress(row.id, ME, 0.97, "Storing the file");
    let size: number;
    if ("body" in result) {
      await putObject(key, result.body, result.contentType);
      size = result.body.length;
    } else {
      try { await putObjectFile(key, result.file, result.size, result.contentType); } finally { await result.cleanup(); }
      size = result.size;
    }
    const done = await finishExport(row.id, ME, { key, name: result.filename, type: result.contentType, size });
    if (done) await mailIfLeft(done);
  } catch (e) {
    const why = e instanceof ExportFailure ? e.message : `The export stopped on an error: ${(e as Error)?.message ?? String(e)}. Retry it; if it fails again, tell the site admin.`;
    if (!(e instanceof ExportFailure)) console.error(`[jobs] export ${row.id} failed`, e);
    await failExport(row.id, ME, why);
    const failed = await db<ExportRow>("export_jobs").where({ id: row.id }).first();
    if (failed) await mailIfLeft(failed);
  } finally {
    clearInterval(beat);
  }
}

/** E-mails the result (or the failure) to the person who asked when they have left the page, or always for a large file. */
async function mailIfLeft(r: ExportRow) {
  const left = Date.now() - r.seen_at.getTime() > LEFT_AFTER_MS;
  const large = Number(r.result_size ?? r.estimated_bytes ?? 0) > LARGE_EXPORT_BYTES;
  if ((!left && !large) || r.mailed_at || !r.user_id) return;
  const u = await db("users as u").join("builds as b", db.raw("b.id = ?", [r.build_id])).where("u.id", r.user_id).first<{ email: string; name: string; build_name: string } | undefined>("u.email", "u.name", "b.name as build_name");
  if (!u) return;
  const url = `${appUrl()}/api/builds/${r.build_id}/exports/${r.id}/download`;
  const text = r.status === "done"
    ? `Hello ${u.name},\n\n${r.label} for ${u.build_name} is ready (${(Number(r.result_size) / 1e6).toFixed(1)} MB):\n${url}\n\nThe link asks you to sign in; it works for members of the build.\n`
    : `Hello ${u.name},\n\n${r.label} for ${u.build_name} could not be made.\n\n${r.error}\n\nYou can retry it from the page where you asked for it.\n`;
  if (await sendMail({ to: u.email, subject: r.status === "done" ? `Ready: ${r.label}` : `Failed: ${r.label}`, text })) await markMailed(r.id);
}

/** Running jobs whose worker is gone go back in the queue (at most MAX_ATTEMPTS tries in all). */
async function recoverOrphans(boss: PgBoss) {
  for (const o of await orphanedExports(STALE_SECONDS)) {
    const [host, pid] = (o.worker ?? "").split(":");
    const gone = o.stale || (host === os.hostname() && Number(pid) !== process.pid && !alive(Number(pid)));
    if (!gone) continue;
    if (o.attempts >= MAX_ATTEMPTS) {
      await failExport(o.id, o.worker, `The export was interrupted ${o.attempts} times (its worker stopped each time). Retry it; if it stops again, tell the site admin.`);
      continue;
    }
    const qid = newQueueJobId();
    if (await requeueOrphan(o.id, o.worker, qid)) await enqueue(o.id, qid, boss);
  }
}

/** Objects left without a row by a process killed mid-upload or mid-export (lib/orphan-sweep.ts): at start, then daily. */
async function sweep() {
  try {
    const r = await sweepOrphans();
    console.log(`[storage] orphan sweep: ${r.listed} objects listed, ${r.removed.length} without a row removed, ${r.young} younger than an hour left alone`);
  } catch (e) {
    console.error("[storage] orphan sweep stopped", e);
  }
}
const SWEEP_EVERY_MS = 24 * 60 * 60 * 1000; // common practice, no source

export async function startWorker() {
  void sweep();
  const daily = setInterval(() => void sweep(), SWEEP_EVERY_MS);
  daily.unref();
  const boss = newBoss({ worker: true });
  await boss.start();
  await ensureQueue(boss);
  await recoverOrphans(boss);
  const recovery = setInterval(() => void recoverOrphans(boss).catch((e) => console.error("[jobs] recovery", e)), 5_000);
  await boss.work<{ exportId: string }>(QUEUE, { pollingIntervalSeconds: 1, batchSize: 1 }, async ([job]) => {
    await runExport(job.data.exportId, job.id);
  });
  console.log(`[jobs] export worker ${ME} is taking jobs`);
  return async () => {
    clearInterval(recovery);
    clearInterval(daily);
    await boss.stop({ graceful: true, timeout: 10_000, wait: true });
    await db.destroy();
  };
}
