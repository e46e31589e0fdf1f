"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { useEffect, useMemo, useRef, useState } from "react";
import type { z } from "zod";
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { api, ACCEPT_FILES, uploadFile } from "@/components/api-client";
import { Button, Card, Caution, EmptyState, Field, Input, Select } from "@/components/ui";
import { logEntryInput, type LogEntry, type LogTotals } from "@/shared/schemas/log";
import { logKeys } from "@/components/query-keys";
import { SYSTEMS } from "@/shared/linkage/schema";
import type { StoredFile } from "@/shared/schemas/files";
import { LoadMore, usePagedList } from "@/components/paged";
import { ExportButton } from "@/components/records/ExportButton";

type Entry = LogEntry;
type Totals = LogTotals;
type Filter = { system: string; from: string; to: string; q: string };

const SYSTEM_LABEL: Record<string, string> = { pitch: "Pitch", roll: "Roll", yaw: "Yaw", flap: "Flaps", trim: "Trim", other: "Other", unassigned: "No system" };
// Our own series colours: muted, distinct, readable on paper.
const SERIES: Record<string, string> = { pitch: "#2e5aac", roll: "#1b7a4b", yaw: "#b54708", flap: "#7a4fa3", trim: "#0f7c8c", other: "#6b7280", unassigned: "#c7c2b8" };
const hours = (h: number) => `${Number(h.toFixed(2))} h`;

type FirstPage = { entries: Entry[]; total: number; nextCursor: string | null; totals: Totals };

export function LogScreen(p: { buildId: string; canEdit: boolean; initial: FirstPage; linkages: { id: string; name: string; revision: number }[] }) {
  const base = `/api/builds/${p.buildId}/log`;
  const [filter, setFilter] = useState<Filter>({ system: "", from: "", to: "", q: "" });
  const qs = useMemo(() => new URLSearchParams(Object.entries(filter).filter(([, v]) => v)).toString(), [filter]);
  const isDefault = qs === "";
  const log = usePagedList<Entry, FirstPage>({ key: logKeys.list(p.buildId, qs), url: `${base}${qs ? `?${qs}` : ""}`, name: "entries", first: isDefault ? p.initial : undefined });
  const data = { totals: log.first?.totals ?? p.initial.totals, entries: log.items };
  const [adding, setAdding] = useState(false);
  // The form closes (Cancel, Escape, saved) with the focus back on the button that opened it.
  const opener = useRef<HTMLButtonElement>(null);
  const closeForm = () => { setAdding(false); opener.current?.focus(); };

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold">Build log</h1>
          <p className="text-ink-soft">The dated record of the work: hours, what was done, photos, and the linkage revision it concerns.</p>
        </div>
        <div className="flex gap-2">
          <ExportButton buildId={p.buildId} kind="log-pdf" params={Object.fromEntries(Object.entries(filter).filter(([, v]) => v))} estimateUrl={`${base}/estimate${qs ? `?${qs}` : ""}`} testId="log-pdf">
            PDF of {isDefault ? "the whole log" : "this selection"}
          </ExportButton>
          {p.canEdit ? <Button ref={opener} onClick={() => setAdding((a) => !a)} aria-expanded={adding}>{adding ? "Close" : "New entry"}</Button> : null}
        </div>
      </div>

      {adding ? <EntryForm buildId={p.buildId} linkages={p.linkages} onDone={closeForm} /> : null}

      <form className="grid gap-3 rounded-lg border border-ink/10 bg-white p-3 sm:grid-cols-5" onSubmit={(e) => e.preventDefault()} aria-label="Filter the log">
        <Field label="System" htmlFor="f-system">
          <Select id="f-system" value={filter.system} onChange={(e) => setFilter({ ...filter, system: e.target.value })}>
            <option value="">All systems</option>
            {SYSTEMS.map((s) => <option key={s} value={s}>{SYSTEM_LABEL[s]}</option>)}
          </Select>
        </Field>
        <Field label="From" htmlFor="f-from"><Input id="f-from" type="date" value={filter.from} onChange={(e) => setFilter({ ...filter, from: e.target.value })} /></Field>
        <Field label="To" htmlFor="f-to"><Input id="f-to" type="date" value={filter.to} onChange={(e) => setFilter({ ...filter, to: e.target.value })} /></Field>
        <Field label="Text" htmlFor="f-q"><Input id="f-q" type="search" placeholder="in title or text" value={filter.q} onChange={(e) => setFilter({ ...filter, q: e.target.value })} /></Field>
        <div className="flex items-end"><Button type="button" tone="ghost" onClick={() => setFilter({ system: "", from: "", to: "", q: "" })} disabled={isDefault}>Clear filters</Button></div>
      </form>

      <div className="grid gap-6 lg:grid-cols-3">
        <Card title={`Hours — ${hours(data.totals.total)}`} className="lg:col-span-1">
          {Object.keys(data.totals.bySystem).length === 0 ? <p className="text-ink-soft">No hours logged{isDefault ? " yet" : " in this selection"}.</p> : (
            <div className="table-box">
              <table className="w-full text-sm" data-testid="hours-by-system">
                <thead className="text-xs uppercase tracking-wide text-ink-soft"><tr><th className="text-left font-medium">System</th><th className="text-right font-medium">Hours</th></tr></thead>
                <tbody>
                  {Object.entries(data.totals.bySystem).sort((a, b) => b[1] - a[1]).map(([s, h]) => (
                    <tr key={s} className="border-t border-ink/10"><td className="py-1"><span className="mr-2 inline-block h-2 w-2 rounded-sm" style={{ background: SERIES[s] }} />{SYSTEM_LABEL[s] ?? s}</td><td className="text-right tabular-nums">{hours(h)}</td></tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          <p className="mt-2 text-xs text-ink-soft">An entry about several systems counts toward each, so the rows can add up to more than the total.</p>
        </Card>
        <Card title="Hours by month" className="lg:col-span-2">
          {data.totals.byMonth.length === 0 ? <p className="text-ink-soft">The chart fills in as entries with hours are added.</p> : (
            <div className="h-56" data-testid="hours-chart">
              <ResponsiveContainer width="100%" height="100%">
                <BarChart data={data.totals.byMonth} margin={{ top: 4, right: 8, bottom: 0, left: -16 }}>
                  <CartesianGrid strokeDasharray="2 4" stroke="#d6d3cc" vertical={false} />
                  <XAxis dataKey="month" tick={{ fontSize: 11 }} />
                  <YAxis tick={{ fontSize: 11 }} allowDecimals={false} />
                  <Tooltip formatter={(v) => hours(Number(v))} />
                  <Legend wrapperStyle={{ fontSize: 11 }} formatter={(v) => SYSTEM_LABEL[String(v)] ?? v} />
                  {Object.keys(data.totals.bySystem).map((s) => <Bar key={s} dataKey={s} stackId="h" fill={SERIES[s] ?? "#888"} isAnimationActive={false} />)}
                </BarChart>
              </ResponsiveContainer>
            </div>
          )}
        </Card>
      </div>

      <p className="text-sm text-ink-soft" data-testid="log-total">
        {log.isPending ? "Loading…" : `${log.total.toLocaleString("en-US")} entr${log.total === 1 ? "y" : "ies"}${isDefault ? " in the log" : " match these filters"}, newest first.`}
      </p>
      {log.isPending ? null : data.entries.length === 0 ? (
        isDefault ? (
          <EmptyState title="The log is empty" action={p.canEdit ? <Button onClick={() => setAdding(true)}>Write the first entry</Button> : undefined}>
            Each session in the shop gets an entry: the date, the hours, what was done and for which control system, with photos.
            Tie an entry to a linkage revision and its picture and findings go with it into the PDF an inspector reads.
          </EmptyState>
        ) : <p className="text-ink-soft">No entry matches these filters.</p>
      ) : (
        <>
          <ol className="space-y-3" aria-label="Log entries">
            {data.entries.map((e) => <EntryCard key={e.id} e={e} buildId={p.buildId} canEdit={p.canEdit} />)}
          </ol>
          <LoadMore shown={data.entries.length} total={log.total} noun="entries" hasMore={!!log.hasNextPage} loading={log.isFetchingNextPage} error={log.isFetchNextPageError ? log.error : null} onMore={() => void log.fetchNextPage()} />
        </>
      )}
      <Caution />
    </div>
  );
}

function EntryCard({ e, buildId, canEdit }: { e: Entry; buildId: string; canEdit: boolean }) {
  const qc = useQueryClient();
  const del = useMutation({ mutationFn: () => api(`/api/builds/${buildId}/log/${e.id}`, { method: "DELETE" }), onSuccess: () => qc.invalidateQueries({ queryKey: logKeys.all(buildId) }) });
  return (
    <li className="rounded-lg border border-ink/10 bg-white p-4" data-testid="log-entry">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-semibold">{e.title}</h3>
        <p className="text-xs text-ink-soft tabular-nums">{e.date} · {hours(e.hours)}{e.systems.length ? ` · ${e.systems.map((s) => SYSTEM_LABEL[s]).join(", ")}` : ""}{e.author ? ` · ${e.author}` : ""}</p>
      </div>
      {e.text ? <p className="mt-1 whitespace-pre-wrap text-sm">{e.text}</p> : null}
      {e.linkageId && e.revision ? (
        <div className="mt-2 flex items-center gap-3 rounded bg-paper p-2 text-sm">
          {e.hasPicture ? (
            /* eslint-disable-next-line @next/next/no-img-element */
            <img src={`/api/builds/${buildId}/linkages/${e.linkageId}/revisions/${e.revision}/picture`} alt="" className="h-16 rounded border border-ink/10 bg-white" onError={(ev) => { (ev.target as HTMLImageElement).style.display = "none"; }} />
          ) : null}
          <div>
            <a className="hover:underline" href={`/builds/${buildId}/linkages/${e.linkageId}`}>{e.linkageName ?? "Linkage"}, revision {e.revision}</a>
            {e.revisionSummary ? (
              <p className="text-xs text-ink-soft" data-testid="log-revision-findings">
                Findings at that revision:{" "}
                <span className={e.revisionSummary.hazard ? "font-semibold text-hazard" : ""}>{e.revisionSummary.hazard} hazard{e.revisionSummary.hazard === 1 ? "" : "s"}</span>,{" "}
                <span className={e.revisionSummary.caution ? "font-semibold text-caution" : ""}>{e.revisionSummary.caution} caution{e.revisionSummary.caution === 1 ? "" : "s"}</span>,{" "}
                {e.revisionSummary.advisory} advisory
              </p>
            ) : null}
            {e.hasPicture ? null : (
              <p className="text-xs text-ink-soft" data-testid="log-no-picture">
                No picture was kept for revision {e.revision}. In the editor, Keep for the log (key K) keeps the picture of the revision being edited for its log entries.
              </p>
            )}
          </div>
        </div>
      ) : null}
      {e.files.length ? (
        <div className="mt-2 flex flex-wrap gap-2">
          {e.files.map((f) => f.kind === "pdf" ? (
            <a key={f.id} href={f.url} target="_blank" rel="noreferrer" className="rounded border border-ink/15 px-2 py-1 text-xs hover:bg-ink/5">PDF · {f.name}</a>
          ) : (
            <a key={f.id} href={f.url} target="_blank" rel="noreferrer" className="block rounded border border-ink/15">
              {/* eslint-disable-next-line @next/next/no-img-element */}
              <img src={f.thumbUrl ?? f.url} alt={f.name} className="h-20 rounded" loading="lazy" />
            </a>
          ))}
        </div>
      ) : null}
      {canEdit ? <div className="mt-2 text-right"><Button size="sm" tone="ghost" onClick={() => { if (confirm(`Delete the entry “${e.title}”? The photos stay in the build's files.`)) del.mutate(); }}>Delete</Button></div> : null}
    </li>
  );
}

type FormValues = z.input<typeof logEntryInput>;

function EntryForm({ buildId, linkages, onDone }: { buildId: string; linkages: { id: string; name: string; revision: number }[]; onDone: () => void }) {
  const qc = useQueryClient();
  const today = new Date().toISOString().slice(0, 10);
  const form = useForm<FormValues>({ resolver: zodResolver(logEntryInput), defaultValues: { date: today, hours: 1, title: "", text: "", systems: [], linkageId: null, fileIds: [] } });
  const [files, setFiles] = useState<StoredFile[]>([]);
  const [error, setError] = useState<string | null>(null);
  const [uploading, setUploading] = useState(false);
  const save = useMutation({
    mutationFn: (v: FormValues) => api(`/api/builds/${buildId}/log`, { body: { ...v, linkageId: v.linkageId || null, fileIds: files.map((f) => f.id) } }),
    onSuccess: () => { qc.invalidateQueries({ queryKey: logKeys.all(buildId) }); onDone(); },
    onError: (e) => setError(e instanceof Error ? e.message : String(e)),
  });
  const onFiles = async (list: File[]) => {
    setUploading(true);
    try {
      for (const f of list) { const r = await uploadFile<{ file: StoredFile }>(`/api/builds/${buildId}/files`, f); setFiles((x) => [...x, r.file]); }
      setError(null);
    } catch (e) { setError(e instanceof Error ? e.message : String(e)); } finally { setUploading(false); }
  };
  const err = form.formState.errors;
  // Opening the form puts the focus in its first field.
  useEffect(() => form.setFocus("date"), [form]);
  return (
    <Card title="New log entry">
      <form className="grid gap-3 sm:grid-cols-4" onKeyDown={(e) => { if (e.key === "Escape") { e.preventDefault(); onDone(); } }} onSubmit={form.handleSubmit((v) => save.mutate(v))}>
        <Field label="Date" htmlFor="e-date" error={err.date?.message}><Input id="e-date" type="date" {...form.register("date")} aria-invalid={!!err.date} /></Field>
        <Field label="Hours" htmlFor="e-hours" error={err.hours?.message}><Input id="e-hours" type="number" step="0.25" min="0" max="24" {...form.register("hours", { valueAsNumber: true })} aria-invalid={!!err.hours} /></Field>
        <div className="sm:col-span-2"><Field label="Title" htmlFor="e-title" error={err.title?.message}><Input id="e-title" placeholder="e.g. Fitted the aft pushrod" {...form.register("title")} aria-invalid={!!err.title} /></Field></div>
        <div className="sm:col-span-4"><Field label="What was done" htmlFor="e-text"><textarea id="e-text" rows={3} className="w-full rounded border border-ink/20 px-2 py-1.5 text-sm" {...form.register("text")} /></Field></div>
        <fieldset className="sm:col-span-2">
          <legend className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Systems</legend>
          <div className="mt-1 flex flex-wrap gap-3 text-sm">
            {SYSTEMS.map((s) => <label key={s} className="touch-target flex items-center gap-1"><input type="checkbox" value={s} {...form.register("systems")} />{SYSTEM_LABEL[s]}</label>)}
          </div>
        </fieldset>
        <div className="sm:col-span-2">
          <Field label="Linkage revision (optional)" htmlFor="e-linkage" hint="Its picture and findings go into the entry and the PDF.">
            <Select id="e-linkage" {...form.register("linkageId", { setValueAs: (v) => v || null })}>
              <option value="">None</option>
              {linkages.map((l) => <option key={l.id} value={l.id}>{l.name} — revision {l.revision} (current)</option>)}
            </Select>
          </Field>
        </div>
        <div className="sm:col-span-4">
          <Field label="Photos and documents" htmlFor="e-files" hint="JPEG, PNG or WebP up to 10 MB; PDF up to 20 MB. HEIC: export as JPEG first.">
            <input id="e-files" type="file" multiple accept={ACCEPT_FILES} className="text-sm" onChange={(e) => { const l = [...(e.target.files ?? [])]; e.target.value = ""; void onFiles(l); }} />
          </Field>
          {files.length ? <ul className="mt-2 flex flex-wrap gap-2 text-xs">{files.map((f) => <li key={f.id} className="rounded bg-ink/5 px-2 py-1">{f.name}</li>)}</ul> : null}
        </div>
        {error ? <p role="alert" className="sm:col-span-4 rounded bg-hazard/10 px-3 py-2 text-xs text-hazard">{error}</p> : null}
        <div className="flex gap-2 sm:col-span-4">
          <Button type="submit" disabled={save.isPending || uploading}>{uploading ? "Uploading…" : save.isPending ? "Saving…" : "Save entry"}</Button>
          <Button type="button" tone="ghost" onClick={onDone}>Cancel</Button>
        </div>
      </form>
    </Card>
  );
}
