import "server-only";
import { randomUUID } from "node:crypto";
import PgBoss from "pg-boss";
import config from "@/knexfile";

/**
 * The export queue: pg-boss in PostgreSQL, so any app instance can put a job in and any worker
 * (one per instance, see lib/jobs/supervisor.ts) can take it out. A delivery carries only the
 * export_jobs row id; the row says what to make and holds the progress and the result.
 */
export const QUEUE = "exports";
export const connectionString = () => process.env.DATABASE_URL || (config.connection as string);

export function newBoss(o: { worker: boolean }) {
  const boss = new PgBoss({
    connectionString: connectionString(),
    schema: "pgboss",
    application_name: o.worker ? "linkwright-worker" : "linkwright-app",
    max: o.worker ? 4 : 2,
    // The app only sends; the workers keep the queue tidy.
    supervise: o.worker,
    schedule: false,
    maintenanceIntervalSeconds: 60,
  });
  boss.on("error", (e) => console.error("[jobs]", e));
  return boss;
}

export async function ensureQueue(boss: PgBoss) {
  if (await boss.getQueue(QUEUE)) return;
  // Two instances may start at once: the loser's create fails, and the queue is there all the same.
  await boss.createQueue(QUEUE, { name: QUEUE, retryLimit: 0, expireInSeconds: 3600 }).catch(async (e) => {
    if (!(await boss.getQueue(QUEUE))) throw e;
  });
}

const g = globalThis as unknown as { __lwBoss?: Promise<PgBoss> };

function senderBoss() {
  g.__lwBoss ??= (async () => {
    const boss = newBoss({ worker: false });
    await boss.start();
    await ensureQueue(boss);
    return boss;
  })().catch((e) => {
    g.__lwBoss = undefined;
    throw e;
  });
  return g.__lwBoss;
}

/** A fresh queue id for a new attempt (pg-boss job ids are UUIDs). */
export const newQueueJobId = () => randomUUID();

/** Puts one attempt of an export in the queue. */
export async function enqueue(exportId: string, queueJobId: string, boss?: PgBoss) {
  await (boss ?? (await senderBoss())).send(QUEUE, { exportId }, { id: queueJobId, retryLimit: 0, expireInSeconds: 3600 });
}
