import "server-only";
import type { ExportJobView, ExportKind, ExportStatus } from "@/shared/schemas/exports";
import { db } from "./index";

/** Rows of export_jobs: what the page shows of a background export (the queue itself is pg-boss's). */
export type ExportRow = {
  id: string; build_id: string; user_id: string | null; kind: ExportKind; params: Record<string, unknown>; label: string; status: ExportStatus;
  progress: number; progress_note: string; estimated_bytes: string | null; result_key: string | null; result_name: string | null; result_type: string | null;
  result_size: string | null; error: string | null; attempts: number; queue_job_id: string | null; worker: string | null; heartbeat_at: Date | null;
  seen_at: Date; mailed_at: Date | null; created_at: Date; started_at: Date | null; finished_at: Date | null;
};

export const toJobView = (r: ExportRow): ExportJobView => ({
  id: r.id,
  kind: r.kind,
  label: r.label,
  status: r.status,
  progress: r.progress,
  progressNote: r.progress_note,
  estimatedBytes: r.estimated_bytes === null ? null : Number(r.estimated_bytes),
  resultName: r.result_name,
  resultSize: r.result_size === null ? null : Number(r.result_size),
  error: r.error,
  attempts: r.attempts,
  createdAt: r.created_at.toISOString(),
  startedAt: r.started_at?.toISOString() ?? null,
  finishedAt: r.finished_at?.toISOString() ?? null,
  downloadUrl: r.status === "done" ? `/api/builds/${r.build_id}/exports/${r.id}/download` : null,
});

export async function createExport(j: { buildId: string; userId: string; kind: ExportKind; params: object; label: string; estimatedBytes: number | null; queueJobId: string }) {
  const [row] = await db<ExportRow>("export_jobs")
    .insert({ build_id: j.buildId, user_id: j.userId, kind: j.kind, params: JSON.stringify(j.params) as never, label: j.label, estimated_bytes: j.estimatedBytes === null ? null : String(j.estimatedBytes), queue_job_id: j.queueJobId })
    .returning("*");
  return row;
}

export async function getExport(buildId: string, id: string) {
  return db<ExportRow>("export_jobs").where({ build_id: buildId, id }).first();
}

/** The person who asked is looking at the progress (so no e-mail is needed when it ends). */
export async function markSeen(id: string) {
  await db("export_jobs").where({ id }).update({ seen_at: db.fn.now() });
}

/** A failed job back in the queue under a new queue id; null when it is not failed. */
export async function requeueFailed(buildId: string, id: string, queueJobId: string) {
  const [row] = await db<ExportRow>("export_jobs").where({ build_id: buildId, id, status: "failed" })
    .update({ status: "queued", progress: 0, progress_note: "", error: null, queue_job_id: queueJobId, worker: null, finished_at: null, mailed_at: null, seen_at: db.fn.now() } as never)
    .returning("*");
  return row ?? null;
}

// ---- worker side -------------------------------------------------------------------------------

/** Takes a queued job for this worker; null when the delivery is stale (another attempt owns the row). */
export async function claimExport(id: string, queueJobId: string, worker: string) {
  const [row] = await db<ExportRow>("export_jobs").where({ id, status: "queued", queue_job_id: queueJobId })
    .update({ status: "running", worker, started_at: db.fn.now(), heartbeat_at: db.fn.now(), attempts: db.raw("attempts + 1"), progress: 0, progress_note: "Starting" } as never)
    .returning("*");
  return row ?? null;
}

export async function reportProgress(id: string, worker: string, progress: number, note: string) {
  await db("export_jobs").where({ id, status: "running", worker }).update({ progress: Math.max(0, Math.min(1, progress)), progress_note: note.slice(0, 200), heartbeat_at: db.fn.now() });
}

export async function heartbeat(id: string, worker: string) {
  await db("export_jobs").where({ id, status: "running", worker }).update({ heartbeat_at: db.fn.now() });
}

export async function finishExport(id: string, worker: string, r: { key: string; name: string; type: string; size: number }) {
  const [row] = await db<ExportRow>("export_jobs").where({ id, status: "running", worker })
    .update({ status: "done", progress: 1, progress_note: "Done", result_key: r.key, result_name: r.name, result_type: r.type, result_size: String(r.size), finished_at: db.fn.now() } as never)
    .returning("*");
  return row ?? null;
}

export async function failExport(id: string, worker: string | null, error: string) {
  const q = db<ExportRow>("export_jobs").where({ id }).whereIn("status", ["running", "queued"]);
  if (worker) q.where({ worker });
  await q.update({ status: "failed", error: error.slice(0, 2000), finished_at: db.fn.now() } as never);
}

export async function markMailed(id: string) {
  await db("export_jobs").where({ id }).update({ mailed_at: db.fn.now() });
}

/**
 * Running jobs whose worker is gone: its heartbeat is older than `staleSeconds`, or it ran on this
 * host under a process id that no longer exists (checked by the caller through `alive`).
 */
export async function orphanedExports(staleSeconds: number) {
  return db<ExportRow>("export_jobs").where({ status: "running" })
    .select("id", "worker", "attempts", "heartbeat_at", db.raw(`heartbeat_at < now() - make_interval(secs => ${Number(staleSeconds)}) as stale`)) as unknown as Promise<(Pick<ExportRow, "id" | "worker" | "attempts" | "heartbeat_at"> & { stale: boolean })[]>;
}

export async function requeueOrphan(id: string, worker: string | null, queueJobId: string) {
  const q = db("export_jobs").where({ id, status: "running" });
  if (worker) q.where({ worker });
  return (await q.update({ status: "queued", queue_job_id: queueJobId, worker: null, progress: 0, progress_note: "Waiting for a worker (the previous one stopped)" })) > 0;
}
