/**
 * The editor store: the one home of linkage-editor state (parts, joints, selection, viewport,
 * undo/redo history, dirty tracking, clipboard and the live load-path report).
 * React Flow renders from it; nothing here talks to the network (saving lives in useAutosave).
 * One store is created per editor mount with `createEditorStore`.
 */
import { createStore, type StoreApi } from "zustand/vanilla";
import {
  FORMAT_VERSION,
  PORTS,
  hardwareSchema,
  nodeSchema,
  type ControlSystem,
  type Joint,
  type JointHardware,
  type LinkageGraph,
  type LinkageNode,
  type NodeKind,
} from "@/shared/linkage/schema";
import type { AnalysisSettings, Finding, Report, Severity } from "@/shared/analysis/types";
import type { LinkageGeometry } from "@/shared/linkage/geometry";
import { defaultProps, KIND_NAMES } from "@/shared/linkage/kinds";
import { indexById, jointName, partName } from "@/shared/linkage/names";

export type XY = { x: number; y: number };
export type Viewport = { x: number; y: number; zoom: number };
/** `geometry`: the linkage geometry a save sent (kept outside undo; see setGeometry). */
export type Snapshot = { nodes: LinkageNode[]; joints: Joint[]; geometry?: LinkageGeometry };
export type Selection = { nodes: string[]; joints: string[] };
export type SubjectRef = { type: "node" | "joint" | "linkage"; id: string };
export type Endpoint = { node: string; port: string };
export type Result<T = undefined> = { ok: true; value: T } | { ok: false; reason: string };

export type AnalyzeFn = (graph: LinkageGraph, settings?: AnalysisSettings) => Report;

export type EditorOptions = {
  revision?: number;
  readOnly?: boolean;
  settings?: AnalysisSettings;
  /** The load-path engine; absent = no live findings (tests may inject a fake). */
  analyze?: AnalyzeFn;
  /** ms after the last structural change before the engine runs; 0 = synchronously. */
  analysisDelay?: number;
  historyLimit?: number;
  /** Deterministic ids for tests. */
  newId?: (kind: string) => string;
  /** Clock for coalescing edits (tests). */
  now?: () => number;
};

const SEVERITY_RANK: Record<Severity, number> = { hazard: 3, caution: 2, advisory: 1 };
export function worse(a: Severity | undefined, b: Severity): Severity {
  return !a || SEVERITY_RANK[b] > SEVERITY_RANK[a] ? b : a;
}
export const subjectKey = (s: SubjectRef) => `${s.type}:${s.id}`;

/** Display names and starting props of each kind live in the kind registry (shared/linkage/kinds). */
export { KIND_NAMES, defaultProps };

export type EditorState = {
  meta: { name: string; system: ControlSystem; geometry?: LinkageGeometry };
  /** The geometry as last confirmed by the server. */
  savedGeometry?: LinkageGeometry;
  nodes: LinkageNode[];
  joints: Joint[];
  selection: Selection;
  measured: Record<string, { width: number; height: number }>;
  viewport: Viewport;
  past: Snapshot[];
  future: Snapshot[];
  /** The graph as last confirmed by the server (by reference: undoing back to it is clean again). */
  saved: Snapshot;
  /** The revision the next save is based on. */
  revision: number;
  dirty: boolean;
  /** Bumps whenever the graph is changed from outside a form (undo, redo, paste, replace): forms reset. */
  epoch: number;
  /** Bumps on every change the engine cares about (not on moves). */
  structureVersion: number;
  clipboard: Snapshot | null;
  readOnly: boolean;
  settings: AnalysisSettings | undefined;
  report: Report | null;
  analysisError: string | null;
  findingsBySubject: Record<string, Finding[]>;
  worstByNode: Record<string, Severity>;
  worstByJoint: Record<string, Severity>;
  /**
   * Per subject key (`node:<id>`, `joint:<id>`) with findings: the worst severity and how many, one stable
   * object per analysis run, so a part or joint on the canvas subscribes to one reference.
   */
  badgeBySubject: Record<string, Badge>;
  /** The last refused action, for a toast. */
  notice: { text: string; at: number } | null;

  addNode: (kind: NodeKind, position: XY, init?: { label?: string; props?: Partial<LinkageNode["props"]> }) => string;
  moveNodes: (moves: { id: string; position: XY }[], opts?: { transient?: boolean }) => void;
  beginGesture: () => void;
  endGesture: () => void;
  updateNode: (id: string, patch: { label?: string; props?: unknown }, opts?: { coalesce?: string }) => Result;
  /** `external`: the change comes from outside the joint card (e.g. a suggested part), so the card resets. */
  updateJointHardware: (id: string, hardware: unknown, opts?: { coalesce?: string; external?: boolean }) => Result;
  canConnect: (from: Endpoint, to: Endpoint) => Result;
  connect: (from: Endpoint, to: Endpoint) => Result<string>;
  deleteSelection: () => void;
  deleteElements: (ids: { nodes?: string[]; joints?: string[] }) => void;
  duplicate: () => void;
  copy: () => void;
  paste: (at?: XY) => void;
  nudge: (dx: number, dy: number) => void;
  undo: () => void;
  redo: () => void;
  markSaved: (revision: number, snapshot?: Snapshot) => void;
  rebase: (revision: number) => void;
  replaceGraph: (graph: LinkageGraph, opts?: { revision?: number }) => void;
  setSelection: (sel: Partial<Selection>) => void;
  select: (subject: SubjectRef | null, additive?: boolean) => void;
  selectAll: () => void;
  setMeasured: (sizes: { id: string; width: number; height: number }[]) => void;
  setViewport: (v: Viewport) => void;
  setNotice: (text: string | null) => void;
  setSettings: (s: AnalysisSettings | undefined) => void;
  runAnalysis: () => void;
  /** Replace the linkage geometry (the geometry view); saved with the graph, not part of undo. */
  setGeometry: (g: LinkageGeometry | undefined) => void;
};

export type EditorStore = StoreApi<EditorState>;
export type Badge = { worst: Severity; count: number };

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

function shortId(kind: string, taken: (id: string) => boolean): string {
  for (;;) {
    const id = `${kind.slice(0, 2).toLowerCase()}-${Math.random().toString(36).slice(2, 8)}`;
    if (!taken(id)) return id;
  }
}

function issuesText(err: { issues: { path: PropertyKey[]; message: string }[] }): string {
  return err.issues.map((i) => (i.path.length ? `${i.path.join(".")}: ${i.message}` : i.message)).join("; ");
}

export function createEditorStore(initial: LinkageGraph, opts: EditorOptions = {}): EditorStore {
  const historyLimit = opts.historyLimit ?? 100;
  const now = opts.now ?? (() => Date.now());
  const analysisDelay = opts.analysisDelay ?? 150;
  let lastCoalesce: { key: string; at: number } | null = null;
  let gestureStart: Snapshot | null = null;
  let analysisTimer: ReturnType<typeof setTimeout> | null = null;

  const store = createStore<EditorState>()((set, get) => {
    const taken = (id: string) => get().nodes.some((n) => n.id === id) || get().joints.some((j) => j.id === id);
    const newId = (kind: string) => {
      if (opts.newId) return opts.newId(kind);
      return shortId(kind, taken);
    };
    const snap = (): Snapshot => ({ nodes: get().nodes, joints: get().joints });
    const isDirty = (nodes: LinkageNode[], joints: Joint[]) =>
      nodes !== get().saved.nodes || joints !== get().saved.joints || get().meta.geometry !== get().savedGeometry;

    /** Apply a change as one undoable step (or fold it into the previous step when coalescing). */
    const commit = (next: Partial<Snapshot> & { selection?: Selection }, o: { coalesce?: string; external?: boolean; structural?: boolean } = {}) => {
      const s = get();
      if (s.readOnly) return;
      const nodes = next.nodes ?? s.nodes;
      const joints = next.joints ?? s.joints;
      const t = now();
      const fold = o.coalesce && lastCoalesce && lastCoalesce.key === o.coalesce && t - lastCoalesce.at < 1500;
      lastCoalesce = o.coalesce ? { key: o.coalesce, at: t } : null;
      const past = fold ? s.past : [...s.past, snap()].slice(-historyLimit);
      set({
        nodes,
        joints,
        past,
        future: [],
        selection: next.selection ?? s.selection,
        dirty: isDirty(nodes, joints),
        epoch: o.external ? s.epoch + 1 : s.epoch,
        structureVersion: o.structural === false ? s.structureVersion : s.structureVersion + 1,
      });
    };

    const pruneSelection = (sel: Selection, nodes: LinkageNode[], joints: Joint[]): Selection => {
      const n = new Set(nodes.map((x) => x.id));
      const j = new Set(joints.map((x) => x.id));
      return { nodes: sel.nodes.filter((id) => n.has(id)), joints: sel.joints.filter((id) => j.has(id)) };
    };

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
      meta: { name: initial.name, system: initial.system, geometry: initial.geometry },
      savedGeometry: initial.geometry,
      nodes: initial.nodes,
      joints: initial.joints,
      selection: { nodes: [], joints: [] },
      measured: {},
      viewport: { x: 0, y: 0, zoom: 1 },
      past: [],
      future: [],
      saved: { nodes: initial.nodes, joints: initial.joints },
      revision: opts.revision ?? 0,
      dirty: false,
      epoch: 0,
      structureVersion: 0,
      clipboard: null,
      readOnly: opts.readOnly ?? false,
      settings: opts.settings,
      report: null,
      analysisError: null,
      findingsBySubject: {},
      worstByNode: {},
      worstByJoint: {},
      badgeBySubject: {},
      notice: null,

      addNode(kind, position, init) {
        if (get().readOnly) return "";
        const id = newId(kind);
        const count = get().nodes.filter((n) => n.kind === kind).length + 1;
        const parsed = nodeSchema.safeParse({
          id,
          kind,
          label: init?.label ?? `${KIND_NAMES[kind]} ${count}`,
          position: { x: Math.round(position.x), y: Math.round(position.y) },
          props: { ...defaultProps(kind, get().meta.system), ...(init?.props ?? {}) },
        });
        if (!parsed.success) {
          get().setNotice(`Could not add the part: ${issuesText(parsed.error)}`);
          return "";
        }
        commit({ nodes: [...get().nodes, parsed.data], selection: { nodes: [id], joints: [] } });
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
        if (o?.transient) set({ nodes, dirty: isDirty(nodes, s.joints) });
        else commit({ nodes }, { structural: false });
      },

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
        set({ past: [...s.past, start].slice(-historyLimit), future: [], dirty: isDirty(s.nodes, s.joints) });
      },

      updateNode(id, patch, o) {
        const s = get();
        if (s.readOnly) return { ok: false, reason: "This linkage is read-only for you." };
        const cur = s.nodes.find((n) => n.id === id);
        if (!cur) return { ok: false, reason: `No part ${id}.` };
        const parsed = nodeSchema.safeParse({
          ...cur,
          label: patch.label ?? cur.label,
          props: patch.props ?? cur.props,
        });
        if (!parsed.success) return { ok: false, reason: issuesText(parsed.error) };
        if (JSON.stringify(parsed.data) === JSON.stringify(cur)) return { ok: true, value: undefined };
        commit({ nodes: s.nodes.map((n) => (n.id === id ? parsed.data : n)) }, { coalesce: o?.coalesce });
        return { ok: true, value: undefined };
      },

      updateJointHardware(id, hardware, o) {
        const s = get();
        if (s.readOnly) return { ok: false, reason: "This linkage is read-only for you." };
        const cur = s.joints.find((j) => j.id === id);
        if (!cur) return { ok: false, reason: `No joint ${id}.` };
        const parsed = hardwareSchema.safeParse(hardware);
        if (!parsed.success) return { ok: false, reason: issuesText(parsed.error) };
        if (JSON.stringify(parsed.data) === JSON.stringify(cur.hardware)) return { ok: true, value: undefined };
        commit({ joints: s.joints.map((j) => (j.id === id ? { ...j, hardware: parsed.data as JointHardware } : j)) }, { coalesce: o?.coalesce, external: o?.external });
        return { ok: true, value: undefined };
      },

      canConnect(from, to) {
        const s = get();
        if (s.readOnly) return { ok: false, reason: "This linkage is read-only for you." };
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
        const id = newId("joint");
        const joint: Joint = { id, from: { ...from }, to: { ...to }, hardware: hardwareSchema.parse({}) as JointHardware };
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

      nudge(dx, dy) {
        const s = get();
        const sel = new Set(s.selection.nodes);
        if (sel.size === 0) return;
        const moves = s.nodes.filter((n) => sel.has(n.id)).map((n) => ({ id: n.id, position: { x: n.position.x + dx, y: n.position.y + dy } }));
        const byId = new Map(moves.map((m) => [m.id, m.position]));
        commit({ nodes: s.nodes.map((n) => (byId.has(n.id) ? { ...n, position: byId.get(n.id)! } : n)) }, { coalesce: `nudge:${[...sel].join(",")}`, structural: false });
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
          future: [snap(), ...s.future].slice(0, historyLimit),
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
          past: [...s.past, snap()].slice(-historyLimit),
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

      replaceGraph(graph, o) {
        const s = get();
        const nodes = graph.nodes;
        const joints = graph.joints;
        lastCoalesce = null;
        if (o?.revision !== undefined) {
          // The server's version: a clean state with a fresh history.
          set({
            meta: { name: graph.name || s.meta.name, system: graph.system ?? s.meta.system, geometry: graph.geometry },
            savedGeometry: graph.geometry,
            nodes,
            joints,
            saved: { nodes, joints },
            revision: o.revision,
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
        set({ notice: text ? { text, at: now() } : null });
      },

      setGeometry(geometry) {
        const s = get();
        if (s.readOnly) return;
        set({ meta: { ...s.meta, geometry }, dirty: true, structureVersion: s.structureVersion + 1 });
        if (geometry === s.savedGeometry) set({ dirty: isDirty(s.nodes, s.joints) });
      },

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
  });

  // The live engine: rerun after structural changes (moves do not change any number).
  const schedule = () => {
    if (!opts.analyze) return;
    if (analysisDelay === 0) return store.getState().runAnalysis();
    if (analysisTimer) clearTimeout(analysisTimer);
    analysisTimer = setTimeout(() => {
      analysisTimer = null;
      store.getState().runAnalysis();
    }, analysisDelay);
  };
  store.subscribe((s, prev) => {
    if (s.structureVersion !== prev.structureVersion) schedule();
  });
  if (opts.analyze) store.getState().runAnalysis();
  return store;
}

function sameList(a: string[], b: string[]) {
  return a.length === b.length && a.every((x, i) => x === b[i]);
}

/** How parts and joints are named, and the id index behind it, live in shared/linkage/names.ts. */
export { indexById, jointName, partName };
