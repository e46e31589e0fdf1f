"use client";
/** The React Flow canvas, rendered from the editor store; every change goes back through store actions. */
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from "react";
import {
  Background,
  BackgroundVariant,
  ConnectionMode,
  ControlButton,
  Controls,
  MiniMap,
  ReactFlow,
  getNodesBounds,
  getViewportForBounds,
  useReactFlow,
  useStoreApi,
  type Connection,
  type EdgeChange,
  type IsValidConnection,
  type NodeChange,
  type Viewport,
} from "@xyflow/react";
import type { NodeKind } from "@/shared/linkage/schema";
import { useEditorConfig, useEditorStore, useEditorStoreApi } from "./context";
import { cardSize, layoutHandles, nodeTypes, type PartFlowNode } from "./nodes";
import { edgeTypes, SEVERITY_HEX, type JointFlowEdge } from "./joints/JointEdge";
import type { EditorState, SubjectRef } from "./store";
import { FIT, focusZoom, openingViewport } from "./view";

export const KIND_MIME = "application/x-linkwright-kind";
export const GRID = 10;

// Module-level: React Flow copies each of these props into its store whenever its reference changes,
// and every subscribed node and edge re-checks (a new `defaultEdgeOptions` re-renders every edge), so
// an inline literal here costs a full store pass on every render of the canvas, i.e. every drag frame.
const SNAP_GRID: [number, number] = [GRID, GRID];
const DEFAULT_EDGE_OPTIONS = { type: "joint" } as const;

type NodeCacheEntry = { src: EditorState["nodes"][number]; sel: boolean; m: EditorState["measured"][string] | undefined; ro: boolean; rf: PartFlowNode };
type EdgeCacheEntry = { src: EditorState["joints"][number]; sel: boolean; rf: JointFlowEdge };

/** React Flow nodes from the store, reusing the same object for every part that did not change. */
function toFlowNodes(s: EditorState, readOnly: boolean, cache: Map<string, NodeCacheEntry>): PartFlowNode[] {
  const sel = new Set(s.selection.nodes);
  const seen = new Set<string>();
  const out = s.nodes.map((n) => {
    seen.add(n.id);
    const isSel = sel.has(n.id);
    const m = s.measured[n.id];
    const c = cache.get(n.id);
    if (c && c.src === n && c.sel === isSel && c.m === m && c.ro === readOnly) return c.rf;
    // Only the parts in view are mounted (onlyRenderVisibleElements); until a part has been measured its
    // size and ports come from the card's layout, so joints to parts off screen are drawn all the same.
    const size = cardSize(n);
    const rf: PartFlowNode = {
      id: n.id,
      type: n.kind,
      position: n.position,
      data: { node: n },
      selected: isSel,
      measured: m,
      initialWidth: size.width,
      initialHeight: size.height,
      handles: m ? undefined : layoutHandles(n.kind, size),
      draggable: !readOnly,
    };
    cache.set(n.id, { src: n, sel: isSel, m, ro: readOnly, rf });
    return rf;
  });
  if (cache.size > seen.size) for (const id of cache.keys()) if (!seen.has(id)) cache.delete(id);
  return out;
}

/**
 * Hands the store's parts to React Flow's own store, outside React rendering: a drag frame then updates
 * only the dragged card, its joints and its minimap mark, instead of re-rendering the whole <ReactFlow>
 * tree with a new `nodes` prop (React Flow calls its onNodesChange and waits for the parts to come back,
 * as with a controlled `nodes` prop). Synchronous, so a moved part is drawn in the frame of its move.
 */
function NodesToFlow({ readOnly }: { readOnly: boolean }) {
  const api = useEditorStoreApi();
  const flow = useStoreApi<PartFlowNode, JointFlowEdge>();
  useLayoutEffect(() => {
    const cache = new Map<string, NodeCacheEntry>();
    let last: Pick<EditorState, "nodes" | "measured"> & { sel: string[] } | null = null;
    const push = (s: EditorState) => {
      if (last && last.nodes === s.nodes && last.sel === s.selection.nodes && last.measured === s.measured) return;
      last = { nodes: s.nodes, sel: s.selection.nodes, measured: s.measured };
      flow.getState().setNodes(toFlowNodes(s, readOnly, cache));
    };
    push(api.getState());
    return api.subscribe(push);
  }, [api, flow, readOnly]);
  return null;
}


function useFlowEdges(): JointFlowEdge[] {
  const { joints, selected } = useEditorStore((s) => ({ joints: s.joints, selected: s.selection.joints }));
  const cache = useRef(new Map<string, EdgeCacheEntry>());
  return useMemo(() => {
    const sel = new Set(selected);
    const next = new Map<string, EdgeCacheEntry>();
    const out = joints.map((j) => {
      const isSel = sel.has(j.id);
      const c = cache.current.get(j.id);
      if (c && c.src === j && c.sel === isSel) {
        next.set(j.id, c);
        return c.rf;
      }
      const rf: JointFlowEdge = {
        id: j.id,
        type: "joint",
        source: j.from.node,
        sourceHandle: j.from.port,
        target: j.to.node,
        targetHandle: j.to.port,
        data: { joint: j },
        selected: isSel,
      };
      next.set(j.id, { src: j, sel: isSel, rf });
      return rf;
    });
    cache.current = next;
    return out;
  }, [joints, selected]);
}

/** The centre of a part or a joint in flow coordinates (null when it is not on the canvas). */
export function subjectCentre(s: Pick<EditorState, "nodes" | "joints" | "measured">, subject: SubjectRef): { x: number; y: number } | null {
  const centre = (id: string) => {
    const n = s.nodes.find((x) => x.id === id);
    if (!n) return null;
    const m = s.measured[id] ?? cardSize(n);
    return { x: n.position.x + m.width / 2, y: n.position.y + m.height / 2 };
  };
  if (subject.type === "node") return centre(subject.id);
  if (subject.type === "joint") {
    const j = s.joints.find((x) => x.id === subject.id);
    const a = j && centre(j.from.node);
    const b = j && centre(j.to.node);
    if (a && b) return { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
  }
  return null;
}

/** The flow-space box around every part: stored positions, measured sizes or, unmeasured, the card layout. */
export function linkageBounds(s: Pick<EditorState, "nodes" | "measured">) {
  return getNodesBounds(s.nodes.map((n) => ({ id: n.id, position: n.position, data: {}, measured: s.measured[n.id] ?? cardSize(n) })));
}

/** "Fit" (button, F key, after an import): the whole linkage in view (padding 0.15, at most 1.25×). */
export const FIT_ALL = { padding: FIT.padding, maxZoom: FIT.maxZoom, minZoom: 0.05 } as const;

/**
 * Fit the whole linkage. Computed here rather than with React Flow's fitView, which waits until every
 * part has been measured: the canvas mounts only the parts in view, so on a long run that never happens.
 */
export function useFitAll() {
  const api = useEditorStoreApi();
  const flow = useStoreApi();
  const rf = useReactFlow();
  return useCallback(
    (o?: { duration?: number }) => {
      const s = api.getState();
      const { width, height } = flow.getState();
      if (s.nodes.length === 0 || !width || !height) return;
      const v = getViewportForBounds(linkageBounds(s), width, height, FIT_ALL.minZoom, FIT_ALL.maxZoom, FIT_ALL.padding);
      void rf.setViewport(v, { duration: o?.duration });
    },
    [api, flow, rf],
  );
}

/** Select a subject and bring it to the middle of the canvas. */
export function useFocusSubject() {
  const api = useEditorStoreApi();
  const rf = useReactFlow();
  return useCallback(
    (subject: SubjectRef, o?: { duration?: number; zoom?: number }) => {
      const s = api.getState();
      s.select(subject);
      const p = subjectCentre(s, subject);
      if (p) void rf.setCenter(p.x, p.y, { zoom: o?.zoom ?? focusZoom(rf.getZoom()), duration: o?.duration ?? 250 });
    },
    [api, rf],
  );
}

/**
 * The first view: the deep-linked subject centred (and selected), or the whole linkage fitted with labels
 * kept readable (editor/view.ts). Part sizes come from the card layout, so this does not wait for the
 * browser to measure every part (only those in view are mounted). The canvas stays hidden until then so
 * it does not jump.
 */
function useOpeningView(wrap: React.RefObject<HTMLDivElement | null>, opening: SubjectRef | null | undefined) {
  const api = useEditorStoreApi();
  const rf = useReactFlow();
  const focus = useFocusSubject();
  // An empty linkage keeps 1:1 so drops land where aimed.
  const [ready, setReady] = useState(() => api.getState().nodes.length === 0);
  useEffect(() => {
    if (ready) return;
    const r = wrap.current?.getBoundingClientRect();
    if (!r || r.width === 0 || r.height === 0) return;
    const v = openingViewport(linkageBounds(api.getState()), r.width, r.height);
    void rf.setViewport(v);
    api.getState().setViewport(v);
    if (opening) focus(opening, { duration: 0, zoom: focusZoom(v.zoom) });
    setReady(true);
  }, [ready, wrap, rf, api, opening, focus]);
  // Never leave the canvas hidden if the canvas takes unusually long to get its size.
  useEffect(() => {
    if (ready) return;
    const t = setTimeout(() => setReady(true), 2000);
    return () => clearTimeout(t);
  }, [ready]);
  return ready;
}

export default function Canvas({ opening }: { opening?: SubjectRef | null }) {
  const api = useEditorStoreApi();
  const { readOnly } = useEditorConfig();
  const edges = useFlowEdges();
  const rf = useReactFlow();
  const wrap = useRef<HTMLDivElement>(null);
  const ready = useOpeningView(wrap, opening);
  const fitAll = useFitAll();

  const onNodesChange = useCallback(
    (changes: NodeChange<PartFlowNode>[]) => {
      const s = api.getState();
      const moves: { id: string; position: { x: number; y: number } }[] = [];
      const sizes: { id: string; width: number; height: number }[] = [];
      let sel: Set<string> | null = null;
      for (const c of changes) {
        if (c.type === "position" && c.position) moves.push({ id: c.id, position: c.position });
        else if (c.type === "dimensions" && c.dimensions) sizes.push({ id: c.id, width: c.dimensions.width, height: c.dimensions.height });
        else if (c.type === "select") {
          sel ??= new Set(s.selection.nodes);
          if (c.selected) sel.add(c.id);
          else sel.delete(c.id);
        }
      }
      if (sizes.length) s.setMeasured(sizes);
      if (moves.length) s.moveNodes(moves, { transient: true });
      if (sel) s.setSelection({ nodes: s.nodes.filter((n) => sel!.has(n.id)).map((n) => n.id) });
    },
    [api],
  );

  const onEdgesChange = useCallback(
    (changes: EdgeChange<JointFlowEdge>[]) => {
      const s = api.getState();
      let sel: Set<string> | null = null;
      for (const c of changes) {
        if (c.type === "select") {
          sel ??= new Set(s.selection.joints);
          if (c.selected) sel.add(c.id);
          else sel.delete(c.id);
        }
      }
      if (sel) s.setSelection({ joints: s.joints.filter((j) => sel!.has(j.id)).map((j) => j.id) });
    },
    [api],
  );

  const onConnect = useCallback(
    (c: Connection) => {
      if (!c.sourceHandle || !c.targetHandle) return;
      api.getState().connect({ node: c.source, port: c.sourceHandle }, { node: c.target, port: c.targetHandle });
    },
    [api],
  );

  const isValidConnection: IsValidConnection<JointFlowEdge> = useCallback(
    (c) => {
      if (!c.sourceHandle || !c.targetHandle) return false;
      return api.getState().canConnect({ node: c.source, port: c.sourceHandle }, { node: c.target, port: c.targetHandle }).ok;
    },
    [api],
  );

  const onDragOver = useCallback((e: React.DragEvent) => {
    if (e.dataTransfer.types.includes(KIND_MIME)) {
      e.preventDefault();
      e.dataTransfer.dropEffect = "copy";
    }
  }, []);

  const onDrop = useCallback(
    (e: React.DragEvent) => {
      const kind = e.dataTransfer.getData(KIND_MIME) as NodeKind;
      if (!kind || readOnly) return;
      e.preventDefault();
      const p = rf.screenToFlowPosition({ x: e.clientX, y: e.clientY });
      // Drop centres the card on the pointer, snapped to the grid.
      api.getState().addNode(kind, { x: Math.round((p.x - 74) / GRID) * GRID, y: Math.round((p.y - 25) / GRID) * GRID });
    },
    [api, rf, readOnly],
  );

  const onMoveEnd = useCallback((_: unknown, v: Viewport) => api.getState().setViewport(v), [api]);
  const onNodeDragStart = useCallback(() => api.getState().beginGesture(), [api]);
  const onNodeDragStop = useCallback(() => api.getState().endGesture(), [api]);
  const minimapColor = useCallback((n: PartFlowNode) => {
    const w = api.getState().worstByNode[n.id];
    return w ? SEVERITY_HEX[w] : "#c9cfd6";
  }, [api]);

  return (
    <div ref={wrap} className="h-full w-full" style={ready ? undefined : { opacity: 0 }} data-view={ready ? "ready" : "opening"} onDragOver={onDragOver} onDrop={onDrop} data-testid="canvas">
      <ReactFlow<PartFlowNode, JointFlowEdge>
        edges={edges}
        nodeTypes={nodeTypes}
        edgeTypes={edgeTypes}
        onNodesChange={onNodesChange}
        onEdgesChange={onEdgesChange}
        onConnect={onConnect}
        isValidConnection={isValidConnection}
        onNodeDragStart={onNodeDragStart}
        onNodeDragStop={onNodeDragStop}
        onMoveEnd={onMoveEnd}
        connectionMode={ConnectionMode.Loose}
        nodesDraggable={!readOnly}
        nodesConnectable={!readOnly}
        elementsSelectable
        deleteKeyCode={null}
        disableKeyboardA11y
        snapToGrid
        snapGrid={SNAP_GRID}
        minZoom={0.05}
        maxZoom={3}
        connectionRadius={28}
        defaultEdgeOptions={DEFAULT_EDGE_OPTIONS}
        onlyRenderVisibleElements
      >
        <NodesToFlow readOnly={readOnly} />
        <Background variant={BackgroundVariant.Dots} gap={GRID * 2} size={1} color="#cfd4da" />
        <MiniMap<PartFlowNode> pannable zoomable nodeColor={minimapColor} className="!bg-white/90" />
        <Controls showInteractive={false} showFitView={false}>
          <ControlButton onClick={() => fitAll({ duration: 200 })} title="Fit the whole linkage in view (F)" aria-label="Fit the whole linkage in view">
            <svg viewBox="0 0 16 16" aria-hidden="true"><path d="M2 6V2h4M10 2h4v4M14 10v4h-4M6 14H2v-4" fill="none" stroke="currentColor" strokeWidth="1.6" /></svg>
          </ControlButton>
        </Controls>
      </ReactFlow>
    </div>
  );
}
