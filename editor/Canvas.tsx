"use client";
/**
 * The React Flow canvas, rendered from the editor store; every change goes back through store actions.
 * The store ↔ React Flow adapters are in canvas/adapters.tsx, the viewport (grid, drops, Fit, focus, the
 * opening view) in canvas/viewport.ts, the Tab order along the run in canvas/tab-order.ts.
 */
import { useRef } from "react";
import { Background, BackgroundVariant, ConnectionMode, ControlButton, Controls, MiniMap, ReactFlow, type AriaLabelConfig } from "@xyflow/react";
import { useEditorConfig } from "./context";
import { nodeTypes, type PartFlowNode } from "./nodes";
import { edgeTypes, type JointFlowEdge } from "./joints/JointEdge";
import type { SubjectRef } from "./store";
import { CANVAS_KEYS_ID, jointNameId, NodesToFlow, useFlowEdges, useFlowHandlers } from "./canvas/adapters";
import { GRID, SNAP_GRID, useFitAll, useOpeningView } from "./canvas/viewport";
import { useRunTabOrder } from "./canvas/tab-order";

export { GRID, KIND_MIME, linkageBounds, subjectCentre, useFitAll, useFocusSubject, FIT_ALL } from "./canvas/viewport";

// Module-level: React Flow copies each of these props into its store whenever its reference changes,
// and every subscribed node and edge re-checks (a new `defaultEdgeOptions` re-renders every edge), so
// an inline literal here costs a full store pass on every render of the canvas, i.e. every drag frame.
const DEFAULT_EDGE_OPTIONS = { type: "joint" } as const;

const KEYS_TEXT = "Enter or Space opens its card. Arrow keys move a selected part, J joins it to another part, L lists the run, question mark lists every key.";
/** React Flow's own words, in ours. */
const ARIA: Partial<AriaLabelConfig> = {
  "node.a11yDescription.default": KEYS_TEXT,
  "node.a11yDescription.keyboardDisabled": KEYS_TEXT,
  "edge.a11yDescription.default": "Enter or Space opens the joint's card with its hardware and findings.",
  "controls.ariaLabel": "Zoom and fit",
  "controls.zoomIn.ariaLabel": "Zoom in",
  "controls.zoomOut.ariaLabel": "Zoom out",
  "controls.fitView.ariaLabel": "Fit the whole linkage in view",
  "controls.interactive.ariaLabel": "Lock or unlock the canvas",
  "minimap.ariaLabel": "Overview of the whole linkage",
  "handle.ariaLabel": "Port",
};

/** A focused joint's badge (drawn outside the SVG) shows the focus too; set on the element, no re-render. */
function markJointFocus(t: EventTarget, on: boolean) {
  const el = t as Element;
  if (typeof el.closest !== "function") return;
  const id = el.closest(".react-flow__edge")?.getAttribute("data-id");
  if (!id) return;
  const badge = document.getElementById(jointNameId(id))?.parentElement;
  if (badge) badge.dataset.focused = on ? "true" : "false";
}

export default function Canvas({ opening }: { opening?: SubjectRef | null }) {
  const { readOnly } = useEditorConfig();
  const edges = useFlowEdges();
  const h = useFlowHandlers();
  const wrap = useRef<HTMLDivElement>(null);
  const ready = useOpeningView(wrap, opening);
  const fitAll = useFitAll();
  const tabOrder = useRunTabOrder(wrap);

  return (
    <div ref={wrap} className="h-full w-full" style={ready ? undefined : { opacity: 0 }} data-view={ready ? "ready" : "opening"} onDragOver={h.onDragOver} onDrop={h.onDrop} data-testid="canvas" onKeyDownCapture={tabOrder.onKeyDownCapture} onFocusCapture={tabOrder.onFocusCapture} onFocus={(e) => markJointFocus(e.target, true)} onBlur={(e) => markJointFocus(e.target, false)}>
      <p id={CANVAS_KEYS_ID} className="sr-only">{KEYS_TEXT}</p>
      <ReactFlow<PartFlowNode, JointFlowEdge>
        edges={edges}
        nodeTypes={nodeTypes}
        edgeTypes={edgeTypes}
        onNodesChange={h.onNodesChange}
        onEdgesChange={h.onEdgesChange}
        onConnect={h.onConnect}
        isValidConnection={h.isValidConnection}
        onNodeDragStart={h.onNodeDragStart}
        onNodeDragStop={h.onNodeDragStop}
        onMoveEnd={h.onMoveEnd}
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
        ariaLabelConfig={ARIA}
      >
        <NodesToFlow readOnly={readOnly} />
        <Background variant={BackgroundVariant.Dots} gap={GRID * 2} size={1} color="#cfd4da" />
        <MiniMap<PartFlowNode> pannable zoomable nodeColor={h.minimapColor} className="!bg-white/90" />
        <Controls showInteractive={false} showFitView={false}>
          <ControlButton onClick={() => fitAll({ duration: 200 })} title="Fit the whole linkage in view (F)" aria-label="Fit the whole linkage in view">
            <svg viewBox="0 0 16 16" aria-hidden="true"><path d="M2 6V2h4M10 2h4v4M14 10v4h-4M6 14H2v-4" fill="none" stroke="currentColor" strokeWidth="1.6" /></svg>
          </ControlButton>
        </Controls>
      </ReactFlow>
    </div>
  );
}
