"use client";
import { flexRender, type Table } from "@tanstack/react-table";

/** A dense, sortable table of a TanStack table instance: click a header to sort; the sort is announced with aria-sort. */
export function DataTable<T>({ table, testId, rowTestId }: { table: Table<T>; testId: string; rowTestId: string }) {
  return (
    <div className="table-box">
      {/* On a phone the table keeps readable columns and scrolls in its box (first column kept) instead of squeezing. */}
      <table className="w-full min-w-[40rem] text-left text-sm md:min-w-0" data-testid={testId}>
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                const label = flexRender(h.column.columnDef.header, h.getContext());
                return (
                  <th key={h.id} className="py-1 pr-3 font-medium" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}>
                    {h.column.getCanSort() ? (
                      <button type="button" className="touch-target inline-flex items-center hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                        {label}{sorted === "asc" ? " ▲" : sorted === "desc" ? " ▼" : ""}
                      </button>
                    ) : label}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((r) => (
            <tr key={r.id} className="border-t border-ink/10" data-testid={rowTestId}>
              {r.getVisibleCells().map((c) => <td key={c.id} className="py-1.5 pr-3 align-top">{flexRender(c.column.columnDef.cell, c.getContext())}</td>)}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
