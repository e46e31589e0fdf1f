"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import type { z } from "zod";
import { useEffect, useRef, useState } from "react";
import { api, ApiFailure } from "@/components/api-client";
import { queueTick, resolveConflict, type QueuedTick } from "@/components/offline/queue";
import { useOfflineQueue } from "@/components/offline/useQueue";
import { Button, Caution } from "@/components/ui";
import { JointPhotos } from "@/components/records/JointPhotos";
import { ExportButton } from "@/components/records/ExportButton";

import { checklistKeys } from "@/components/query-keys";
import type { checklistResponse, ChecklistItemView as Item } from "@/shared/schemas/checklist";
import { checklistStatus, hazardsByItem, itemKeyOf, tickedWords, type ChecklistFindings } from "@/shared/records/checklist-findings";

type Data = z.infer<typeof checklistResponse>;

export function ChecklistScreen(p: { buildId: string; linkageId: string; linkageName: string; revision?: number; canTick: boolean; canEdit: boolean; findings: ChecklistFindings }) {
  const url = `/api/builds/${p.buildId}/linkages/${p.linkageId}/checklist`;
  const key = checklistKeys.one(p.linkageId, p.revision);
  const qc = useQueryClient();
  const q = useQuery({ queryKey: key, queryFn: () => api<Data>(`${url}${p.revision ? `?revision=${p.revision}` : ""}`) });
  const [error, setError] = useState<string | null>(null);
  const queued = useOfflineQueue();
  const tick = useMutation({
    // Without network the change is kept on this device and sent when the network returns (components/offline).
    mutationFn: async (v: { jointId: string; code: string; ticked: boolean; note?: string }) => {
      const revision = q.data!.revision;
      try {
        await api(url, { method: "PUT", body: { revision, ...v } });
        return { queued: false };
      } catch (e) {
        if (!(e instanceof ApiFailure && e.offline)) throw e;
        const seen = q.data!.items.find((x) => x.jointId === v.jointId && x.code === v.code);
        await queueTick({ url, revision, ...v, base: { tickedAt: seen?.tickedAt ?? null, tickedBy: seen?.tickedBy ?? null, note: seen?.note ?? "" } });
        return { queued: true };
      }
    },
    onSuccess: (r) => {
      setError(null);
      if (!r.queued) void qc.invalidateQueries({ queryKey: key });
    },
    onError: (e) => { setError(e instanceof Error ? e.message : String(e)); void qc.invalidateQueries({ queryKey: key }); },
  });
  // The current revision's open hazards come with the page (read on the server): they show while the list loads.
  if (q.isLoading) {
    return (
      <div className="space-y-4">
        <h1 className="text-xl font-semibold">Checklist — {p.linkageName}</h1>
        <FindingsPanel buildId={p.buildId} linkageId={p.linkageId} f={p.findings} viewed={p.revision ?? p.findings.revision} />
        <p className="text-ink-soft">Loading the checklist…</p>
        <Caution />
      </div>
    );
  }
  if (q.error || !q.data) return <p role="alert" className="text-hazard">{String(q.error instanceof Error ? q.error.message : "The checklist could not be loaded.")}</p>;
  // What this device changed without network shows over the server's state until it is sent.
  const mine = queued.filter((x): x is QueuedTick => x.kind === "tick" && x.url === url && x.revision === q.data!.revision);
  const d = { ...q.data, items: q.data.items.map((i) => {
    const m = mine.find((x) => x.jointId === i.jointId && x.code === i.code);
    return m ? { ...i, tickedAt: m.ticked ? (i.tickedAt ?? m.at) : null, tickedBy: m.ticked ? "you (not sent yet)" : null, note: m.note ?? i.note, pending: m } : i;
  }) };
  const groups: { jointId: string; subject: Item["subject"]; where: string; items: Item[] }[] = [];
  for (const i of d.items) {
    const last = groups[groups.length - 1];
    if (last && last.jointId === i.jointId && last.subject === i.subject) last.items.push(i);
    else groups.push({ jointId: i.jointId, subject: i.subject, where: i.where, items: [i] });
  }
  const done = d.items.filter((i) => i.tickedAt).length;
  // The open hazards stand beside this list's items only when it is the list of the revision they were found in.
  const here = d.revision === p.findings.revision;
  const hazards = here ? hazardsByItem(p.findings) : new Map<string, string[]>();
  const status = here ? checklistStatus(done, d.items.length, p.findings) : null;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <Link href={`/builds/${p.buildId}/checklist`} className="no-print text-xs text-ink-soft hover:underline">All checklists</Link>
          <h1 className="text-xl font-semibold">Checklist — {p.linkageName}</h1>
          <p className="text-ink-soft">Revision {d.revision}{d.revision !== d.currentRevision ? ` (the linkage is now at revision ${d.currentRevision})` : ""} · <span data-testid="checklist-progress">{tickedWords(done, d.items.length)}</span>
            {status ? <StatusText s={status} /> : null}</p>
        </div>
        <div className="no-print flex gap-2">
          <Button tone="secondary" onClick={() => window.print()}>Print</Button>
          <ExportButton buildId={p.buildId} kind="checklist-pdf" params={{ linkageId: p.linkageId, revision: d.revision }} testId="checklist-pdf">PDF</ExportButton>
        </div>
      </div>
      {error ? <p role="alert" className="rounded bg-hazard/10 px-3 py-2 text-xs text-hazard">{error}</p> : null}
      <FindingsPanel buildId={p.buildId} linkageId={p.linkageId} f={p.findings} viewed={d.revision} />
      <OfflineBanner ticks={mine} photos={queued.filter((x) => x.kind === "photo" && x.url.startsWith(`/api/builds/${p.buildId}/linkages/${p.linkageId}/`)).length} />
      {d.items.length <= 2 ? <p className="rounded border border-dashed border-ink/25 p-4 text-ink-soft">This revision has no joints yet, so only the travel checks show. Add joints with their hardware in the editor and each one brings its own checks.</p> : null}
      {groups.map((g) => (
        <section key={`${g.subject}:${g.jointId}`} className="rounded-lg border border-ink/10 bg-white" data-testid={g.subject === "part" ? `checklist-part-${g.jointId}` : `checklist-joint-${g.jointId || "linkage"}`}>
          <header className="flex flex-wrap items-center justify-between gap-2 border-b border-ink/10 px-4 py-2">
            <h2 className="text-sm font-semibold">{g.where}</h2>
            {g.jointId ? <Link className="no-print touch-target inline-flex items-center text-xs text-advisory hover:underline" href={`/builds/${p.buildId}/linkages/${p.linkageId}?select=${encodeURIComponent(g.jointId)}`}>Open in the editor</Link> : null}
          </header>
          <ul className="divide-y divide-ink/5">
            {g.items.map((i) => <ItemRow key={i.code} i={i} hazards={hazards.get(i.jointId)} canTick={p.canTick} onChange={(v) => tick.mutate({ jointId: i.jointId, code: i.code, ...v })} />)}
          </ul>
          {g.subject === "joint" ? <div className="border-t border-ink/10 px-4 py-2"><JointPhotos buildId={p.buildId} linkageId={p.linkageId} jointId={g.jointId} jointName={g.where} canEdit={p.canEdit} /></div> : null}
        </section>
      ))}
      <Caution />
    </div>
  );
}

const ON: Record<Item["subject"], string> = { joint: "this joint", part: "this part", linkage: "the whole linkage" };

function ItemRow({ i, hazards, canTick, onChange }: { i: Item & { pending?: QueuedTick }; hazards?: string[]; canTick: boolean; onChange: (v: { ticked: boolean; note?: string }) => void }) {
  const id = `ck-${i.jointId}-${i.code}`;
  const [note, setNote] = useState(i.note);
  const [editing, setEditing] = useState(false);
  // Closing the note (Escape or Save) gives the focus back to the button that opened it ("Add a note" or "edit").
  const row = useRef<HTMLLIElement>(null);
  const refocus = useRef(false);
  const closeNote = () => { refocus.current = true; setEditing(false); };
  useEffect(() => {
    if (editing || !refocus.current) return;
    refocus.current = false;
    row.current?.querySelector<HTMLElement>("[data-note-opener]")?.focus();
  }, [editing]);
  // The box follows the click in the same event; the server's answer (via the query) confirms or reverts it.
  const [checked, setChecked] = useState(!!i.tickedAt);
  useEffect(() => setChecked(!!i.tickedAt), [i.tickedAt]);
  return (
    <li ref={row} className={`flex gap-3 px-4 py-2 ${i.code === "not-checked" ? "bg-caution/10" : ""}`} data-testid="checklist-item" data-code={i.code}>
      <input id={id} type="checkbox" className="mt-1 h-5 w-5 shrink-0" checked={checked} disabled={!canTick} onChange={(e) => { setChecked(e.target.checked); onChange({ ticked: e.target.checked }); }} />
      <div className="flex-1">
        <label htmlFor={id} className="text-sm">{i.text}</label>
        {hazards?.length ? (
          <p className="text-xs font-medium text-hazard" data-testid="item-hazard">
            Open hazard{hazards.length === 1 ? "" : "s"} on {ON[i.subject]}: {hazards.join("; ")}.
          </p>
        ) : null}
        <p className="text-xs text-ink-soft">
          {i.tickedAt ? <>Ticked by {i.tickedBy} · {new Date(i.tickedAt).toLocaleString("en-CA")}</> : "Not ticked"} · source: {i.source.text}
        </p>
        {i.pending && !i.pending.conflict ? <p className="text-xs font-medium text-advisory" data-testid="item-pending">Kept on this device — sent when the network is back.</p> : null}
        {i.pending?.conflict ? <Conflict q={i.pending} /> : null}
        {editing ? (
          <form className="mt-1 flex gap-2" onSubmit={(e) => { e.preventDefault(); onChange({ ticked: !!i.tickedAt, note }); closeNote(); }}>
            <input aria-label={`Note on: ${i.text}`} className="flex-1 rounded border border-ink/20 px-2 py-1 text-xs" value={note} onChange={(e) => setNote(e.target.value)} autoFocus maxLength={2000}
              onKeyDown={(e) => { if (e.key === "Escape") { e.preventDefault(); setNote(i.note); closeNote(); } }} />
            <Button size="sm" type="submit">Save note</Button>
          </form>
        ) : i.note ? (
          <p className="mt-1 text-xs"><span className="font-semibold">Note:</span> {i.note} {canTick ? <button type="button" data-note-opener className="no-print touch-target inline-flex min-h-6 items-center px-1 align-middle text-advisory hover:underline" onClick={() => setEditing(true)}>edit</button> : null}</p>
        ) : canTick ? <button type="button" data-note-opener className="no-print touch-target mt-1 inline-flex min-h-6 items-center text-xs text-advisory hover:underline" onClick={() => setEditing(true)}>Add a note</button> : null}
      </div>
    </li>
  );
}

/** Offline: what waits on this device to be sent, and the conflicts that need a choice. */
function OfflineBanner({ ticks, photos }: { ticks: QueuedTick[]; photos: number }) {
  const [online, setOnline] = useState(true);
  useEffect(() => {
    const f = () => setOnline(navigator.onLine);
    f();
    window.addEventListener("online", f);
    window.addEventListener("offline", f);
    return () => { window.removeEventListener("online", f); window.removeEventListener("offline", f); };
  }, []);
  const waiting = ticks.filter((t) => !t.conflict).length + photos;
  const conflicts = ticks.filter((t) => t.conflict).length;
  if (online && !waiting && !conflicts) return null;
  return (
    <div role="status" data-testid="offline-banner" className={`rounded border px-3 py-2 text-sm ${conflicts ? "border-caution/40 bg-caution/10" : "border-advisory/30 bg-advisory/5"}`}>
      {!online ? <p className="font-semibold">No network. Ticks, notes and photos are kept on this device and sent when it is back.</p> : null}
      {waiting ? <p data-testid="offline-waiting">{waiting} change{waiting === 1 ? "" : "s"} waiting to be sent.</p> : null}
      {conflicts ? <p className="font-semibold text-caution" data-testid="offline-conflicts">{conflicts} item{conflicts === 1 ? " was" : "s were"} changed by someone else while you were offline: choose below which to keep.</p> : null}
    </div>
  );
}

function Conflict({ q }: { q: QueuedTick }) {
  const qc = useQueryClient();
  const theirs = q.conflict!;
  const say = (t: { tickedAt: string | null; tickedBy?: string | null; note?: string }) => `${t.tickedAt ? "ticked" : "not ticked"}${t.note ? `, note “${t.note}”` : ""}`;
  const choose = async (keep: "mine" | "theirs") => {
    await resolveConflict(q.id, keep);
    await qc.invalidateQueries();
  };
  return (
    <div className="mt-1 rounded border border-caution/40 bg-caution/10 p-2 text-xs" data-testid="item-conflict">
      <p><span className="font-semibold">Changed meanwhile</span> by {theirs.tickedBy ?? "someone"}: {say(theirs)}.</p>
      <p><span className="font-semibold">Yours, made offline:</span> {say({ tickedAt: q.ticked ? q.at : null, note: q.note ?? theirs.note })}.</p>
      <div className="mt-1 flex gap-2">
        <Button size="sm" onClick={() => void choose("mine")} data-testid="conflict-keep-mine">Keep mine</Button>
        <Button size="sm" tone="secondary" onClick={() => void choose("theirs")} data-testid="conflict-keep-theirs">Keep theirs</Button>
      </div>
    </div>
  );
}

/** Whether the list may be called complete (shared/records/checklist-findings.ts): never while a hazard is open. */
function StatusText({ s }: { s: ReturnType<typeof checklistStatus> }) {
  if (s.complete) return <> · <span className="font-semibold text-ok" data-testid="checklist-status">Complete</span></>;
  if (s.why === "hazards") return <> · <span className="font-semibold text-hazard" data-testid="checklist-status">Not complete: {s.hazards} hazard{s.hazards === 1 ? "" : "s"} open</span></>;
  if (s.why === "nothing-drawn") return <> · <span className="font-semibold text-ink" data-testid="checklist-status">Not complete: nothing is drawn yet</span></>;
  if (s.why === "not-checked") return <> · <span className="font-semibold text-ink" data-testid="checklist-status">Not complete: this revision&apos;s check is not stored</span></>;
  return null;
}

const SEVERITY_WORD = { hazard: "Hazard", caution: "Caution" } as const;

/** The open hazards and cautions of the current revision's stored check, with links to them in the editor. */
function FindingsPanel({ buildId, linkageId, f, viewed }: { buildId: string; linkageId: string; f: ChecklistFindings; viewed: number }) {
  const editor = `/builds/${buildId}/linkages/${linkageId}`;
  const hazards = f.open.filter((o) => o.severity === "hazard");
  const cautions = f.open.filter((o) => o.severity === "caution");
  const which = viewed === f.revision ? `revision ${f.revision}` : `the current revision (${f.revision})`;
  const openLink = <Link className="no-print touch-target inline-flex items-center text-xs font-medium text-advisory hover:underline" href={editor}>Open the linkage in the editor</Link>;
  if (!f.drawn) {
    return (
      <section className="rounded-lg border border-ink/20 bg-white p-4" aria-labelledby="ck-findings" data-testid="checklist-findings" data-hazards="unknown">
        <h2 id="ck-findings" className="text-sm font-semibold">Nothing is drawn in {which} yet</h2>
        <p className="text-sm text-ink-soft">With no parts there is nothing for the load-path check to check, so this list is not complete. Draw the run in the editor; its joints bring their own items here.</p>
        {openLink}
      </section>
    );
  }
  if (!f.checked) {
    return (
      <section className="rounded-lg border border-ink/20 bg-white p-4" aria-labelledby="ck-findings" data-testid="checklist-findings" data-hazards="unknown">
        <h2 id="ck-findings" className="text-sm font-semibold">The check of {which} is not stored</h2>
        <p className="text-sm text-ink-soft">It was saved without the load-path check, so its hazards are not known here, and this list is not complete until they are. Open it in the editor to see its findings; the next save stores them.</p>
        {openLink}
      </section>
    );
  }
  if (f.open.length === 0) {
    return (
      <section className="rounded-lg border border-ink/10 bg-white p-4" aria-labelledby="ck-findings" data-testid="checklist-findings" data-hazards="0">
        <h2 id="ck-findings" className="text-sm font-semibold">No open hazards or cautions in the check of {which}</h2>
        {f.acknowledged ? <p className="text-xs text-ink-soft">{f.acknowledged} finding{f.acknowledged === 1 ? " was" : "s were"} acknowledged, with a reason, for this hardware.</p> : null}
      </section>
    );
  }
  const counts = [hazards.length ? `${hazards.length} open hazard${hazards.length === 1 ? "" : "s"}` : "", cautions.length ? `${cautions.length} caution${cautions.length === 1 ? "" : "s"}` : ""].filter(Boolean).join(" and ");
  return (
    <section className={`rounded-lg border bg-white p-4 ${hazards.length ? "border-hazard/40" : "border-caution/40"}`} aria-labelledby="ck-findings" data-testid="checklist-findings" data-hazards={hazards.length} data-cautions={cautions.length}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <h2 id="ck-findings" className={`text-sm font-semibold ${hazards.length ? "text-hazard" : "text-caution"}`}>{counts} in the check of {which}</h2>
        {openLink}
      </div>
      <p className="text-sm text-ink-soft">
        {hazards.length
          ? "Ticking the items below records what was inspected; it does not clear a hazard, and the list is not complete while one is open. Fix the hardware in the editor and save, or have the finding acknowledged with a reason by a reviewer or the owner."
          : "Cautions are checks not made or points to confirm: see each one in the editor."}
        {f.acknowledged ? ` ${f.acknowledged} other finding${f.acknowledged === 1 ? " was" : "s were"} acknowledged.` : ""}
      </p>
      <ul className="mt-2 space-y-1 text-sm">
        {f.open.map((o, n) => (
          <li key={n} data-testid="checklist-finding" data-severity={o.severity}>
            <span className={`font-semibold ${o.severity === "hazard" ? "text-hazard" : "text-caution"}`}>{SEVERITY_WORD[o.severity]}: {o.title}</span>
            {" — "}{o.where}
            {itemKeyOf(o.subject) ? <>{" "}<Link className="no-print text-xs text-advisory underline" href={`${editor}?select=${encodeURIComponent(o.subject.id)}`}>show in the editor</Link></> : null}
            {o.severity === "hazard" ? <span className="block text-xs text-ink-soft">{o.message}</span> : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
