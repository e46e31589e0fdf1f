"use client";
/** A parts library (a person's own, or a build's), newest first a page at a time, searched in the database: sortable table, add a part, CSV import with a row report, CSV export. */
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { useEffect, useMemo, useState } from "react";
import { LoadMore, usePagedList } from "@/components/paged";
import { api, ApiFailure } from "@/components/api-client";
import { partKeys } from "@/components/query-keys";
import { Button, Card, Caution, EmptyState, Field, Input, Select } from "@/components/ui";
import { CSV_UNITS, PART_KINDS, PART_KIND_LABEL, SPEC_COLUMNS, describeSpec, partInput, type Part, type PartKind, type RowError } from "@/shared/records/parts";
import { THREADS } from "@/shared/linkage/schema";
import { DataTable } from "@/components/DataTable";

type Report = { rows: number; valid: number; imported: number; skipped?: number; errors: RowError[]; delimiter: string };
const col = createColumnHelper<Part>();

export function PartsLibrary({ apiBase, canEdit, title, intro }: { apiBase: string; canEdit: boolean; title: string; intro: string }) {
  const qc = useQueryClient();
  const key = partKeys.list(apiBase);
  const [filter, setFilter] = useState("");
  const [search, setSearch] = useState("");
  // The search runs in the database over the whole library, a moment after typing stops.
  useEffect(() => { const t = setTimeout(() => setSearch(filter.trim()), 250); return () => clearTimeout(t); }, [filter]);
  const parts = usePagedList<Part>({ key: [...key, search], url: search ? `${apiBase}?q=${encodeURIComponent(search)}` : apiBase, name: "parts" });
  const [sorting, setSorting] = useState<SortingState>([]);
  const [error, setError] = useState<string | null>(null);
  const del = useMutation({ mutationFn: (id: string) => api(`${apiBase}/${id}`, { method: "DELETE" }), onSuccess: () => qc.invalidateQueries({ queryKey: key }), onError: (e) => setError(String(e instanceof Error ? e.message : e)) });
  // `del` is a new object every render but its `mutate` is not: the columns depend on that alone, so they stay the
  // same objects and the cells (rendered as components) are not mounted afresh, which would drop the keyboard's focus.
  const remove = del.mutate;

  const columns = useMemo(() => [
    col.accessor("kind", { header: "Kind", cell: (c) => PART_KIND_LABEL[c.getValue()] }),
    col.accessor("partNumber", { header: "Part number", cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
    col.accessor((p) => describeSpec(p), { id: "spec", header: "Spec (in, lbf)" }),
    col.accessor((p) => (p.kind === "rodEnd" ? (p.spec as { ratedUltimate: number }).ratedUltimate : null), { id: "rating", header: "Rated ult. (lbf)", cell: (c) => (c.getValue() ?? "—"), sortUndefined: "last" }),
    col.accessor("description", { header: "Description" }),
    ...(canEdit ? [col.display({ id: "actions", header: () => <span className="sr-only">Actions</span>, cell: (c) => <Button size="sm" tone="ghost" aria-label={`Delete ${c.row.original.partNumber}`} onClick={() => { if (confirm(`Delete ${c.row.original.partNumber}?`)) remove(c.row.original.id); }}>Delete</Button> })] : []),
  ], [canEdit, remove]);
  const table = useReactTable({
    // The same array while the loaded pages are the same (see pagedItems); the table only reads it.
    data: parts.items as Part[], columns, state: { sorting }, onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel(),
  });
  const all = !parts.hasNextPage;

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div><h1 className="text-xl font-semibold">{title}</h1><p className="max-w-prose text-ink-soft">{intro}</p></div>
        <a href={`${apiBase}/export`} className="rounded border border-ink/20 bg-white px-3 py-1.5 text-sm font-medium hover:bg-ink/5">Export CSV</a>
      </div>
      {error ? <p role="alert" className="rounded bg-hazard/10 px-3 py-2 text-xs text-hazard">{error}</p> : null}
      {canEdit ? <div className="grid gap-6 lg:grid-cols-2"><AddPart apiBase={apiBase} /><ImportCsv apiBase={apiBase} /></div> : null}
      {!parts.isPending && parts.total === 0 && !search ? (
        <EmptyState title="No parts in this library yet">
          Record the rod ends, bolts, nuts, washers, tubes and bushings you buy, with the maker&apos;s ratings. &ldquo;Suggest a part&rdquo; on a joint then
          picks the ones that fit (thread, hand, bore) and carry the load, best margin first.{" "}
          {canEdit ? (
            <>Add them one by one above, or import a CSV with a header row such as
              <code className="mx-1 break-all rounded bg-ink/5 px-1">kind,partNumber,thread,hand,ballBore,ratedUltimate</code>.</>
          ) : (
            <>The build&apos;s owner and builders fill this library.</>
          )}
        </EmptyState>
      ) : (
        <Card title={`${parts.total.toLocaleString("en-US")} part${parts.total === 1 ? "" : "s"}${search ? " match" : ""}`} actions={<Input aria-label="Search parts" placeholder="Part number or description" value={filter} onChange={(e) => setFilter(e.target.value)} className="w-56" />}>
          {sorting.length && !all ? <p className="mb-2 text-xs text-caution">Sorted among the {parts.items.length} parts loaded so far; load the rest to sort the whole library.</p> : null}
          <DataTable table={table} testId="parts-table" rowTestId="part-row" />
          <LoadMore shown={parts.items.length} total={parts.total} noun="parts" hasMore={!!parts.hasNextPage} loading={parts.isFetchingNextPage} error={parts.isFetchNextPageError ? parts.error : null} onMore={() => void parts.fetchNextPage()} />
        </Card>
      )}
      {/* The library shows makers' ratings, which the suggestions turn into margins: the standing caution applies. */}
      <Caution />
    </div>
  );
}

const NUMERIC_FIELDS = new Set(Object.keys(CSV_UNITS));
const CHOICES: Record<string, readonly string[]> = {
  thread: THREADS, hand: ["RH", "LH"], shank: ["male", "female"], size: ["AN3", "AN4", "AN5", "AN6", "AN7", "AN8", "custom"], material: [],
  type: ["selfLockingMetal", "selfLockingInsert", "castellatedCotter", "plainSafetyWire", "plain"], pattern: ["tension", "shear"], hasWitnessHole: ["yes", "no"],
};

function AddPart({ apiBase }: { apiBase: string }) {
  const qc = useQueryClient();
  const [kind, setKind] = useState<PartKind>("rodEnd");
  const [values, setValues] = useState<Record<string, string>>({ partNumber: "", description: "" });
  const [fields, setFields] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const save = useMutation({
    mutationFn: (body: unknown) => api(apiBase, { body }),
    onSuccess: () => { setValues({ partNumber: "", description: "" }); setFields({}); setError(null); qc.invalidateQueries({ queryKey: partKeys.list(apiBase) }); },
    onError: (e) => { if (e instanceof ApiFailure && e.fields) setFields(e.fields); setError(e instanceof Error ? e.message : String(e)); },
  });
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const spec: Record<string, unknown> = {};
    for (const c of SPEC_COLUMNS[kind]) {
      const v = values[c];
      if (v === undefined || v === "") continue;
      spec[c] = NUMERIC_FIELDS.has(c) ? Number(v) : c === "hasWitnessHole" ? v === "yes" : v;
    }
    const body = { kind, partNumber: values.partNumber, description: values.description ?? "", spec };
    const r = partInput.safeParse(body);
    if (!r.success) { setFields(Object.fromEntries(r.error.issues.map((i) => [i.path.join("."), i.message]))); setError("Some fields need attention."); return; }
    save.mutate(body);
  };
  const set = (k: string, v: string) => setValues((x) => ({ ...x, [k]: v }));
  return (
    <Card title="Add a part">
      <form className="grid grid-cols-2 gap-3" onSubmit={submit}>
        <Field label="Kind" htmlFor="p-kind"><Select id="p-kind" value={kind} onChange={(e) => { setKind(e.target.value as PartKind); setFields({}); }}>{PART_KINDS.map((k) => <option key={k} value={k}>{PART_KIND_LABEL[k]}</option>)}</Select></Field>
        <Field label="Part number" htmlFor="p-pn" error={fields.partNumber}><Input id="p-pn" value={values.partNumber ?? ""} onChange={(e) => set("partNumber", e.target.value)} aria-invalid={!!fields.partNumber} /></Field>
        {SPEC_COLUMNS[kind].map((c) => {
          const id = `p-${c}`;
          const label = `${c.replace(/([A-Z])/g, " $1").toLowerCase()}${CSV_UNITS[c] ? ` (${CSV_UNITS[c]})` : ""}`;
          const choices = c === "material" ? (kind === "tube" ? ["4130N", "6061-T6", "2024-T3"] : kind === "bolt" ? ["steel", "aluminium"] : null) : CHOICES[c];
          return (
            <Field key={c} label={label} htmlFor={id} error={fields[`spec.${c}`]}>
              {choices && choices.length ? (
                <Select id={id} value={values[c] ?? ""} onChange={(e) => set(c, e.target.value)} aria-invalid={!!fields[`spec.${c}`]}><option value="">—</option>{choices.map((o) => <option key={o} value={o}>{o}</option>)}</Select>
              ) : <Input id={id} inputMode={NUMERIC_FIELDS.has(c) ? "decimal" : undefined} value={values[c] ?? ""} onChange={(e) => set(c, e.target.value)} aria-invalid={!!fields[`spec.${c}`]} />}
            </Field>
          );
        })}
        <div className="col-span-2"><Field label="Description" htmlFor="p-desc"><Input id="p-desc" value={values.description ?? ""} onChange={(e) => set("description", e.target.value)} /></Field></div>
        {error ? <p role="alert" className="col-span-2 text-xs text-hazard">{error}</p> : null}
        <div className="col-span-2"><Button type="submit" disabled={save.isPending}>Add to library</Button></div>
      </form>
    </Card>
  );
}

function ImportCsv({ apiBase }: { apiBase: string }) {
  const qc = useQueryClient();
  const [csv, setCsv] = useState<{ name: string; text: string } | null>(null);
  const [skip, setSkip] = useState(false);
  const [report, setReport] = useState<Report | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const run = useMutation({
    mutationFn: async (dryRun: boolean) => {
      try { return { ok: true, r: await api<Report>(`${apiBase}/import`, { body: { csv: csv!.text, skipBadRows: skip, dryRun } }), dryRun }; }
      catch (e) { const report = e instanceof ApiFailure ? e.detail<Report>("report") : undefined; if (report) return { ok: false, r: report, dryRun, message: (e as Error).message }; throw e; }
    },
    onSuccess: (x) => {
      setReport(x.r);
      setMessage(x.dryRun ? `Checked: ${x.r.valid} of ${x.r.rows} rows can be imported.` : x.ok ? `Imported ${x.r.imported} part${x.r.imported === 1 ? "" : "s"}${x.r.skipped ? `, skipped ${x.r.skipped} bad row${x.r.skipped === 1 ? "" : "s"}` : ""}.` : (x as { message?: string }).message ?? null);
      if (!x.dryRun && x.ok) qc.invalidateQueries({ queryKey: partKeys.list(apiBase) });
    },
    onError: (e) => setMessage(e instanceof Error ? e.message : String(e)),
  });
  return (
    <Card title="Import a CSV">
      <div className="space-y-3">
        <p className="text-xs text-ink-soft">One part a row, a header row naming the columns: kind, partNumber, description and the spec fields of each kind ({PART_KINDS.map((k) => `${PART_KIND_LABEL[k].toLowerCase()}: ${SPEC_COLUMNS[k].join(", ")}`).join("; ")}). Inches and lbf. Commas, semicolons or tabs. Nothing is imported while any row has an error, unless you skip bad rows.</p>
        <input type="file" accept=".csv,text/csv,text/plain" aria-label="CSV file" className="text-sm" onChange={async (e) => { const f = e.target.files?.[0]; setReport(null); setMessage(null); setCsv(f ? { name: f.name, text: await f.text() } : null); }} />
        <label className="touch-target flex items-center gap-2 text-sm"><input type="checkbox" checked={skip} onChange={(e) => setSkip(e.target.checked)} />Skip bad rows and import the rest</label>
        <div className="flex gap-2">
          <Button type="button" tone="secondary" disabled={!csv || run.isPending} onClick={() => run.mutate(true)}>Check</Button>
          <Button type="button" disabled={!csv || run.isPending} onClick={() => run.mutate(false)}>Import</Button>
        </div>
        {message ? <p role="status" className="text-sm font-medium">{message}</p> : null}
        {report && report.errors.length ? (
          <div className="table-box">
            <table className="w-full text-left text-xs" data-testid="csv-report">
              <thead className="uppercase tracking-wide text-ink-soft"><tr><th className="py-1">Row</th><th>Part number</th><th>Column</th><th>Problem</th></tr></thead>
              <tbody>
                {report.errors.flatMap((r) => r.errors.map((e, i) => (
                  <tr key={`${r.row}-${i}`} className="border-t border-ink/10"><td className="py-1 tabular-nums">{i === 0 ? r.row : ""}</td><td className="font-mono">{i === 0 ? r.partNumber ?? "" : ""}</td><td>{e.column}</td><td className="text-hazard">{e.message}</td></tr>
                )))}
              </tbody>
            </table>
          </div>
        ) : null}
      </div>
    </Card>
  );
}
