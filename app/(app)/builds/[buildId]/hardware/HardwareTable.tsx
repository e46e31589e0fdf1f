"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { ExportButton } from "@/components/records/ExportButton";
import { createColumnHelper, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type ColumnFiltersState, type SortingState } from "@tanstack/react-table";
import Link from "next/link";
import { useEffect, useMemo, useRef, useState } from "react";
import { api } from "@/components/api-client";
import { Card, EmptyState, Input, Select } from "@/components/ui";
import { HARDWARE_KIND_LABEL, HARDWARE_STATES, HARDWARE_STATE_LABEL, type HardwareState } from "@/shared/records/hardware";
import type { HardwareLineView } from "@/shared/schemas/hardware";
import { hardwareKeys } from "@/components/query-keys";
import { DataTable } from "@/components/DataTable";

type Line = HardwareLineView;
const KIND_LABEL: Record<string, string> = HARDWARE_KIND_LABEL;
const STATE_TONE: Record<HardwareState, string> = { to_order: "text-caution", ordered: "text-advisory", received: "text-ink", installed: "text-ink", inspected: "text-ok" };
const col = createColumnHelper<Line>();

/**
 * A line's state. A pick with the mouse or a finger (a list that opened and closed) saves at once; with the keyboard,
 * the arrow keys only move through the states (Chrome on Windows and Linux fires a change for each one on a closed
 * select) and Enter, or leaving the select, saves the one shown; Escape puts the saved one back.
 */
function StateSelect({ line, onSave }: { line: Line; onSave: (state: HardwareState) => void }) {
  const [draft, setDraft] = useState<HardwareState>(line.state);
  useEffect(() => setDraft(line.state), [line.state]);
  const byKeys = useRef(false);
  const commit = (v: HardwareState) => { byKeys.current = false; if (v !== line.state) onSave(v); };
  return (
    <Select aria-label={`State of ${line.description}`} data-state-key={line.key} data-unsaved={draft !== line.state || undefined}
      value={draft} className={`min-w-36 ${STATE_TONE[draft]} data-[unsaved=true]:border-dashed data-[unsaved=true]:border-advisory`}
      onPointerDown={() => { byKeys.current = false; }}
      onKeyDown={(e) => {
        if (e.key === "Enter") { e.preventDefault(); commit(draft); }
        else if (e.key === "Escape" && draft !== line.state) { e.preventDefault(); setDraft(line.state); byKeys.current = false; }
        else if (e.key !== "Tab" && e.key !== "Shift") byKeys.current = true;
      }}
      onChange={(e) => { const v = e.target.value as HardwareState; setDraft(v); if (!byKeys.current) commit(v); }}
      onBlur={() => commit(draft)}>
      {HARDWARE_STATES.map((s) => <option key={s} value={s}>{HARDWARE_STATE_LABEL[s]}</option>)}
    </Select>
  );
}

export function HardwareTable({ buildId, canEdit, initial }: { buildId: string; canEdit: boolean; initial: Line[] }) {
  const qc = useQueryClient();
  const key = hardwareKeys.list(buildId);
  const q = useQuery({ queryKey: key, queryFn: async () => (await api<{ lines: Line[] }>(`/api/builds/${buildId}/hardware`)).lines, initialData: initial });
  const [error, setError] = useState<string | null>(null);
  const setState = useMutation({
    mutationFn: (v: { key: string; state: HardwareState }) => api(`/api/builds/${buildId}/hardware`, { method: "PUT", body: v }),
    onMutate: (v) => { qc.setQueryData<Line[]>(key, (old) => old?.map((l) => (l.key === v.key ? { ...l, state: v.state } : l))); },
    onSettled: () => qc.invalidateQueries({ queryKey: key }),
    onError: (e) => setError(e instanceof Error ? e.message : String(e)),
  });
  // A line names its first few places; "show all" fetches that line whole and puts it in the list.
  const showAll = useMutation({
    mutationFn: async (lineKey: string) => (await api<{ lines: Line[] }>(`/api/builds/${buildId}/hardware?line=${encodeURIComponent(lineKey)}`)).lines[0],
    onSuccess: (full) => { if (full) qc.setQueryData<Line[]>(key, (old) => old?.map((l) => (l.key === full.key ? { ...l, usedIn: full.usedIn } : l))); },
    onError: (e) => setError(e instanceof Error ? e.message : String(e)),
  });
  // The cells read the mutations through a ref: the columns stay the same objects, so a save re-renders a row's
  // select instead of mounting a new one (which would drop the keyboard's focus to the page).
  const live = useRef({ setState, showAll });
  live.current = { setState, showAll };
  // The select whose state was just saved: if the refetch still loses its focus (a re-sort), it is given back.
  const lastSaved = useRef<string | null>(null);
  useEffect(() => {
    const k = lastSaved.current;
    if (!k) return;
    if (!document.activeElement || document.activeElement === document.body) document.querySelector<HTMLSelectElement>(`select[data-state-key="${CSS.escape(k)}"]`)?.focus();
    if (!q.isFetching) lastSaved.current = null;
  }, [q.data, q.isFetching]);
  const [sorting, setSorting] = useState<SortingState>([]);
  const [filter, setFilter] = useState("");
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);

  const columns = useMemo(() => [
    col.accessor("kind", { header: "Kind", cell: (c) => KIND_LABEL[c.getValue()] ?? c.getValue(), filterFn: "equals" }),
    col.accessor("description", { header: "Part" }),
    col.accessor("partNumber", { header: "Part number", cell: (c) => <span className="font-mono text-xs">{c.getValue() ?? "—"}</span> }),
    col.accessor("quantity", { header: "Qty", cell: (c) => <span className="tabular-nums">{c.getValue()}</span> }),
    col.accessor((l) => l.usedIn.map((u) => `${u.linkageName} ${u.jointId} ${u.where}`).join(" "), {
      id: "usedIn", header: "Where used", enableSorting: false,
      cell: (c) => {
        const l = c.row.original;
        return (
          <ul className="space-y-0.5">
            {l.usedIn.map((u) => (
              <li key={`${u.linkageId}-${u.jointId}`}>
                <Link className="inline-flex min-h-6 items-center text-advisory hover:underline" href={`/builds/${buildId}/linkages/${u.linkageId}?select=${encodeURIComponent(u.jointId)}`} title={`Open ${u.linkageName} with ${u.where} selected`}>
                  {u.linkageName}: {u.where}
                </Link>
              </li>
            ))}
            {l.usedInCount > l.usedIn.length ? (
              <li>
                <button type="button" className="min-h-6 text-ink-soft underline hover:text-ink disabled:opacity-60" data-testid="hardware-used-in-more" disabled={live.current.showAll.isPending}
                  onClick={() => live.current.showAll.mutate(l.key)}>
                  {live.current.showAll.isPending && live.current.showAll.variables === l.key ? "Loading…" : `…and ${l.usedInCount - l.usedIn.length} more place${l.usedInCount - l.usedIn.length === 1 ? "" : "s"}: show all`}
                </button>
              </li>
            ) : null}
          </ul>
        );
      },
    }),
    col.accessor("state", {
      header: "State", filterFn: "equals",
      sortingFn: (a, b) => HARDWARE_STATES.indexOf(a.original.state) - HARDWARE_STATES.indexOf(b.original.state),
      cell: (c) => canEdit ? (
        <StateSelect line={c.row.original} onSave={(state) => { lastSaved.current = c.row.original.key; live.current.setState.mutate({ key: c.row.original.key, state }); }} />
      ) : <span className={STATE_TONE[c.getValue()]}>{HARDWARE_STATE_LABEL[c.getValue()]}</span>,
    }),
  ], [buildId, canEdit]);

  const table = useReactTable({
    data: q.data, columns, getRowId: (l) => l.key, state: { sorting, globalFilter: filter, columnFilters }, onSortingChange: setSorting, onGlobalFilterChange: setFilter, onColumnFiltersChange: setColumnFilters,
    getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel(), getFilteredRowModel: getFilteredRowModel(),
  });
  const count = (s: HardwareState) => q.data.filter((l) => l.state === s).reduce((a, l) => a + l.quantity, 0);
  const colFilter = (id: string) => (columnFilters.find((f) => f.id === id)?.value as string) ?? "";
  const setColFilter = (id: string, v: string) => setColumnFilters((fs) => [...fs.filter((f) => f.id !== id), ...(v ? [{ id, value: v }] : [])]);

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold">Hardware list</h1>
          <p className="text-ink-soft">Every part the joint cards call for, across the current revision of each linkage.</p>
        </div>
        <ExportButton buildId={buildId} kind="hardware-csv" params={{}} testId="hardware-csv">Export CSV</ExportButton>
      </div>
      {error ? <p role="alert" className="rounded bg-hazard/10 px-3 py-2 text-xs text-hazard">{error}</p> : null}
      {q.data.length === 0 ? (
        <EmptyState title="No hardware yet">
          The list builds itself from the joint cards: open a linkage, select a joint and fill in its rod end, bolt, nut and washers.
          Each part then shows here with its quantity and where it is used, ready to track from ordered to inspected.
        </EmptyState>
      ) : (
        <Card
          title={<span className="font-normal text-ink-soft">{HARDWARE_STATES.map((s) => `${HARDWARE_STATE_LABEL[s]} ${count(s)}`).join(" · ")}</span>}
          actions={<>
            <Select aria-label="Only kind" value={colFilter("kind")} onChange={(e) => setColFilter("kind", e.target.value)} className="min-w-36 sm:w-40"><option value="">All kinds</option>{Object.entries(KIND_LABEL).map(([k, v]) => <option key={k} value={k}>{v}</option>)}</Select>
            <Select aria-label="Only state" value={colFilter("state")} onChange={(e) => setColFilter("state", e.target.value)} className="min-w-36 sm:w-40"><option value="">All states</option>{HARDWARE_STATES.map((s) => <option key={s} value={s}>{HARDWARE_STATE_LABEL[s]}</option>)}</Select>
            <Input aria-label="Filter hardware" placeholder="Filter…" value={filter} onChange={(e) => setFilter(e.target.value)} className="w-44" />
          </>}
        >
          <DataTable table={table} testId="hardware-table" rowTestId="hardware-row" />
          {table.getRowModel().rows.length === 0 ? <p className="py-4 text-center text-ink-soft">Nothing matches these filters.</p> : null}
        </Card>
      )}
    </div>
  );
}
