"use client";
/** What changed between two revisions, field by field (the diff route's answer, shared/review/diff.ts). */
import { showValue, type ChangedItem, type GraphDiff } from "@/shared/review/diff";

function Changed({ items, what }: { items: ChangedItem[]; what: string }) {
  return (
    <>
      {items.map((c) => (
        <li key={`${what}-${c.id}`}>
          <span className="font-semibold">{what} {c.name}</span> changed:
          <ul className="pl-3">
            {c.fields.map((f) => (
              <li key={f.path} data-testid="diff-field" className="font-mono text-[10px]">
                {f.path}: <span className="text-hazard">{showValue(f.before)}</span> → <span className="text-ok">{showValue(f.after)}</span>
              </li>
            ))}
          </ul>
        </li>
      ))}
    </>
  );
}

export function DiffView({ d }: { d: GraphDiff }) {
  if (d.same) return <p className="text-[11px] text-ink-soft" data-testid="diff-view">No design changes{d.nodes.moved ? ` (${d.nodes.moved} part${d.nodes.moved === 1 ? "" : "s"} moved on the canvas)` : ""}.</p>;
  return (
    <ul className="space-y-1 text-[11px]" data-testid="diff-view">
      {d.linkage.map((f) => (
        <li key={f.path}>Linkage {f.path}: {showValue(f.before)} → {showValue(f.after)}</li>
      ))}
      {d.nodes.added.map((n) => <li key={`na-${n.id}`} className="text-ok">+ part {n.name}</li>)}
      {d.nodes.removed.map((n) => <li key={`nr-${n.id}`} className="text-hazard">− part {n.name}</li>)}
      {d.joints.added.map((j) => <li key={`ja-${j.id}`} className="text-ok">+ joint {j.name}</li>)}
      {d.joints.removed.map((j) => <li key={`jr-${j.id}`} className="text-hazard">− joint {j.name}</li>)}
      <Changed items={d.nodes.changed} what="part" />
      <Changed items={d.joints.changed} what="joint" />
      {d.nodes.moved > 0 && <li className="text-ink-soft">{d.nodes.moved} part{d.nodes.moved === 1 ? "" : "s"} moved on the canvas</li>}
    </ul>
  );
}
