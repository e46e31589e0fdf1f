"use client";
/**
 * Between the editor store and React Flow: parts handed to React Flow's own store (NodesToFlow), joints as
 * edges, and React Flow's events (moves, sizes, selection, connections, drops) turned back into store actions.
 * Objects are reused for every part and joint that did not change, so a drag frame re-renders the moved card
 * and its joints, not the whole canvas (DEVELOPERS.md "The canvas and many parts").
 */
import { useCallback, useLayoutEffect, useMemo, useRef } from "react";
import { useReactFlow, useStoreApi, type Connection, type EdgeChange, type IsValidConnection, type NodeChange, type Viewport } from "@xyflow/react";
import type { NodeKind } from "@/shared/linkage/schema";
import { useEditorConfig, useEditorStore, useEditorStoreApi, useEditorValue } from "../context";
import { jointAccessibleName } from "../a11y";
import { jointCoverage, jointResult } from "../joints/coverage";
import { cardSize, layoutHandles, type PartFlowNode } from "../nodes";
import type { JointFlowEdge } from "../joints/JointEdge";
import { SEVERITY_HEX } from "../presentation";
import type { EditorState } from "../store";
import { dropCorner, KIND_MIME } from "./viewport";

/** The ids of the hidden elements that hold a part's and a joint's accessible names (drawn by the card and the badge). */
export const partNameId = (id: string) => `part-name-${id}`;
export const jointNameId = (id: string) => `joint-name-${id}`;
/** The hidden line that tells a screen reader the canvas keys (drawn by Canvas). */
export const CANVAS_KEYS_ID = "canvas-keys";

type NodeCacheEntry = { src: EditorState["nodes"][number]; sel: boolean; m: EditorState["measured"][string] | undefined; ro: boolean; rf: PartFlowNode };
type EdgeCacheEntry = { src: EditorState["joints"][number]; sel: boolean; name: string; rf: JointFlowEdge };

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
      // Heard as "part" named by the card's own hidden name (kind, label, findings: editor/a11y.ts).
      domAttributes: { "aria-roledescription": "part", "aria-labelledby": partNameId(n.id), "aria-describedby": CANVAS_KEYS_ID },
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
export function NodesToFlow({ readOnly }: { readOnly: boolean }) {
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

/** The store's joints as React Flow edges, reusing the same object for every joint that did not change. */
export function useFlowEdges(): JointFlowEdge[] {
  const { joints, selected } = useEditorStore((s) => ({ joints: s.joints, selected: s.selection.joints }));
  // Every joint's spoken name, one string (a drag frame that renames nothing re-renders nothing).
  const spoken = useEditorValue((s) => s.joints.map((j) => jointAccessibleName(j, s.nodes, s.badgeBySubject[`joint:${j.id}`], jointCoverage(j, s.nodes, jointResult(s.report, j.id), !!s.report).short)).join("\n"));
  const cache = useRef(new Map<string, EdgeCacheEntry>());
  return useMemo(() => {
    const sel = new Set(selected);
    const names = spoken.split("\n");
    const next = new Map<string, EdgeCacheEntry>();
    const out = joints.map((j, i) => {
      const isSel = sel.has(j.id);
      const name = names[i] ?? "";
      const c = cache.current.get(j.id);
      if (c && c.src === j && c.sel === isSel && c.name === name) {
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
        // The joint is heard by its name, as the app names it everywhere, never React Flow's "Edge from <id> to <id>".
        ariaLabel: name,
        domAttributes: { "aria-roledescription": "joint", "aria-labelledby": jointNameId(j.id) },
      };
      next.set(j.id, { src: j, sel: isSel, name, rf });
      return rf;
    });
    cache.current = next;
    return out;
  }, [joints, selected, spoken]);
}

/** React Flow's events as store actions (stable callbacks: React Flow re-checks its store on a new one). */
export function useFlowHandlers() {
  const api = useEditorStoreApi();
  const { readOnly } = useEditorConfig();
  const rf = useReactFlow();

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
      // The card lands centred on the pointer, snapped to the grid.
      api.getState().addNode(kind, dropCorner(kind, rf.screenToFlowPosition({ x: e.clientX, y: e.clientY })));
    },
    [api, rf, readOnly],
  );

  const onMoveEnd = useCallback((_: unknown, v: Viewport) => api.getState().setViewport(v), [api]);
  const onNodeDragStart = useCallback(() => api.getState().beginGesture(), [api]);
  const onNodeDragStop = useCallback(() => api.getState().endGesture(), [api]);
  const minimapColor = useCallback(
    (n: PartFlowNode) => {
      const w = api.getState().worstByNode[n.id];
      return w ? SEVERITY_HEX[w] : "#c9cfd6";
    },
    [api],
  );

  return { onNodesChange, onEdgesChange, onConnect, isValidConnection, onDragOver, onDrop, onMoveEnd, onNodeDragStart, onNodeDragStop, minimapColor };
}
