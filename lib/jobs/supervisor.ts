import "server-only";
import { spawn, type ChildProcess } from "node:child_process";
import os from "node:os";
import path from "node:path";

/**
 * Each app instance keeps one export worker process beside it (so `npm start` stays one command and
 * several instances share the queue), restarts it if it dies, and stops it when the app stops.
 * The worker runs at a lower CPU priority than the app: its PDFs wait, the app's requests do not.
 * LW_WORKER_NICE sets that priority (default 10; 0 = the app's own). LW_WORKER=0 turns this off (for an app instance whose workers run elsewhere: `npm run worker`).
 */
const g = globalThis as unknown as { __lwSupervisor?: boolean };

export function superviseWorker() {
  if (g.__lwSupervisor || process.env.LW_WORKER === "0") return;
  g.__lwSupervisor = true;
  const root = process.cwd();
  let child: ChildProcess | null = null;
  let stopping = false;
  let restarts = 0;
  const start = () => {
    child = spawn(process.execPath, ["--max-semi-space-size=32", "--conditions=react-server", "--import", "tsx", path.join(root, "scripts/worker.ts")], { // the server's Node flags (scripts/next-start.mjs): it may run the engine
      cwd: root,
      env: { ...process.env, NODE_ENV: "production", LW_WORKER_PARENT_PID: String(process.pid) },
      stdio: ["ignore", "inherit", "inherit", "ipc"],
    });
    try { if (child.pid) os.setPriority(child.pid, Number(process.env.LW_WORKER_NICE ?? 10)); } catch {}
    const started = Date.now();
    child.on("exit", (code, signal) => {
      child = null;
      if (stopping) return;
      // A worker that dies at once is restarted ever more slowly (at most every 30 s).
      restarts = Date.now() - started > 60_000 ? 0 : restarts + 1;
      console.error(`[jobs] export worker stopped (${signal ?? `exit ${code}`}); starting another`);
      setTimeout(start, Math.min(30_000, 500 * 2 ** Math.min(restarts, 6)));
    });
  };
  start();
  // The worker also quits when its IPC channel closes, so it follows the app out however the app ends.
  process.once("exit", () => {
    stopping = true;
    child?.kill("SIGTERM");
  });
}
