"use client";
/**
 * One memoised node component per part kind. Each draws the same card frame with the kind's
 * ports (React Flow handles, id = port name) and a line or two of the numbers that matter.
 */
import { memo } from "react";
import { Handle, Position, type Node, type NodeHandle, type NodeProps } from "@xyflow/react";
import type { ControlSystem, LinkageNode, NodeKind } from "@/shared/linkage/schema";
import { SEVERITY_BG, SEVERITY_BORDER } from "../presentation";
import { useEditorConfig, useEditorValue } from "../context";
import { partName } from "@/shared/linkage/names";
import { partAccessibleName } from "../a11y";
import { partCoverage } from "./coverage";
import { partNameId } from "../canvas/adapters";
import type { UnitSystem } from "../units";
import { KindGlyph } from "./glyphs";
import { EDITOR_KIND_LIST, EDITOR_KINDS } from "./kinds";
import { CARD_WIDTH, cardHeight, PORT_SIDES, portBoxes, portFraction, type Side } from "./geometry";

export type PartNodeData = { node: LinkageNode };
export type PartFlowNode = Node<PartNodeData, NodeKind>;

export { PORT_SIDES };
const POS: Record<Side, Position> = { left: Position.Left, right: Position.Right, top: Position.Top, bottom: Position.Bottom };


/**
 * `toEnter`: how many of the part's values are still the starting values it was placed with. A small tab on
 * the card's top edge says so in words (outside the card's box, so the card's size and ports stay put); a
 * screen reader hears it in the part's name.
 */
function PartFrame({ id, kind, label, lines, selected, toEnter, coverage }: { id: string; kind: NodeKind; label: string; lines: string[]; selected: boolean; toEnter: number; coverage: string }) {
  const { readOnly } = useEditorConfig();
  const key = `node:${id}`;
  const badge = useEditorValue((s) => s.badgeBySubject[key]);
  const worst = badge?.worst;
  const count = badge?.count ?? 0;
  const ports = Object.keys(PORT_SIDES[kind]);
  return (
    <div
      data-testid={`node-${id}`}
      data-kind={kind}
      data-severity={worst ?? "none"}
      className={[
        "group relative w-[148px] rounded-md border-2 bg-white px-2 py-1.5 text-ink shadow-sm",
        worst ? SEVERITY_BORDER[worst] : "border-ink/25",
        selected ? "ring-2 ring-ink ring-offset-1" : "",
      ].join(" ")}
    >
      <span id={partNameId(id)} className="sr-only">{partAccessibleName({ kind, label }, badge, toEnter, coverage)}</span>
      {toEnter > 0 && (
        <span
          aria-hidden="true"
          data-testid={`to-enter-${id}`}
          className="pointer-events-none absolute -top-2 right-2 rounded-sm border border-caution/50 bg-white px-1 text-[9px] font-medium leading-3 text-caution"
        >
          {toEnter} to enter
        </span>
      )}
      <div className="flex items-center gap-1.5" aria-hidden="true">
        <KindGlyph kind={kind} className="h-4 w-4 shrink-0 text-ink-soft" />
        <div className="min-w-0 flex-1 truncate text-[12px] font-semibold leading-4" title={label}>
          {partName({ kind, label })}
        </div>
        {worst && (
          <span className={`rounded px-1 text-[10px] font-bold leading-4 text-white ${SEVERITY_BG[worst]}`} title={`${count} finding(s), worst: ${worst}`}>
            {count}
          </span>
        )}
      </div>
      {lines.map((l, i) => (
        <div key={i} className="truncate pl-[22px] text-[11px] leading-4 tabular-nums text-ink-soft">
          {l}
        </div>
      ))}
      {ports.map((port) => {
        const { side, f } = portFraction(kind, port)!;
        const pct = `${f * 100}%`;
        const style = side === "left" || side === "right" ? { top: pct } : { left: pct };
        return (
          <Handle
            key={port}
            id={port}
            type="source"
            position={POS[side]}
            isConnectable={!readOnly}
            style={style}
            data-testid={`port-${id}-${port}`}
            title={`${port} port`}
            className="!h-3 !w-3 !rounded-sm !border-2 !border-ink !bg-paper hover:!bg-ink"
          >
            <span
              className={[
                "pointer-events-none absolute hidden whitespace-nowrap rounded bg-white/90 px-0.5 text-[9px] font-medium uppercase tracking-wide text-ink-soft group-hover:block",
                selected ? "!block" : "",
                // Outside the card, beyond its port (inside, a selected card's labels covered its key numbers), and off
                // the joint's line: above it beside a side port, beside it at a top or bottom port — on the line, a
                // label covered the joint's badge and its findings count.
                side === "left" ? "bottom-3.5 right-1" : "",
                side === "right" ? "bottom-3.5 left-1" : "",
                side === "top" ? "bottom-2 left-3.5" : "",
                side === "bottom" ? "left-3.5 top-2" : "",
              ].join(" ")}
            >
              {port}
            </span>
          </Handle>
        );
      })}
    </div>
  );
}

/** The key-number lines a part's card shows (also drawn by the picture export). */
export function nodeLines(node: LinkageNode, u: UnitSystem, system: ControlSystem = "other"): string[] {
  return EDITOR_KINDS[node.kind]?.lines(node.props as never, u, system) ?? [];
}

/** A part card's size as laid out (editor/nodes/geometry.ts); the line count does not depend on units. */
export function cardSize(node: LinkageNode): { width: number; height: number } {
  return { width: CARD_WIDTH, height: cardHeight(nodeLines(node, "US").length) };
}

/** The ports of a card not measured yet, placed as the card lays them out (so its joints can be drawn). */
export function layoutHandles(kind: NodeKind, size: { width: number; height: number }): NodeHandle[] {
  return portBoxes(kind, size).map((b) => ({ id: b.id, type: "source", position: POS[b.side], x: b.x, y: b.y, width: b.width, height: b.height }));
}

function makeNode(kind: NodeKind) {
  const lines = EDITOR_KINDS[kind].lines as (props: LinkageNode["props"], u: UnitSystem, system: ControlSystem) => string[];
  const C = memo(function PartNode({ id, data, selected }: NodeProps<PartFlowNode>) {
    const { unitSystem } = useEditorConfig();
    const system = useEditorValue((s) => s.meta.system);
    const node = data.node;
    // What "no findings" means for this part (a string: the index behind it is built once per report).
    const coverage = useEditorValue((s) => partCoverage(node, s.joints, s.nodes, s.report).short);
    return <PartFrame id={id} kind={kind} label={node.label} lines={lines(node.props, unitSystem, system)} selected={!!selected} toEnter={node.unentered?.length ?? 0} coverage={coverage} />;
  });
  C.displayName = `${kind}Node`;
  return C;
}

/** One memoised component per registered kind; module-level, so React Flow never sees a new object. */
export const nodeTypes = Object.fromEntries(EDITOR_KIND_LIST.map((d) => [d.kind, makeNode(d.kind)])) as Record<NodeKind, ReturnType<typeof makeNode>>;
