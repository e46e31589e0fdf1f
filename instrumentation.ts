/**
 * Next calls this once when a server instance starts, before it serves a request: it records each
 * request's connection address for the sign-in limit (lib/peer-address.ts), has requests Node's HTTP
 * parser refuses answered in the JSON error shape (lib/client-errors.ts), marks queries whose
 * percent-encoding does not decode (lib/url-encoding.ts), starts the engine threads (lib/engine/threads.ts)
 * and the export worker beside it (lib/jobs/supervisor.ts).
 */
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs" || process.env.NEXT_PHASE === "phase-production-build") return;
  const { recordPeerAddresses } = await import("./lib/peer-address");
  recordPeerAddresses();
  const { answerClientErrorsAsJson } = await import("./lib/client-errors");
  answerClientErrorsAsJson();
  const { markBadQueries } = await import("./lib/url-encoding");
  await markBadQueries();
  const { startEngineThreads } = await import("./lib/engine/threads");
  startEngineThreads();
  const { superviseWorker } = await import("./lib/jobs/supervisor");
  superviseWorker();
}
