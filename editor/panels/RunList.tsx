"use client";
/**
 * The run as a list: parts and joints in order along the load path (shared/linkage/order.ts), each with its
 * findings. A full alternative to the canvas — choosing an item selects it and opens its card, where it is
 * edited — and the editor's view on a phone, where the builder records checks standing at the aircraft.
 */
import { useMemo, useState } from "react";
import { runOrder } from "@/shared/linkage/order";
import { KIND_NAMES } from "@/shared/linkage/kinds";
import { jointName, partName } from "@/shared/linkage/names";
import { useEditorStore, useEditorValue } from "../context";
import { findingsBadgeText, SEVERITY_BG } from "../presentation";
import type { SubjectRef } from "../store";
import type { Badge } from "../store/types";
import { jointCoverage, jointHardwareLine, jointResult, type CoverageState } from "../joints/coverage";
import { partCoverage, type PartCoverageState } from "../nodes/coverage";

const PAGE = 300;

/**
 * Without findings, a row says what that means (joints/coverage.ts, nodes/coverage.ts): only a joint or part
 * whose checks were made reads "no findings".
 */
type RowCoverage = { state: CoverageState | PartCoverageState; short: string };
const COVERAGE_TONE: Partial<Record<RowCoverage["state"], string>> = { partly: "text-caution", toEnter: "text-caution", notChecked: "font-semibold text-caution", pending: "text-ink-soft" };

function Count({ badge, coverage, itemKey }: { badge: Badge | undefined; coverage: RowCoverage; itemKey: string }) {
  if (!badge) return <span className={`shrink-0 text-right text-[11px] ${COVERAGE_TONE[coverage.state] ?? "text-ink-soft"}`} data-coverage={coverage.state}>{coverage.short}</span>;
  return <BadgeText worst={badge.worst} itemKey={itemKey} />;
}

/** "2 hazards, 1 caution", in the colour of the worst. */
function BadgeText({ worst, itemKey }: { worst: Badge["worst"]; itemKey: string }) {
  const text = useEditorValue((s) => findingsBadgeText(s.findingsBySubject[itemKey] ?? []));
  return (
    <span className={`shrink-0 rounded px-1.5 text-right text-[11px] font-bold text-white ${SEVERITY_BG[worst]}`} data-findings-badge>
      {text}
    </span>
  );
}

/** One row of the list: a part, or a joint indented under the part before it. */
function RunRow(p: { itemKey: string; selected: boolean; badge: Badge | undefined; coverage: RowCoverage; joint?: boolean; onClick: () => void; children: React.ReactNode }) {
  return (
    <li>
      <button
        type="button"
        data-run-item={p.itemKey}
        aria-current={p.selected ? "true" : undefined}
        onClick={p.onClick}
        className={`flex min-h-11 w-full items-center gap-2 py-1.5 text-left hover:bg-paper ${p.joint ? "pl-7 pr-3" : "px-3"} ${p.selected ? "bg-advisory/10" : ""}`}
      >
        {p.joint ? <span aria-hidden="true" className="text-ink-soft">↳</span> : null}
        <span className="min-w-0 flex-1">{p.children}</span>
        <Count badge={p.badge} coverage={p.coverage} itemKey={p.itemKey} />
      </button>
    </li>
  );
}

export function RunList({ onOpen }: { onOpen: (s: SubjectRef) => void }) {
  const { nodes, joints } = useEditorStore((s) => ({ nodes: s.nodes, joints: s.joints }));
  const badges = useEditorValue((s) => s.badgeBySubject);
  const report = useEditorValue((s) => s.report);
  const sel = useEditorStore((s) => s.selection);
  const order = useMemo(() => runOrder({ nodes, joints }), [nodes, joints]);
  const nodeById = useMemo(() => new Map(nodes.map((n) => [n.id, n])), [nodes]);
  const jointById = useMemo(() => new Map(joints.map((j) => [j.id, j])), [joints]);
  const selected = new Set([...sel.nodes.map((id) => `node:${id}`), ...sel.joints.map((id) => `joint:${id}`)]);
  // A long run is read a page at a time (the selection is always within what is shown).
  const [limit, setLimit] = useState(PAGE);
  let lastSel = -1;
  for (let i = order.length - 1; i >= 0 && selected.size; i--) if (selected.has(`${order[i].type}:${order[i].id}`)) { lastSel = i; break; }
  const shown = Math.max(limit, lastSel + 1);

  if (order.length === 0)
    return (
      <div className="p-4 text-[12px] text-ink-soft" data-testid="run-list">
        <p className="font-semibold text-ink">No parts yet.</p>
        <p>Add parts from the tray (or switch to the diagram and drag them in); they are listed here along the load path, from the stick to the surface.</p>
      </div>
    );
  return (
    <nav aria-label="Parts and joints along the load path" className="h-full overflow-y-auto bg-white" data-testid="run-list">
      <ol className="divide-y divide-ink/5">
        {order.slice(0, shown).map((it) => {
          const key = `${it.type}:${it.id}`;
          const isSel = selected.has(key);
          const badge = badges[key];
          if (it.type === "node") {
            const n = nodeById.get(it.id);
            if (!n) return null;
            return (
              <RunRow key={key} itemKey={key} selected={isSel} badge={badge} coverage={partCoverage(n, joints, nodes, report)} onClick={() => onOpen({ type: "node", id: it.id })}>
                <span className="block truncate text-[13px] font-semibold">{partName(n)}</span>
                <span className="block text-[11px] text-ink-soft">{KIND_NAMES[n.kind]}</span>
              </RunRow>
            );
          }
          const j = jointById.get(it.id);
          if (!j) return null;
          return (
            <RunRow key={key} itemKey={key} selected={isSel} badge={badge} coverage={jointCoverage(j, nodes, jointResult(report, j.id), !!report)} joint onClick={() => onOpen({ type: "joint", id: it.id })}>
              <span className="block text-[12px]">Joint {jointName(j, nodeById)}</span>
              <span className="block text-[11px] text-ink-soft">{jointHardwareLine(j, nodes)}</span>
            </RunRow>
          );
        })}
      </ol>
      {order.length > shown && (
        <div className="flex items-center justify-between gap-2 border-t border-ink/10 px-3 py-2 text-[12px] text-ink-soft" data-testid="run-list-more">
          <span>Showing {shown} of {order.length} parts and joints.</span>
          <button type="button" className="min-h-11 rounded border border-ink/20 px-3 text-ink" onClick={() => setLimit(shown + PAGE)}>
            Show {Math.min(PAGE, order.length - shown)} more
          </button>
        </div>
      )}
    </nav>
  );
}
