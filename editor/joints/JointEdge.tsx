"use client";
/**
 * A joint drawn as an edge with a compact hardware badge: a row of small chips, each a glyph whose
 * fill tells the state at a glance (solid = in place and confirmed, hollow = recorded but not
 * confirmed, dashed = missing where it is expected). The badge frame takes the worst finding's tone.
 */
import { memo } from "react";
import { BaseEdge, EdgeLabelRenderer, getBezierPath, type Edge, type EdgeProps } from "@xyflow/react";
import type { Joint } from "@/shared/linkage/schema";
import { useEditorStoreApi, useEditorValue } from "../context";
import { SEVERITY_HEX } from "../presentation";
import { jointAccessibleName } from "../a11y";
import { jointNameId } from "../canvas/adapters";
import { emptyJointChip, jointCoverage, jointResult } from "./coverage";

export type JointEdgeData = { joint: Joint };
export type JointFlowEdge = Edge<JointEdgeData, "joint">;

const INK = "#1f2a37";
const MUTED = "#9aa3ad";

type ChipState = "solid" | "hollow" | "missing";
export type Chip = { key: string; title: string; state: ChipState; glyph: "ring" | "hex" | "eye" | "washer" | "text"; text?: string; /** Words for what the joint is, not a state of its hardware. */ quiet?: boolean };

/**
 * What the badge shows for a joint's hardware (exported for tests and the export title block). `empty`: the
 * words for a joint with none (joints/coverage.ts, emptyJointChip): a cable over a pulley is not "no hardware".
 */
export function hardwareChips(h: Joint["hardware"], empty?: { text: string; title: string; quiet: boolean }): Chip[] {
  const chips: Chip[] = [];
  if (h.rodEnd) {
    const rated = h.rodEnd.ratedUltimate !== undefined;
    chips.push({ key: "rodEnd", glyph: "ring", state: rated ? "solid" : "hollow", title: rated ? `Rod end ${h.rodEnd.thread}, rated ${h.rodEnd.ratedUltimate} lbf` : `Rod end ${h.rodEnd.thread}, rating not recorded` });
    const jn = h.jamNut;
    chips.push({
      key: "jamNut",
      glyph: "hex",
      state: jn?.fitted && jn.tightened ? "solid" : jn?.fitted ? "hollow" : "missing",
      title: jn?.fitted && jn.tightened ? "Jam nut fitted and tightened" : jn?.fitted ? "Jam nut fitted, not confirmed tight" : "No jam nut recorded",
    });
    // As the engine reads it: with a witness hole the wire check is the check; without one, the recorded length.
    const hole = h.rodEnd?.hasWitnessHole !== false;
    const wv = hole && h.engagement?.witnessHoleVerified;
    const len = h.engagement?.engagedLength;
    chips.push({
      key: "witness",
      glyph: "eye",
      state: wv || (!hole && len) ? "solid" : len ? "hollow" : "missing",
      title: wv ? "Thread engagement checked at the witness hole"
        : !hole ? (len ? `No witness hole: engaged length ${len} in recorded` : "No witness hole and no engaged length recorded")
        : len ? `Engaged length ${len} in recorded, witness hole not checked` : "Thread engagement not checked",
    });
  }
  if (h.bolt) {
    chips.push({ key: "bolt", glyph: "text", text: h.bolt.size === "custom" ? "BOLT" : h.bolt.size, state: h.nut && h.nut.type !== "none" ? "solid" : "missing", title: `Bolt ${h.bolt.size}${h.nut ? `, nut: ${h.nut.type}` : ", no nut recorded"}` });
    const w = h.washerUnderHead;
    chips.push({ key: "washer", glyph: "washer", state: w ? "solid" : "missing", title: w ? `Washer under the head, ${w.outsideDiameter} in OD` : "No washer under the bolt head recorded" });
  }
  if (chips.length === 0)
    chips.push(empty
      ? { key: "empty", glyph: "text", text: empty.text, state: "hollow", title: empty.title, quiet: empty.quiet }
      : { key: "empty", glyph: "text", text: "no hardware", state: "hollow", title: "No hardware recorded for this joint yet" });
  return chips;
}

function ChipGlyph({ chip }: { chip: Chip }) {
  const c = chip.state === "missing" ? "#b54708" : INK;
  const fill = chip.state === "solid" ? c : "none";
  const dash = chip.state === "missing" ? "2 1.5" : undefined;
  if (chip.glyph === "text")
    return <span className={`px-0.5 text-[9px] leading-3 ${chip.quiet ? "font-medium text-ink-soft" : chip.state === "missing" ? "font-bold text-caution" : "font-bold text-ink"}`}>{chip.text}</span>;
  return (
    <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
      {chip.glyph === "ring" && (
        <>
          <circle cx="6" cy="6" r="4.6" fill="none" stroke={c} strokeWidth="1.3" strokeDasharray={dash} />
          <circle cx="6" cy="6" r="2" fill={fill} stroke={c} strokeWidth="1" />
        </>
      )}
      {chip.glyph === "hex" && <path d="M6 1.2 L10.2 3.6 L10.2 8.4 L6 10.8 L1.8 8.4 L1.8 3.6 Z" fill={fill} stroke={c} strokeWidth="1.3" strokeDasharray={dash} />}
      {chip.glyph === "eye" && (
        <>
          <path d="M1 6 Q6 1 11 6 Q6 11 1 6 Z" fill="none" stroke={c} strokeWidth="1.2" strokeDasharray={dash} />
          <circle cx="6" cy="6" r="1.6" fill={fill} stroke={c} strokeWidth="1" />
        </>
      )}
      {chip.glyph === "washer" && (
        <>
          <circle cx="6" cy="6" r="4.8" fill={fill} stroke={c} strokeWidth="1.2" strokeDasharray={dash} />
          <circle cx="6" cy="6" r="1.7" fill="white" stroke={c} strokeWidth="1" />
        </>
      )}
    </svg>
  );
}

export const JointEdge = memo(function JointEdge(props: EdgeProps<JointFlowEdge>) {
  const { id, sourceX, sourceY, targetX, targetY, sourcePosition, targetPosition, selected, data } = props;
  const api = useEditorStoreApi();
  const key = `joint:${id}`;
  const badge = useEditorValue((s) => s.badgeBySubject[key]);
  const worst = badge?.worst;
  const count = badge?.count ?? 0;
  const [path, lx, ly] = getBezierPath({ sourceX, sourceY, targetX, targetY, sourcePosition, targetPosition });
  const tone = worst ? SEVERITY_HEX[worst] : selected ? INK : MUTED;
  // Strings: recomputed on store changes but re-render only when a name, the findings or what is checked change.
  const emptyChip = useEditorValue((s) => (data ? JSON.stringify(emptyJointChip(data.joint, s.nodes)) : ""));
  const chips = data ? hardwareChips(data.joint.hardware, emptyChip ? JSON.parse(emptyChip) : undefined) : [];
  const spoken = useEditorValue((s) => (data ? jointAccessibleName(data.joint, s.nodes, badge, jointCoverage(data.joint, s.nodes, jointResult(s.report, data.joint.id), !!s.report).short) : ""));
  return (
    <>
      <BaseEdge id={id} path={path} interactionWidth={16} style={{ stroke: tone, strokeWidth: selected ? 3 : 2 }} />
      <EdgeLabelRenderer>
        <div
          data-testid={`joint-${id}`}
          data-severity={worst ?? "none"}
          className="nodrag nopan pointer-events-auto absolute z-10 flex cursor-pointer items-center rounded-full border-[1.5px] bg-white px-0.5 py-px shadow-sm"
          style={{ transform: `translate(-50%, -50%) translate(${lx}px, ${ly}px)`, borderColor: tone, outline: selected ? `2px solid ${INK}` : undefined, outlineOffset: 1 }}
          title={chips.map((c) => c.title).join("\n")}
          onClick={(e) => {
            e.stopPropagation();
            api.getState().select({ type: "joint", id }, e.shiftKey || e.metaKey || e.ctrlKey);
          }}
        >
          <span id={jointNameId(id)} className="sr-only">{spoken}</span>
          {chips.map((c) => (
            <span key={c.key} data-chip={c.key} data-state={c.state} className="flex items-center">
              <ChipGlyph chip={c} />
            </span>
          ))}
          {worst && (
            <span className="ml-0.5 rounded-full px-1 text-[9px] font-bold leading-3 text-white" style={{ background: tone }}>
              {count}
            </span>
          )}
        </div>
      </EdgeLabelRenderer>
    </>
  );
});

export const edgeTypes = { joint: JointEdge };
