/** Copy, paste and duplicate: a set of parts and the joints among them, placed again with fresh ids. */
import type { LinkageNode } from "@/shared/linkage/schema";
import type { ClipboardActions, EditorState, Snapshot, XY } from "./types";
import type { Commit } from "./history";

type Set = (partial: Partial<EditorState>) => void;
type Get = () => EditorState;

export function clipboardActions(set: Set, get: Get, commit: Commit, newId: (kind: string) => string): ClipboardActions {
  /** Copy a set of parts (and the joints among them) with fresh ids, shifted by `offset`. */
  const cloneWithNewIds = (src: Snapshot, offset: XY) => {
    const idMap = new Map<string, string>();
    const existing = new Set([...get().nodes.map((n) => n.id), ...get().joints.map((j) => j.id)]);
    const fresh = (kind: string) => {
      let id = newId(kind);
      while (existing.has(id)) id = newId(kind);
      existing.add(id);
      return id;
    };
    const nodes = src.nodes.map((n) => {
      const id = fresh(n.kind);
      idMap.set(n.id, id);
      return { ...n, id, position: { x: n.position.x + offset.x, y: n.position.y + offset.y } } as LinkageNode;
    });
    const joints = src.joints
      .filter((j) => idMap.has(j.from.node) && idMap.has(j.to.node))
      .map((j) => ({
        ...j,
        id: fresh("joint"),
        from: { ...j.from, node: idMap.get(j.from.node)! },
        to: { ...j.to, node: idMap.get(j.to.node)! },
      }));
    return { nodes, joints };
  };

  return {
    duplicate() {
      const s = get();
      const sel = new Set(s.selection.nodes);
      if (sel.size === 0) return;
      const src = { nodes: s.nodes.filter((n) => sel.has(n.id)), joints: s.joints };
      const c = cloneWithNewIds(src, { x: 40, y: 40 });
      commit(
        { nodes: [...s.nodes, ...c.nodes], joints: [...s.joints, ...c.joints], selection: { nodes: c.nodes.map((n) => n.id), joints: c.joints.map((j) => j.id) } },
        { external: true },
      );
    },

    copy() {
      const s = get();
      const sel = new Set(s.selection.nodes);
      if (sel.size === 0) return;
      const nodes = s.nodes.filter((n) => sel.has(n.id));
      const joints = s.joints.filter((j) => sel.has(j.from.node) && sel.has(j.to.node));
      set({ clipboard: { nodes, joints } });
    },

    paste(at) {
      const s = get();
      if (!s.clipboard || s.clipboard.nodes.length === 0) return;
      let offset = { x: 40, y: 40 };
      if (at) {
        const minX = Math.min(...s.clipboard.nodes.map((n) => n.position.x));
        const minY = Math.min(...s.clipboard.nodes.map((n) => n.position.y));
        offset = { x: at.x - minX, y: at.y - minY };
      }
      const c = cloneWithNewIds(s.clipboard, offset);
      // The next paste lands a further step away.
      set({ clipboard: { nodes: s.clipboard.nodes.map((n) => ({ ...n, position: { x: n.position.x + 40, y: n.position.y + 40 } }) as LinkageNode), joints: s.clipboard.joints } });
      commit(
        { nodes: [...s.nodes, ...c.nodes], joints: [...s.joints, ...c.joints], selection: { nodes: c.nodes.map((n) => n.id), joints: c.joints.map((j) => j.id) } },
        { external: true },
      );
    },
  };
}
