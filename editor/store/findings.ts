/**
 * The live findings index: after each structural change the engine runs (debounced) and its findings are
 * indexed by subject, with the worst severity per part and joint and one badge object per subject.
 */
import type { Finding, Report, Severity } from "@/shared/analysis/types";
import { worse } from "../presentation";
import type { AnalyzeFn, Badge, EditorOptions, EditorState, EditorStore, FindingsActions, SubjectRef } from "./types";
import { toGraph } from "./graph";

type Set = (partial: Partial<EditorState>) => void;
type Get = () => EditorState;

export const subjectKey = (s: SubjectRef) => `${s.type}:${s.id}`;

/** The findings index of a report: per subject, the worst per part and joint, one badge object per subject. */
function indexReport(report: Report) {
  const findingsBySubject: Record<string, Finding[]> = {};
  const worstByNode: Record<string, Severity> = {};
  const worstByJoint: Record<string, Severity> = {};
  for (const f of report.findings) {
    (findingsBySubject[subjectKey(f.subject)] ??= []).push(f);
    if (f.subject.type === "node") worstByNode[f.subject.id] = worse(worstByNode[f.subject.id], f.severity);
    if (f.subject.type === "joint") worstByJoint[f.subject.id] = worse(worstByJoint[f.subject.id], f.severity);
  }
  const badgeBySubject: Record<string, Badge> = {};
  for (const [key, list] of Object.entries(findingsBySubject)) {
    let w: Severity | undefined;
    for (const f of list) w = worse(w, f.severity);
    if (w) badgeBySubject[key] = { worst: w, count: list.length };
  }
  return { report, findingsBySubject, worstByNode, worstByJoint, badgeBySubject };
}

export function findingsActions(set: Set, get: Get, opts: EditorOptions): FindingsActions {
  return {
    setSettings(settings) {
      if (settings === get().settings) return; // the same settings object: nothing to re-check
      set({ settings, structureVersion: get().structureVersion + 1 });
    },

    runAnalysis() {
      const s = get();
      const analyze = opts.analyze ?? loadedEngines.get(opts);
      if (!analyze) return;
      try {
        set({ ...indexReport(analyze(toGraph(s), s.settings)), analysisError: null });
      } catch (e) {
        set({ analysisError: e instanceof Error ? e.message : String(e) });
      }
    },
  };
}

/** Engines loaded on first use (`loadAnalyze`), per store's options. */
const loadedEngines = new WeakMap<EditorOptions, AnalyzeFn>();

/**
 * The live engine: rerun after structural changes (moves do not change any number). With `initialReport`
 * (the server's report of the opening revision) the findings show at once and the engine itself is only
 * fetched (`loadAnalyze`) when something changes — the editor's first load carries no engine.
 */
export function runEngineOnChange(store: EditorStore, opts: EditorOptions) {
  if (!opts.analyze && !opts.loadAnalyze) return;
  const delay = opts.analysisDelay ?? 150;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let loading: Promise<unknown> | null = null;
  const ready = () => !!(opts.analyze ?? loadedEngines.get(opts));
  const run = () => {
    if (ready()) return store.getState().runAnalysis();
    loading ??= opts.loadAnalyze!().then(
      (fn) => { loadedEngines.set(opts, fn); store.getState().runAnalysis(); },
      (e) => { loading = null; store.setState({ analysisError: `The live check could not be loaded (${e instanceof Error ? e.message : String(e)}); reload the page.` }); },
    );
  };
  const schedule = () => {
    if (delay === 0) return run();
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      run();
    }, delay);
  };
  store.subscribe((s, prev) => {
    if (s.structureVersion !== prev.structureVersion) schedule();
  });
  if (opts.initialReport) store.setState(indexReport(opts.initialReport));
  else run();
}
