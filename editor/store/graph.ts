/** Edits of the graph itself: place, move, change, join and delete parts and joints; and the graph document. */
import type { Joint, JointHardware, LinkageGraph, LinkageNode } from "@/shared/linkage/schema";
import { defaultHardware, FORMAT_VERSION } from "@/shared/linkage/format";
import { defaultProps, KIND_NAMES, PORTS } from "@/shared/linkage/kinds";
import { SCHEMA_LOADING, schemaNow } from "./schema";
import type { EditActions, EditorState, Endpoint, Snapshot } from "./types";
import type { Commit } from "./history";
import { pruneSelection } from "./selection";

type Set = (partial: Partial<EditorState>) => void;
type Get = () => EditorState;

/**
 * Whether an edit left a prop's value as it was: equal, or a number within a part in 10⁹ of it (a value shown
 * in SI units and read back can come back a hair off, and that is not the builder entering it).
 */
function sameValue(a: unknown, b: unknown): boolean {
  if (typeof a === "number" && typeof b === "number") return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a));
  return a === b || JSON.stringify(a) === JSON.stringify(b);
}

/** The graph document of the current state (what is saved and exported). */
export function toGraph(s: Pick<EditorState, "meta" | "nodes" | "joints">, snap?: Snapshot): LinkageGraph {
  return {
    formatVersion: FORMAT_VERSION,
    name: s.meta.name,
    system: s.meta.system,
    nodes: (snap ?? s).nodes,
    joints: (snap ?? s).joints,
    ...((snap ? snap.geometry : s.meta.geometry) ? { geometry: snap ? snap.geometry : s.meta.geometry } : {}),
  };
}

function issuesText(err: { issues: { path: PropertyKey[]; message: string }[] }): string {
  return err.issues.map((i) => (i.path.length ? `${i.path.join(".")}: ${i.message}` : i.message)).join("; ");
}

const READ_ONLY = "This linkage is read-only for you.";

export function graphActions(set: Set, get: Get, commit: Commit, h: { newId: (kind: string) => string; isDirty: (n: Snapshot["nodes"], j: Snapshot["joints"]) => boolean; now: () => number }): EditActions {
  return {
    addNode(kind, position, init) {
      if (get().readOnly) return "";
      const id = h.newId(kind);
      const count = get().nodes.filter((n) => n.kind === kind).length + 1;
      const starting = defaultProps(kind, get().meta.system);
      // The kind's starting values are placeholders, not the builder's: marked so until edited or confirmed
      // (shared/analysis/unentered.ts). Values the caller supplies (a part from the library) are entered.
      const unentered = Object.keys(starting).filter((k) => k !== "note" && !(init?.props && k in init.props));
      const node = {
        id,
        kind,
        label: init?.label ?? `${KIND_NAMES[kind]} ${count}`,
        position: { x: Math.round(position.x), y: Math.round(position.y) },
        props: { ...starting, ...(init?.props ?? {}) },
        ...(unentered.length ? { unentered } : {}),
      } as LinkageNode;
      if (!Number.isFinite(node.position.x) || !Number.isFinite(node.position.y)) {
        get().setNotice("Could not add the part: it was dropped outside the drawing.");
        return "";
      }
      // A kind's defaults pass its schema as they are (tests/editor/kinds.test.ts), and a label of its name and
      // a count is short enough: only a part given a label or props of its own needs the schema.
      let added = node;
      if (init?.label !== undefined || init?.props) {
        const schema = schemaNow();
        if (!schema) {
          get().setNotice(`Could not add the part: ${SCHEMA_LOADING}`);
          return "";
        }
        const parsed = schema.nodeSchema.safeParse(node);
        if (!parsed.success) {
          get().setNotice(`Could not add the part: ${issuesText(parsed.error)}`);
          return "";
        }
        added = parsed.data;
      }
      commit({ nodes: [...get().nodes, added], selection: { nodes: [id], joints: [] } });
      return id;
    },

    moveNodes(moves, o) {
      const s = get();
      if (s.readOnly || moves.length === 0) return;
      const byId = new Map(moves.map((m) => [m.id, m.position]));
      let changed = false;
      const nodes = s.nodes.map((n) => {
        const p = byId.get(n.id);
        if (!p || (p.x === n.position.x && p.y === n.position.y)) return n;
        changed = true;
        return { ...n, position: { x: p.x, y: p.y } };
      });
      if (!changed) return;
      if (o?.transient) set({ nodes, dirty: h.isDirty(nodes, s.joints) });
      else commit({ nodes }, { structural: false });
    },

    updateNode(id, patch, o) {
      const s = get();
      if (s.readOnly) return { ok: false, reason: READ_ONLY };
      const cur = s.nodes.find((n) => n.id === id);
      if (!cur) return { ok: false, reason: `No part ${id}.` };
      const schema = schemaNow();
      if (!schema) return { ok: false, reason: SCHEMA_LOADING };
      const props = (patch.props ?? cur.props) as Record<string, unknown>;
      const unentered = cur.unentered?.filter((k) => sameValue((cur.props as Record<string, unknown>)[k], props[k]));
      const { unentered: _old, ...rest } = cur;
      const parsed = schema.nodeSchema.safeParse({ ...rest, label: patch.label ?? cur.label, props, ...(unentered?.length ? { unentered } : {}) });
      if (!parsed.success) return { ok: false, reason: issuesText(parsed.error) };
      if (JSON.stringify(parsed.data) === JSON.stringify(cur)) return { ok: true, value: undefined };
      commit({ nodes: s.nodes.map((n) => (n.id === id ? parsed.data : n)) }, { coalesce: o?.coalesce });
      return { ok: true, value: undefined };
    },

    confirmValues(id, keys) {
      const s = get();
      if (s.readOnly) return { ok: false, reason: READ_ONLY };
      const cur = s.nodes.find((n) => n.id === id);
      if (!cur) return { ok: false, reason: `No part ${id}.` };
      if (!cur.unentered?.length) return { ok: true, value: undefined };
      const left = keys ? cur.unentered.filter((k) => !keys.includes(k)) : [];
      if (left.length === cur.unentered.length) return { ok: true, value: undefined };
      const { unentered: _old, ...rest } = cur;
      const next = (left.length ? { ...rest, unentered: left } : rest) as LinkageNode;
      commit({ nodes: s.nodes.map((n) => (n.id === id ? next : n)) });
      return { ok: true, value: undefined };
    },

    updateJointHardware(id, hardware, o) {
      const s = get();
      if (s.readOnly) return { ok: false, reason: READ_ONLY };
      const cur = s.joints.find((j) => j.id === id);
      if (!cur) return { ok: false, reason: `No joint ${id}.` };
      const schema = schemaNow();
      if (!schema) return { ok: false, reason: SCHEMA_LOADING };
      const parsed = schema.hardwareSchema.safeParse(hardware);
      if (!parsed.success) return { ok: false, reason: issuesText(parsed.error) };
      if (JSON.stringify(parsed.data) === JSON.stringify(cur.hardware)) return { ok: true, value: undefined };
      commit({ joints: s.joints.map((j) => (j.id === id ? { ...j, hardware: parsed.data as JointHardware } : j)) }, { coalesce: o?.coalesce, external: o?.external });
      return { ok: true, value: undefined };
    },

    canConnect(from, to) {
      const s = get();
      if (s.readOnly) return { ok: false, reason: READ_ONLY };
      const a = s.nodes.find((n) => n.id === from.node);
      const b = s.nodes.find((n) => n.id === to.node);
      if (!a || !b) return { ok: false, reason: "Both ends of a joint must be parts on the canvas." };
      if (a.id === b.id) return { ok: false, reason: "A joint cannot join a part to itself." };
      if (!PORTS[a.kind].includes(from.port))
        return { ok: false, reason: `A ${KIND_NAMES[a.kind].toLowerCase()} has no "${from.port}" port (it has ${PORTS[a.kind].join(", ")}).` };
      if (!PORTS[b.kind].includes(to.port))
        return { ok: false, reason: `A ${KIND_NAMES[b.kind].toLowerCase()} has no "${to.port}" port (it has ${PORTS[b.kind].join(", ")}).` };
      const same = (x: Endpoint, y: Endpoint) => x.node === y.node && x.port === y.port;
      if (s.joints.some((j) => (same(j.from, from) && same(j.to, to)) || (same(j.from, to) && same(j.to, from))))
        return { ok: false, reason: "These two ports are already joined." };
      return { ok: true, value: undefined };
    },

    connect(from, to) {
      const check = get().canConnect(from, to);
      if (!check.ok) {
        get().setNotice(check.reason);
        return check;
      }
      const id = h.newId("joint");
      const joint: Joint = { id, from: { ...from }, to: { ...to }, hardware: defaultHardware() };
      commit({ joints: [...get().joints, joint], selection: { nodes: [], joints: [id] } });
      return { ok: true, value: id };
    },

    deleteSelection() {
      const { selection } = get();
      get().deleteElements({ nodes: selection.nodes, joints: selection.joints });
    },

    deleteElements(ids) {
      const s = get();
      const nodeIds = new Set(ids.nodes ?? []);
      const jointIds = new Set(ids.joints ?? []);
      if (nodeIds.size === 0 && jointIds.size === 0) return;
      const nodes = s.nodes.filter((n) => !nodeIds.has(n.id));
      const joints = s.joints.filter((j) => !jointIds.has(j.id) && !nodeIds.has(j.from.node) && !nodeIds.has(j.to.node));
      if (nodes.length === s.nodes.length && joints.length === s.joints.length) return;
      commit({ nodes, joints, selection: pruneSelection(s.selection, nodes, joints) });
    },

    nudge(dx, dy) {
      const s = get();
      const sel = new Set(s.selection.nodes);
      if (sel.size === 0) return;
      const moves = s.nodes.filter((n) => sel.has(n.id)).map((n) => ({ id: n.id, position: { x: n.position.x + dx, y: n.position.y + dy } }));
      const byId = new Map(moves.map((m) => [m.id, m.position]));
      commit({ nodes: s.nodes.map((n) => (byId.has(n.id) ? { ...n, position: byId.get(n.id)! } : n)) }, { structural: false }); // each press one undo step
    },

    setMeasured(sizes) {
      const s = get();
      let measured: EditorState["measured"] | null = null;
      for (const z of sizes) {
        const cur = s.measured[z.id];
        if (cur && cur.width === z.width && cur.height === z.height) continue;
        measured ??= { ...s.measured };
        measured[z.id] = { width: z.width, height: z.height };
      }
      if (measured) set({ measured });
    },

    setViewport(v) {
      set({ viewport: v });
    },

    setNotice(text) {
      set({ notice: text ? { text, at: h.now() } : null });
    },

    setGeometry(geometry) {
      const s = get();
      if (s.readOnly) return;
      set({ meta: { ...s.meta, geometry }, dirty: true, structureVersion: s.structureVersion + 1 });
      if (geometry === s.savedGeometry) set({ dirty: h.isDirty(s.nodes, s.joints) });
    },
  };
}
