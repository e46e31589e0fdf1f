"use client";
/**
 * On the card of a joint at a cable's or turnbuckle's end, what belongs to that end: the cable's terminal
 * there (with the strength it develops), or the turnbuckle's threads showing at that end and how its barrel
 * is safetied. The values live on the part (one home); editing them here edits the part, undoable as any edit.
 */
import { useState } from "react";
import { CABLE_TERMINALS, MAX_TURNBUCKLE_THREADS, TERMINAL_EFFICIENCY, TERMINAL_NAMES } from "@/shared/hardware/cables";
import type { LinkageNode } from "@/shared/linkage/schema";
import { partName } from "@/shared/linkage/names";
import { useEditorConfig, useEditorStore, useEditorStoreApi } from "../context";

type End = { node: LinkageNode; port: "a" | "b" };
const LOCKING: [string, string][] = [["", "not recorded"], ["clip", "a locking clip at each end"], ["wire", "safety wire"], ["none", "not safetied yet"]];
const field = "w-full rounded border border-ink/20 bg-white px-1.5 py-1 text-[12px] disabled:opacity-60";

/** The cable and turnbuckle ends among a joint's two ends (a pulley or fairlead on a cable's run is not an end). */
export function cableEnds(ends: readonly [LinkageNode | undefined, string, LinkageNode | undefined, string] | readonly []): End[] {
  const out: End[] = [];
  for (let i = 0; i + 1 < ends.length; i += 2) {
    const n = ends[i] as LinkageNode | undefined, port = ends[i + 1] as string;
    if (n && (n.kind === "cable" || n.kind === "turnbuckle") && (port === "a" || port === "b")) out.push({ node: n, port });
  }
  return out;
}

export function CableEndFields({ jointId }: { jointId: string }) {
  // The two parts (kept by reference in the store) and ports, so the card re-renders only when they change.
  const raw = useEditorStore((s) => {
    const j = s.joints.find((x) => x.id === jointId);
    return j ? ([s.nodes.find((n) => n.id === j.from.node), j.from.port, s.nodes.find((n) => n.id === j.to.node), j.to.port] as const) : ([] as const);
  });
  const ends = cableEnds(raw);
  if (ends.length === 0) return null;
  return (
    <section className="space-y-1.5 rounded border border-ink/10 bg-white px-2 py-1.5" data-testid="cable-end-fields" aria-label="Cable ends at this joint">
      {ends.map((e) => <EndFields key={`${e.node.id}:${e.port}`} end={e} />)}
    </section>
  );
}

function EndFields({ end }: { end: End }) {
  const api = useEditorStoreApi();
  const { readOnly } = useEditorConfig();
  const { node, port } = end;
  const P = port.toUpperCase();
  const set = (key: string, v: unknown) => {
    const props: Record<string, unknown> = { ...node.props };
    if (v === undefined) delete props[key];
    else props[key] = v;
    api.getState().updateNode(node.id, { props }, { coalesce: `node:${node.id}` });
  };
  const title = <h4 className="text-[11px] font-semibold uppercase tracking-wide text-ink-soft">{partName(node)}, end {P}</h4>;
  if (node.kind === "cable") {
    const key = port === "a" ? "terminalA" : "terminalB";
    // Still the terminal the cable was placed with: said here as on the cable's own card.
    const start = node.unentered?.includes(key) ?? false;
    const startId = `cable-terminal-${node.id}-${port}-start`;
    return (
      <div>
        {title}
        <label className="mt-0.5 block text-[11px] text-ink">
          Terminal at {P}
          <select className={field} disabled={readOnly} data-testid={`cable-terminal-${node.id}-${port}`} value={node.props[key]}
            aria-describedby={start ? startId : undefined} onChange={(ev) => set(key, ev.target.value)}>
            {CABLE_TERMINALS.map((t) => <option key={t} value={t}>{TERMINAL_NAMES[t]} — develops {Math.round(TERMINAL_EFFICIENCY[t] * 100)} % of the cable</option>)}
          </select>
        </label>
        {start && <p id={startId} data-testid={startId} className="mt-0.5 text-[10px] leading-3 text-caution">starting value — enter yours (or confirm it on the cable&apos;s card)</p>}
      </div>
    );
  }
  if (node.kind !== "turnbuckle") return null;
  const key = port === "a" ? "threadsShowingA" : "threadsShowingB";
  return (
    <div>
      {title}
      <div className="mt-0.5 grid grid-cols-2 gap-1.5">
        <Threads label={`Threads showing at ${P}`} testId={`turnbuckle-threads-${node.id}-${port}`} value={node.props[key]} disabled={readOnly} onCommit={(v) => set(key, v)} />
        <label className="block text-[11px] text-ink">
          Safetied with
          <select className={field} disabled={readOnly} data-testid={`turnbuckle-locking-${node.id}`} value={node.props.locking ?? ""}
            onChange={(ev) => set("locking", ev.target.value || undefined)}>
            {LOCKING.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
          </select>
        </label>
      </div>
      <p className="mt-0.5 text-[10px] text-ink-soft">At most {MAX_TURNBUCKLE_THREADS} threads may show at either end (AC 43.13-1B).</p>
    </div>
  );
}

/** A whole number of threads, committed when it is one (blank: not recorded). */
function Threads({ label, testId, value, disabled, onCommit }: { label: string; testId: string; value: number | undefined; disabled: boolean; onCommit: (v: number | undefined) => void }) {
  const [text, setText] = useState(value === undefined ? "" : String(value));
  const [seen, setSeen] = useState(value);
  if (seen !== value) { // changed elsewhere (the part's card, undo): show it
    setSeen(value);
    setText(value === undefined ? "" : String(value));
  }
  const bad = text.trim() !== "" && !/^\d{1,3}$/.test(text.trim());
  return (
    <label className="block text-[11px] text-ink">
      {label}
      <input className={field} inputMode="numeric" disabled={disabled} data-testid={testId} value={text} aria-invalid={bad}
        onChange={(ev) => {
          const t = ev.target.value;
          setText(t);
          if (t.trim() === "") onCommit(undefined);
          else if (/^\d{1,3}$/.test(t.trim())) onCommit(Number(t.trim()));
        }} />
      {bad && <span className="block text-[10px] text-hazard">a whole number of threads</span>}
    </label>
  );
}
