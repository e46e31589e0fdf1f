/** What is selected: parts and joints by id; kept to ids that exist after every change. */
import type { Joint, LinkageNode } from "@/shared/linkage/schema";
import type { EditorState, Selection, SelectionActions } from "./types";

type Set = (partial: Partial<EditorState>) => void;
type Get = () => EditorState;

export function pruneSelection(sel: Selection, nodes: LinkageNode[], joints: Joint[]): Selection {
  const n = new Set(nodes.map((x) => x.id));
  const j = new Set(joints.map((x) => x.id));
  return { nodes: sel.nodes.filter((id) => n.has(id)), joints: sel.joints.filter((id) => j.has(id)) };
}

function sameList(a: string[], b: string[]) {
  return a.length === b.length && a.every((x, i) => x === b[i]);
}

export function selectionActions(set: Set, get: Get): SelectionActions {
  return {
    setSelection(sel) {
      const s = get();
      const next = { nodes: sel.nodes ?? s.selection.nodes, joints: sel.joints ?? s.selection.joints };
      if (sameList(next.nodes, s.selection.nodes) && sameList(next.joints, s.selection.joints)) return;
      set({ selection: next });
    },

    select(subject, additive) {
      const s = get();
      if (!subject || subject.type === "linkage") return set({ selection: { nodes: [], joints: [] } });
      const key = subject.type === "node" ? "nodes" : "joints";
      if (additive) {
        const list = s.selection[key];
        const next = list.includes(subject.id) ? list.filter((x) => x !== subject.id) : [...list, subject.id];
        return set({ selection: { ...s.selection, [key]: next } });
      }
      set({ selection: { nodes: key === "nodes" ? [subject.id] : [], joints: key === "joints" ? [subject.id] : [] } });
    },

    selectAll() {
      const s = get();
      set({ selection: { nodes: s.nodes.map((n) => n.id), joints: s.joints.map((j) => j.id) } });
    },
  };
}
