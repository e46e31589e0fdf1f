/**
 * The canvas viewport: the grid, where a dropped part lands (its card centred on the pointer, by the card's
 * own geometry), the box around every part, Fit, bringing a subject to the middle, and the opening view.
 * Sizes come from the card layout (editor/nodes/geometry.ts), never from React Flow's measurements alone:
 * only the parts in view are mounted.
 */
import { useCallback, useEffect, useState } from "react";
import { getNodesBounds, getViewportForBounds, useReactFlow, useStoreApi } from "@xyflow/react";
import { defaultProps, type NodeKind } from "@/shared/linkage/kinds";
import type { LinkageNode } from "@/shared/linkage/schema";
import { useEditorStoreApi } from "../context";
import { cardSize } from "../nodes";
import type { EditorState, SubjectRef, XY } from "../store";
import { FIT, focusZoom, openingViewport } from "../view";

export const GRID = 10;
/** Module-level: a new array would make React Flow re-check every part (see Canvas.tsx). */
export const SNAP_GRID: [number, number] = [GRID, GRID];
/** The drag-and-drop type of a part kind dragged from the parts tray. */
export const KIND_MIME = "application/x-linkwright-kind";

/** Where a new part of `kind` goes so that its card is centred on `p` (flow coordinates), snapped to the grid. */
export function dropCorner(kind: NodeKind, p: XY): XY {
  const { width, height } = cardSize({ id: "", kind, label: "", position: { x: 0, y: 0 }, props: defaultProps(kind) } as LinkageNode);
  return { x: Math.round((p.x - width / 2) / GRID) * GRID, y: Math.round((p.y - height / 2) / GRID) * GRID };
}

/** The centre of a part or a joint in flow coordinates (null when it is not on the canvas). */
export function subjectCentre(s: Pick<EditorState, "nodes" | "joints" | "measured">, subject: SubjectRef): XY | null {
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
export function useOpeningView(wrap: React.RefObject<HTMLDivElement | null>, opening: SubjectRef | null | undefined) {
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
