/**
 * An engine thread (lib/engine/threads.ts starts it through thread.cjs): takes `{ id, job }` messages (the job's body handed over, not copied), answers
 * `{ id, answer }`, or `{ id, fault }` with the error's text when the job failed for a reason other than its input.
 */
import { parentPort } from "node:worker_threads";
import { runEngineJob, type EngineJob } from "./work";

const port = parentPort;
if (!port) throw new Error("lib/engine/thread.ts runs as a worker thread");
port.on("message", ({ id, job }: { id: number; job: EngineJob }) => {
  try {
    const answer = runEngineJob(job);
    // An answer's bytes are handed over, not copied (their buffer is the encoder's own, exactly their size).
    const bytes = answer.ok && "answer" in answer.value ? answer.value.answer : null;
    port.postMessage({ id, answer }, bytes ? [bytes.buffer as ArrayBuffer] : []);
  } catch (e) {
    port.postMessage({ id, fault: e instanceof Error ? (e.stack ?? e.message) : String(e) });
  }
});
