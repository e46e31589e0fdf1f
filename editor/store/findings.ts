/**
 * The live findings index: after each structural change the engine runs (debounced) and its findings are
 * indexed by subject, with the worst severity per part and joint and one badge object per subject.
 */
import type { Finding, Severity } from "@/shared/analysis/types";
import { worse } from "../presentation";
import type { Badge, EditorOptions, EditorState, EditorStore, FindingsActions, SubjectRef } from "./types";
import { toGraph } from "./graph";

type Set = (partial: Partial<EditorState>) => void;
type Get = () => EditorState;

export const subjectKey = (s: SubjectRef) => `${s.type}:${s.id}`;

export function findingsActions(set: Set, get: Get, opts: EditorOptions): FindingsActions {
  return {
    setSettings(settings) {
      set({ settings, structureVersion: get().structureVersion + 1 });
    },

    runAnalysis() {
      const s = get();
      if (!opts.analyze) return;
      try {
        const report = opts.analyze(toGraph(s), s.settings);
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
        set({ report, findingsBySubject, worstByNode, worstByJoint, badgeBySubject, analysisError: null });
      } catch (e) {
        set({ analysisError: e instanceof Error ? e.message : String(e) });
      }
    },
  };
}

/** The live engine: rerun after structural changes (moves do not change any number). */
export function runEngineOnChange(store: EditorStore, opts: EditorOptions) {
  if (!opts.analyze) return;
  const delay = opts.analysisDelay ?? 150;
  let timer: ReturnType<typeof setTimeout> | null = null;
  const schedule = () => {
    if (delay === 0) return store.getState().runAnalysis();
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = null;
      store.getState().runAnalysis();
    }, delay);
  };
  store.subscribe((s, prev) => {
    if (s.structureVersion !== prev.structureVersion) schedule();
  });
  store.getState().runAnalysis();
}
