// The export worker as a process of its own: `npm run worker` (lib/jobs/supervisor.ts starts one
// beside each app instance; run this instead with LW_WORKER=0 on the app to scale workers apart).
// Runs under `--conditions=react-server` so the server-only guard of db/ and lib/ lets it in.
import { startWorker } from "@/lib/jobs/worker";

async function main() {
  const stop = await startWorker();
  let stopping = false;
  const quit = async () => {
    if (stopping) return;
    stopping = true;
    // A job mid-way is left to the recovery of the next worker; never outlive the app by more than a moment.
    setTimeout(() => process.exit(0), 12_000).unref();
    await stop().catch(() => {});
    process.exit(0);
  };
  process.on("SIGTERM", quit);
  process.on("SIGINT", quit);
  // Started by an app instance: stop with it.
  process.on("disconnect", quit);
}

main().catch((e) => {
  console.error("[jobs] the export worker could not start", e);
  process.exit(1);
});
