"use client";
/**
 * Join two parts from the keyboard (J on a selected part): pick one of its ports, then a port of another part;
 * "Join" makes the joint exactly as dragging port to port does (the store's connect). Every port is listed,
 * free ones first; a long run's list is narrowed by typing, and never cut off without saying so.
 */
import { useEffect, useId, useMemo, useRef, useState } from "react";
import { PORTS } from "@/shared/linkage/kinds";
import { endName, partName, portName } from "@/shared/linkage/names";
import { useEditorStoreApi, useEditorValue } from "../context";

const SHOWN = 200;
type Target = { node: string; port: string; text: string; free: boolean };

export function JoinDialog({ nodeId, onClose, onJoined }: { nodeId: string; onClose: () => void; onJoined: (jointId: string) => void }) {
  const api = useEditorStoreApi();
  const nodes = useEditorValue((s) => s.nodes);
  const joints = useEditorValue((s) => s.joints);
  const node = nodes.find((n) => n.id === nodeId);
  const ids = useId();
  const first = useRef<HTMLSelectElement>(null);
  useEffect(() => first.current?.focus(), []);

  // Who each endpoint is joined to (one pass over the joints).
  const joinedTo = useMemo(() => {
    const m = new Map<string, string[]>();
    const byId = new Map(nodes.map((n) => [n.id, n]));
    for (const j of joints) {
      (m.get(`${j.from.node}|${j.from.port}`) ?? m.set(`${j.from.node}|${j.from.port}`, []).get(`${j.from.node}|${j.from.port}`)!).push(endName(byId.get(j.to.node), j.to.port));
      (m.get(`${j.to.node}|${j.to.port}`) ?? m.set(`${j.to.node}|${j.to.port}`, []).get(`${j.to.node}|${j.to.port}`)!).push(endName(byId.get(j.from.node), j.from.port));
    }
    return m;
  }, [nodes, joints]);

  const ports = node ? [...PORTS[node.kind]].sort((a, b) => Number(joinedTo.has(`${nodeId}|${a}`)) - Number(joinedTo.has(`${nodeId}|${b}`))) : [];
  const [port, setPort] = useState(ports[0] ?? "");
  const [filter, setFilter] = useState("");
  const [target, setTarget] = useState("");
  const [error, setError] = useState<string | null>(null);

  const targets = useMemo(() => {
    const already = new Set<string>();
    for (const j of joints) {
      if (j.from.node === nodeId && j.from.port === port) already.add(`${j.to.node}|${j.to.port}`);
      if (j.to.node === nodeId && j.to.port === port) already.add(`${j.from.node}|${j.from.port}`);
    }
    const q = filter.trim().toLowerCase();
    const out: Target[] = [];
    for (const n of nodes) {
      if (n.id === nodeId) continue;
      for (const p of PORTS[n.kind]) {
        if (already.has(`${n.id}|${p}`)) continue;
        const text = endName(n, p);
        if (q && !text.toLowerCase().includes(q)) continue;
        out.push({ node: n.id, port: p, text, free: !joinedTo.has(`${n.id}|${p}`) });
      }
    }
    return out.sort((a, b) => Number(b.free) - Number(a.free));
  }, [nodes, joints, nodeId, port, filter, joinedTo]);

  if (!node) return null;
  const shown = targets.slice(0, SHOWN);
  const chosen = targets.find((t) => `${t.node}|${t.port}` === target) ?? shown[0];

  const join = () => {
    if (!chosen) return;
    const r = api.getState().connect({ node: nodeId, port }, { node: chosen.node, port: chosen.port });
    if (!r.ok) return setError(r.reason);
    onJoined(r.value);
  };

  return (
    <div className="fixed inset-0 z-40 flex items-center justify-center bg-ink/30 p-4" role="presentation" onClick={onClose}>
      <div
        role="dialog"
        aria-modal="true"
        aria-labelledby={`${ids}-t`}
        data-testid="join-dialog"
        className="w-full max-w-md space-y-3 rounded-lg bg-white p-4 text-[12px] text-ink shadow-xl"
        onClick={(e) => e.stopPropagation()}
        onKeyDown={(e) => {
          if (e.key === "Escape") {
            e.stopPropagation();
            onClose();
          } else if (e.key === "Tab") keepTabInside(e);
        }}
      >
        <h2 id={`${ids}-t`} className="text-base font-semibold">Join {partName(node)} to another part</h2>
        <div className="space-y-1">
          <label htmlFor={`${ids}-p`} className="block font-semibold">Port of {partName(node)}</label>
          <select id={`${ids}-p`} ref={first} value={port} onChange={(e) => { setPort(e.target.value); setTarget(""); }} className="w-full rounded border border-ink/20 px-2 py-1.5" data-testid="join-port">
            {ports.map((p) => {
              const to = joinedTo.get(`${nodeId}|${p}`);
              return <option key={p} value={p}>{portName(node.kind, p)} — {to ? `joined to ${to.join(", ")}` : "free"}</option>;
            })}
          </select>
        </div>
        <div className="space-y-1">
          <label htmlFor={`${ids}-f`} className="block font-semibold">Find a part</label>
          <input id={`${ids}-f`} value={filter} onChange={(e) => { setFilter(e.target.value); setTarget(""); }} placeholder="Type part of a name" className="w-full rounded border border-ink/20 px-2 py-1.5" data-testid="join-filter" />
        </div>
        <div className="space-y-1">
          <label htmlFor={`${ids}-to`} className="block font-semibold">Join to</label>
          {shown.length === 0 ? (
            <p className="text-ink-soft" data-testid="join-none">{filter ? "No port matches; change the search." : "No other part has a port left to join. Add a part from the tray first."}</p>
          ) : (
            <select id={`${ids}-to`} size={Math.min(8, shown.length + 1)} value={chosen ? `${chosen.node}|${chosen.port}` : ""} onChange={(e) => setTarget(e.target.value)} onKeyDown={(e) => { if (e.key === "Enter") { e.preventDefault(); join(); } }} className="w-full rounded border border-ink/20" data-testid="join-target">
              {shown.map((t) => (
                <option key={`${t.node}|${t.port}`} value={`${t.node}|${t.port}`}>{t.text}{t.free ? "" : " (already has a joint)"}</option>
              ))}
            </select>
          )}
          {targets.length > SHOWN && <p className="text-ink-soft" data-testid="join-more">Showing {SHOWN} of {targets.length} ports; type to narrow the list.</p>}
        </div>
        {error && <p role="alert" className="text-hazard">{error}</p>}
        <div className="flex justify-end gap-2">
          <button type="button" onClick={onClose} className="rounded border border-ink/20 px-3 py-1.5">Cancel</button>
          <button type="button" onClick={join} disabled={!chosen} className="rounded bg-ink px-3 py-1.5 font-medium text-white disabled:opacity-40" data-testid="join-confirm">Join</button>
        </div>
      </div>
    </div>
  );
}

/** Tab and Shift+Tab go round the dialog's own controls: the page behind it is out of reach while it is open. */
function keepTabInside(e: React.KeyboardEvent<HTMLElement>) {
  const all = [...e.currentTarget.querySelectorAll<HTMLElement>("button, input, select, textarea, [href], [tabindex]:not([tabindex='-1'])")]
    .filter((el) => !(el as HTMLButtonElement).disabled);
  if (!all.length) return;
  const first = all[0], last = all[all.length - 1];
  if (e.shiftKey && document.activeElement === first) {
    e.preventDefault();
    last.focus();
  } else if (!e.shiftKey && document.activeElement === last) {
    e.preventDefault();
    first.focus();
  }
}
