/**
 * The editor store's shape: the linkage being edited, the selection, the viewport, the undo history, the
 * clipboard and the live findings index, with the actions that change them; and its initial state.
 */
import type { StoreApi } from "zustand/vanilla";
import type { ControlSystem, Joint, LinkageGraph, LinkageNode, NodeKind } from "@/shared/linkage/schema";
import type { AnalysisSettings, Finding, Report, Severity } from "@/shared/analysis/types";
import type { SubjectRef } from "@/shared/linkage/names";
import type { LinkageGeometry } from "@/shared/linkage/geometry";

export type { SubjectRef };
export type XY = { x: number; y: number };
export type Viewport = { x: number; y: number; zoom: number };
/** `geometry`: the linkage geometry a save sent (kept outside undo; see setGeometry). */
export type Snapshot = { nodes: LinkageNode[]; joints: Joint[]; geometry?: LinkageGeometry };
export type Selection = { nodes: string[]; joints: string[] };
export type Endpoint = { node: string; port: string };
export type Result<T = undefined> = { ok: true; value: T } | { ok: false; reason: string };
export type Badge = { worst: Severity; count: number };

export type AnalyzeFn = (graph: LinkageGraph, settings?: AnalysisSettings) => Report;

export type EditorOptions = {
  revision?: number;
  readOnly?: boolean;
  settings?: AnalysisSettings;
  /** The load-path engine; absent = no live findings (tests may inject a fake). */
  analyze?: AnalyzeFn;
  /** Or the engine fetched on first use (the editor's first load then carries none). */
  loadAnalyze?: () => Promise<AnalyzeFn>;
  /** The server's report of the opening revision: shown at once; the engine runs after the first change. */
  initialReport?: Report | null;
  /** ms after the last structural change before the engine runs; 0 = synchronously. */
  analysisDelay?: number;
  historyLimit?: number;
  /** Deterministic ids for tests. */
  newId?: (kind: string) => string;
  /** Clock for coalescing edits (tests). */
  now?: () => number;
};

/** The data of the store (everything but the actions). */
export type EditorData = {
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
};

export type EditActions = {
  addNode: (kind: NodeKind, position: XY, init?: { label?: string; props?: Partial<LinkageNode["props"]> }) => string;
  moveNodes: (moves: { id: string; position: XY }[], opts?: { transient?: boolean }) => void;
  /** A prop whose value the patch changes is no longer a starting value (it leaves the part's `unentered`). */
  updateNode: (id: string, patch: { label?: string; props?: unknown }, opts?: { coalesce?: string }) => Result;
  /** The builder says these starting values (all when `keys` is omitted) are right: they count as entered. One undo step. */
  confirmValues: (id: string, keys?: string[]) => Result;
  /** `external`: the change comes from outside the joint card (e.g. a suggested part), so the card resets. */
  updateJointHardware: (id: string, hardware: unknown, opts?: { coalesce?: string; external?: boolean }) => Result;
  canConnect: (from: Endpoint, to: Endpoint) => Result;
  connect: (from: Endpoint, to: Endpoint) => Result<string>;
  deleteSelection: () => void;
  deleteElements: (ids: { nodes?: string[]; joints?: string[] }) => void;
  nudge: (dx: number, dy: number) => void;
  setMeasured: (sizes: { id: string; width: number; height: number }[]) => void;
  setViewport: (v: Viewport) => void;
  setNotice: (text: string | null) => void;
  /** Replace the linkage geometry (the geometry view); saved with the graph, not part of undo. */
  setGeometry: (g: LinkageGeometry | undefined) => void;
};
export type HistoryActions = {
  beginGesture: () => void;
  endGesture: () => void;
  undo: () => void;
  redo: () => void;
  markSaved: (revision: number, snapshot?: Snapshot) => void;
  rebase: (revision: number) => void;
  replaceGraph: (graph: LinkageGraph, opts?: { revision?: number }) => void;
};
export type ClipboardActions = { duplicate: () => void; copy: () => void; paste: (at?: XY) => void };
export type SelectionActions = {
  setSelection: (sel: Partial<Selection>) => void;
  select: (subject: SubjectRef | null, additive?: boolean) => void;
  selectAll: () => void;
};
export type FindingsActions = { setSettings: (s: AnalysisSettings | undefined) => void; runAnalysis: () => void };

export type CableActions = {
  /** Adds the return cable of a cable joined at both ends (editor/store/cable.ts); returns its id or "". */
  addReturnCable: (cableId: string) => string;
};
export type EditorState = EditorData & EditActions & HistoryActions & ClipboardActions & SelectionActions & FindingsActions & CableActions;
export type EditorStore = StoreApi<EditorState>;

export function initialData(initial: LinkageGraph, opts: EditorOptions): EditorData {
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
  };
}
