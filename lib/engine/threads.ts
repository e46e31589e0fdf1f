import "server-only";
import os from "node:os";
import path from "node:path";
import { Worker } from "node:worker_threads";
import { ApiError, serverError } from "../errors";
import { MAX_BODY_BYTES, readBodyCapped } from "../body";
import type { AnalysisSettings } from "@/shared/analysis/types";
import { runEngineJob, type AnalyzeOutcome, type CreateOutcome, type EngineAnswer, type EngineJob, type SaveOutcome } from "./work";

/**
 * Where the engine's share of a request that carries a graph runs (lib/engine/work.ts: parse, schema check,
 * analysis, JSON of the graph and report). Every body goes to an engine thread, a worker thread kept for the life
 * of the process, so the thread that answers every other request of the process only reads the body and writes to
 * the database: one person posting the largest linkages (up to the 5 MB body cap, about 400 ms of engine work)
 * again and again keeps an engine thread busy, not that one, and on a save under load the two run side by side.
 * Measured (npm run bench:load, 2026-12-05 22:55, four pairs of runs alternating): the editor's save at 32–35 % of
 * the bare route with every body in a thread, 26–29 % with bodies under 256 K done inline; the answering thread
 * 72 % busy instead of 89–90 %, the cores 83 % instead of 74–76 %. (An earlier run the same day, when a save cost
 * the machine about 5 ms, had found no gain; the save's own cost has since come down.) LW_ENGINE_INLINE_MAX=N
 * does bodies under N bytes in the request's thread instead.
 *
 * LW_ENGINE_THREADS sets how many threads (default: one per core but one, at least one, at most four; 0 does
 * every body in the request's thread). A thread that dies is replaced at the next job; the jobs it held fail
 * with a 500 and change nothing.
 */
const THREAD_ENTRY = path.join(process.cwd(), "lib/engine/thread.cjs");

/**
 * Each thread's young generation as the server's (scripts/next-start.mjs: --max-semi-space-size=32), also where
 * that flag is not given (next dev): 96 MB gives a thread a 64 MB new space, two 32 MB semi-spaces, as the flag
 * does (v8.getHeapSpaceStatistics() after a burst of short-lived objects, Node 20, 2026-12-05).
 */
const YOUNG_GENERATION_MB = 96;

type Waiting = { resolve: (a: EngineAnswer) => void; reject: (e: unknown) => void };
type Thread = { worker: Worker; waiting: Map<number, Waiting> };
type Pool = { threads: (Thread | null)[]; nextId: number; inlineMax: number };

const g = globalThis as unknown as { __lwEngineThreads?: Pool };

/** A whole number 0 or more from the environment, or null when it is unset or not one. */
function wholeSetting(name: string): number | null {
  const raw = process.env[name];
  const n = Number(raw);
  return raw && Number.isInteger(n) && n >= 0 ? n : null;
}

export function engineThreadCount(): number {
  const asked = wholeSetting("LW_ENGINE_THREADS");
  return asked !== null ? Math.min(asked, 16) : Math.max(1, Math.min(4, os.availableParallelism() - 1));
}

/** Bodies shorter than this (bytes) are done in the request's own thread: none by default. */
export const engineInlineMax = (): number => wholeSetting("LW_ENGINE_INLINE_MAX") ?? 0;

function pool(): Pool {
  return (g.__lwEngineThreads ??= { threads: Array.from({ length: engineThreadCount() }, () => null), nextId: 1, inlineMax: engineInlineMax() });
}

function start(p: Pool, slot: number): Thread {
  // Loaded by a require in the thread (not named to `new Worker`), so the bundler leaves the file to Node and tsx.
  const worker = new Worker(`require(${JSON.stringify(THREAD_ENTRY)})`, { eval: true, resourceLimits: { maxYoungGenerationSizeMb: YOUNG_GENERATION_MB } });
  const t: Thread = { worker, waiting: new Map() };
  worker.unref(); // the threads never keep a process alive that is otherwise done
  worker.on("message", (m: { id: number; answer?: EngineAnswer; fault?: string }) => {
    const w = t.waiting.get(m.id);
    if (!w) return;
    t.waiting.delete(m.id);
    if (m.answer) w.resolve(m.answer);
    else w.reject(new Error(`engine thread: ${m.fault}`));
  });
  const lost = (why: unknown) => {
    if (p.threads[slot] === t) p.threads[slot] = null;
    for (const w of t.waiting.values()) w.reject(why instanceof Error ? why : new Error(`engine thread stopped: ${String(why)}`));
    t.waiting.clear();
  };
  worker.on("error", lost);
  worker.on("messageerror", lost); // an answer that could not be read: the jobs would otherwise wait for ever
  worker.on("exit", (code) => lost(new Error(`engine thread exited with code ${code}`)));
  p.threads[slot] = t;
  return t;
}

/** Starts the threads now (at server start), so the first save does not wait for them to load. */
export function startEngineThreads() {
  const p = pool();
  p.threads.forEach((t, i) => t ?? start(p, i));
}

/** The job's answer: here for a small body, else from the least busy thread (one is started if its slot is empty). */
function send(job: EngineJob): Promise<EngineAnswer> {
  const p = pool();
  if (p.threads.length === 0 || job.body.byteLength < p.inlineMax) return Promise.resolve(runEngineJob(job));
  let slot = 0;
  for (let i = 0; i < p.threads.length; i++) {
    const t = p.threads[i];
    if (!t) { slot = i; break; }
    if (t.waiting.size < (p.threads[slot]?.waiting.size ?? Infinity)) slot = i;
  }
  const t = p.threads[slot] ?? start(p, slot);
  const id = p.nextId++;
  return new Promise<EngineAnswer>((resolve, reject) => {
    t.waiting.set(id, { resolve, reject });
    // The body's bytes are handed over, not copied, when their buffer is theirs alone (a large body's always is:
    // Node shares one buffer among small ones only).
    const b = job.body;
    const own = b.byteOffset === 0 && b.byteLength === b.buffer.byteLength;
    try {
      t.worker.postMessage({ id, job }, own ? [b.buffer as ArrayBuffer] : []);
    } catch (e) {
      t.waiting.delete(id);
      reject(e);
    }
  });
}

async function answer<T>(job: EngineJob): Promise<T> {
  let a: EngineAnswer;
  try {
    a = await send(job);
  } catch (e) {
    console.error(e);
    throw serverError();
  }
  if (!a.ok) throw new ApiError(a.refusal.code, a.refusal.message, a.refusal.fields, a.refusal.extra);
  return a.value as T;
}

/** The request's body, capped as every JSON body is (lib/body.ts), as bytes for the engine. */
const bodyOf = (req: Request) => readBodyCapped(req, MAX_BODY_BYTES);

/** A save's body (PUT graph) read, checked and analysed: the texts to store and answer. */
export const engineSave = async (req: Request, settings: Partial<AnalysisSettings> | undefined) => answer<SaveOutcome>({ kind: "save", body: await bodyOf(req), settings });
/** A new linkage's body read and checked, and its imported graph analysed. */
export const engineCreate = async (req: Request, settings: Partial<AnalysisSettings> | undefined) => answer<CreateOutcome>({ kind: "create", body: await bodyOf(req), settings });
/** POST /api/analyze's body read, checked and analysed: the answer's bytes. */
export const engineAnalyze = async (req: Request) => answer<AnalyzeOutcome>({ kind: "analyze", body: await bodyOf(req) });
