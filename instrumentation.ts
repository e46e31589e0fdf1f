/** Next calls this once when a server instance starts: it starts the export worker beside it (lib/jobs/supervisor.ts). */
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs" || process.env.NEXT_PHASE === "phase-production-build") return;
  const { superviseWorker } = await import("./lib/jobs/supervisor");
  superviseWorker();
}
