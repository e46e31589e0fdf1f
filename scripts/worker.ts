// The export worker as a process of its own: `npm run worker` (lib/jobs/supervisor.ts starts one
// beside each app instance; run this instead with LW_WORKER=0 on the app to scale workers apart).
// Runs under `--conditions=react-server` so the server-only guard of db/ and lib/ lets it in.
import { startWorker } from "@/lib/jobs/worker";

let stop: (() => Promise<void>) | null = null;
let stopping = false;
async function quit(why: string) {
  if (stopping) return;
  stopping = true;
  console.log(`[jobs] export worker ${process.pid} stopping: ${why}`);
  // A job mid-way is left to the recovery of the next worker; never outlive the app by more than a moment.
  setTimeout(() => process.exit(0), 12_000).unref();
  await stop?.().catch(() => {});
  process.exit(0);
}

// Listening before anything else: the app may be gone before this process has finished starting.
process.on("SIGTERM", () => void quit("SIGTERM"));
process.on("SIGINT", () => void quit("SIGINT"));
// Started by an app instance: stop with it. The IPC channel's "disconnect" is missed when the app died before
// this listener was added (a kill while the worker was still loading); the app's pid, handed over by the
// supervisor, is checked too: once this process has another parent, the app is gone.
process.on("disconnect", () => void quit("the app is gone"));
const app = Number(process.env.LW_WORKER_PARENT_PID || 0);
if (app) {
  const check = () => { if (process.ppid !== app) void quit("the app is gone"); };
  check();
  setInterval(check, 1_000).unref();
}

async function main() {
  stop = await startWorker();
  if (stopping) await stop();
}

main().catch((e) => {
  console.error("[jobs] the export worker could not start", e);
  process.exit(1);
});
