/**
 * The editor store: the one home of linkage-editor state (parts, joints, selection, viewport, undo/redo
 * history, dirty tracking, clipboard and the live load-path findings). React Flow renders from it; nothing
 * here talks to the network (saving lives in useAutosave). One store is created per editor mount with
 * `createEditorStore`. Each job has its file: types.ts (state and initial state), graph.ts (edits),
 * history.ts, clipboard.ts, selection.ts, findings.ts (the findings index), cable.ts (the return cable).
 */
import { createStore } from "zustand/vanilla";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { defaultProps, KIND_NAMES } from "@/shared/linkage/kinds";
import { indexById, jointName, partName } from "@/shared/linkage/names";
import { initialData, type EditorOptions, type EditorState, type EditorStore } from "./types";
import { createHistory } from "./history";
import { graphActions, toGraph } from "./graph";
import { clipboardActions } from "./clipboard";
import { selectionActions } from "./selection";
import { cableActions } from "./cable";
import { findingsActions, runEngineOnChange, subjectKey } from "./findings";

export type * from "./types";
export { toGraph, subjectKey };
/** Display names and starting props of each kind live in the kind registry (shared/linkage/kinds). */
export { KIND_NAMES, defaultProps };
/** How parts and joints are named, and the id index behind it, live in shared/linkage/names.ts. */
export { indexById, jointName, partName };
export { worse } from "../presentation";

function shortId(kind: string, taken: (id: string) => boolean): string {
  for (;;) {
    const id = `${kind.slice(0, 2).toLowerCase()}-${Math.random().toString(36).slice(2, 8)}`;
    if (!taken(id)) return id;
  }
}

export function createEditorStore(initial: LinkageGraph, opts: EditorOptions = {}): EditorStore {
  const now = opts.now ?? (() => Date.now());
  const store = createStore<EditorState>()((set, get) => {
    const taken = (id: string) => get().nodes.some((n) => n.id === id) || get().joints.some((j) => j.id === id);
    const newId = (kind: string) => (opts.newId ? opts.newId(kind) : shortId(kind, taken));
    const history = createHistory(set, get, { historyLimit: opts.historyLimit ?? 100, now });
    return {
      ...initialData(initial, opts),
      ...graphActions(set, get, history.commit, { newId, isDirty: history.isDirty, now }),
      ...history.actions,
      ...clipboardActions(set, get, history.commit, newId),
      ...selectionActions(set, get),
      ...cableActions(get, history.commit, newId),
      ...findingsActions(set, get, opts),
    };
  });
  runEngineOnChange(store, opts);
  return store;
}
