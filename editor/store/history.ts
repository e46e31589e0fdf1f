/**
 * Undo history: every change is one undoable step (`commit`), edits of one field within 1.5 s fold into one
 * step, a drag is one step from its start (`beginGesture`/`endGesture`), and the saved snapshot is kept by
 * reference so undoing back to it is clean again.
 */
import type { Joint, LinkageNode } from "@/shared/linkage/schema";
import type { EditorState, HistoryActions, Selection, Snapshot } from "./types";
import { pruneSelection } from "./selection";

type Set = (partial: Partial<EditorState>) => void;
type Get = () => EditorState;
export type CommitOptions = { coalesce?: string; external?: boolean; structural?: boolean };
export type Commit = (next: Partial<Snapshot> & { selection?: Selection }, o?: CommitOptions) => void;

export function createHistory(set: Set, get: Get, o: { historyLimit: number; now: () => number }) {
  let lastCoalesce: { key: string; at: number } | null = null;
  let gestureStart: Snapshot | null = null;
  const snap = (): Snapshot => ({ nodes: get().nodes, joints: get().joints });
  const isDirty = (nodes: LinkageNode[], joints: Joint[]) =>
    nodes !== get().saved.nodes || joints !== get().saved.joints || get().meta.geometry !== get().savedGeometry;

  /** Apply a change as one undoable step (or fold it into the previous step when coalescing). */
  const commit: Commit = (next, c = {}) => {
    const s = get();
    if (s.readOnly) return;
    const nodes = next.nodes ?? s.nodes;
    const joints = next.joints ?? s.joints;
    const t = o.now();
    const fold = c.coalesce && lastCoalesce && lastCoalesce.key === c.coalesce && t - lastCoalesce.at < 1500;
    lastCoalesce = c.coalesce ? { key: c.coalesce, at: t } : null;
    const past = fold ? s.past : [...s.past, snap()].slice(-o.historyLimit);
    set({
      nodes,
      joints,
      past,
      future: [],
      selection: next.selection ?? s.selection,
      dirty: isDirty(nodes, joints),
      epoch: c.external ? s.epoch + 1 : s.epoch,
      structureVersion: c.structural === false ? s.structureVersion : s.structureVersion + 1,
    });
  };

  const actions: HistoryActions = {
    beginGesture() {
      gestureStart = snap();
    },

    endGesture() {
      const start = gestureStart;
      gestureStart = null;
      if (!start) return;
      const s = get();
      if (start.nodes === s.nodes && start.joints === s.joints) return;
      lastCoalesce = null;
      set({ past: [...s.past, start].slice(-o.historyLimit), future: [], dirty: isDirty(s.nodes, s.joints) });
    },

    undo() {
      const s = get();
      if (s.readOnly || s.past.length === 0) return;
      const prev = s.past[s.past.length - 1];
      lastCoalesce = null;
      set({
        nodes: prev.nodes,
        joints: prev.joints,
        past: s.past.slice(0, -1),
        future: [snap(), ...s.future].slice(0, o.historyLimit),
        selection: pruneSelection(s.selection, prev.nodes, prev.joints),
        dirty: isDirty(prev.nodes, prev.joints),
        epoch: s.epoch + 1,
        structureVersion: s.structureVersion + 1,
      });
    },

    redo() {
      const s = get();
      if (s.readOnly || s.future.length === 0) return;
      const next = s.future[0];
      lastCoalesce = null;
      set({
        nodes: next.nodes,
        joints: next.joints,
        past: [...s.past, snap()].slice(-o.historyLimit),
        future: s.future.slice(1),
        selection: pruneSelection(s.selection, next.nodes, next.joints),
        dirty: isDirty(next.nodes, next.joints),
        epoch: s.epoch + 1,
        structureVersion: s.structureVersion + 1,
      });
    },

    markSaved(revision, snapshot) {
      const saved = snapshot ?? snap();
      const s = get();
      const savedGeometry = snapshot ? snapshot.geometry : s.meta.geometry;
      set({ saved, savedGeometry, revision, dirty: s.nodes !== saved.nodes || s.joints !== saved.joints || s.meta.geometry !== savedGeometry });
    },

    rebase(revision) {
      set({ revision });
    },

    replaceGraph(graph, r) {
      const s = get();
      const nodes = graph.nodes;
      const joints = graph.joints;
      lastCoalesce = null;
      if (r?.revision !== undefined) {
        // The server's version: a clean state with a fresh history.
        set({
          meta: { name: graph.name || s.meta.name, system: graph.system ?? s.meta.system, geometry: graph.geometry },
          savedGeometry: graph.geometry,
          nodes,
          joints,
          saved: { nodes, joints },
          revision: r.revision,
          dirty: false,
          past: [],
          future: [],
          selection: pruneSelection(s.selection, nodes, joints),
          epoch: s.epoch + 1,
          structureVersion: s.structureVersion + 1,
        });
      } else {
        if (s.readOnly) return;
        commit({ nodes, joints, selection: { nodes: [], joints: [] } }, { external: true });
      }
    },
  };
  return { commit, isDirty, actions };
}
