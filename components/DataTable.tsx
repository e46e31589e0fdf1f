"use client";
import { flexRender, type Table } from "@tanstack/react-table";
import { useCallback, useEffect, useRef, useState } from "react";

/**
 * A dense, sortable table of a TanStack table instance: click a header to sort; the sort is announced with aria-sort.
 *
 * On a phone (below `sm`) each row is laid out as a card, one line a column with the column's name beside its value,
 * and the sortable headers become a row of sort buttons above the cards: every column is readable without sideways
 * scrolling, and a row is only as tall as what it shows. The elements keep their table roles explicitly, since a
 * table whose rows are displayed as blocks loses them in some browsers.
 *
 * From `sm` up a table wider than its box scrolls in the box (first column kept); it then says so, and a shadow marks
 * each edge with more columns beyond it.
 */
export function DataTable<T>({ table, testId, rowTestId }: { table: Table<T>; testId: string; rowTestId: string }) {
  const box = useRef<HTMLDivElement>(null);
  const [more, setMore] = useState({ left: false, right: false });
  const measure = useCallback(() => {
    const el = box.current;
    if (!el) return;
    const left = el.scrollLeft > 1;
    const right = el.scrollLeft + el.clientWidth < el.scrollWidth - 1;
    setMore((m) => (m.left === left && m.right === right ? m : { left, right }));
  }, []);
  useEffect(() => {
    const el = box.current;
    if (!el || typeof ResizeObserver === "undefined") return;
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    if (el.firstElementChild) ro.observe(el.firstElementChild);
    return () => ro.disconnect();
  }, [measure]);

  return (
    <div>
      {more.left || more.right ? <p className="mb-1 text-xs text-ink-soft" data-testid="table-scroll-hint">Scroll sideways for more columns {more.right ? "→" : "←"}</p> : null}
      <div className="relative">
        {/* On a phone nothing scrolls, so the box does not clip the focus rings of the sort buttons. */}
        <div ref={box} onScroll={measure} className="table-box max-sm:overflow-visible!">
          <table role="table" className="w-full text-left text-sm max-sm:block sm:min-w-[40rem] md:min-w-0" data-testid={testId}>
            <thead role="rowgroup" className="text-xs uppercase tracking-wide text-ink-soft max-sm:block">
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id} role="row" className="max-sm:flex max-sm:flex-wrap max-sm:items-center max-sm:gap-1 max-sm:before:mr-1 max-sm:before:normal-case max-sm:before:tracking-normal max-sm:before:content-['Sort_by:']">
                  {hg.headers.map((h) => {
                    const sorted = h.column.getIsSorted();
                    const label = flexRender(h.column.columnDef.header, h.getContext());
                    return (
                      <th
                        key={h.id}
                        role="columnheader"
                        className={`py-1 pr-3 font-medium max-sm:py-0 max-sm:pr-0 ${h.column.getCanSort() ? "" : "max-sm:sr-only"}`}
                        aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                      >
                        {h.column.getCanSort() ? (
                          <button type="button" className="touch-target inline-flex min-h-6 items-center rounded hover:text-ink max-sm:min-h-8 max-sm:border max-sm:border-ink/15 max-sm:bg-white max-sm:px-2" onClick={h.column.getToggleSortingHandler()}>
                            {label}{sorted === "asc" ? " ▲" : sorted === "desc" ? " ▼" : ""}
                          </button>
                        ) : label}
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody role="rowgroup" className="max-sm:mt-2 max-sm:block">
              {table.getRowModel().rows.map((r) => (
                <tr key={r.id} role="row" className="border-t border-ink/10 max-sm:block max-sm:py-2" data-testid={rowTestId}>
                  {r.getVisibleCells().map((c) => {
                    const header = c.column.columnDef.header;
                    return (
                      <td key={c.id} role="cell" className="py-1.5 pr-3 align-top max-sm:flex max-sm:gap-3 max-sm:py-1 max-sm:pr-0">
                        {/* The column's name beside the value on a phone; a screen reader has it from the column header. */}
                        {typeof header === "string" ? <span aria-hidden="true" className="w-24 shrink-0 pt-0.5 text-xs uppercase tracking-wide text-ink-soft sm:hidden">{header}</span> : null}
                        <div className="min-w-0 flex-1 break-words">{flexRender(c.column.columnDef.cell, c.getContext())}</div>
                      </td>
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <div aria-hidden="true" className={`pointer-events-none absolute inset-y-0 left-0 z-10 w-5 bg-linear-to-r from-ink/15 to-transparent transition-opacity ${more.left ? "opacity-100" : "opacity-0"}`} />
        <div aria-hidden="true" className={`pointer-events-none absolute inset-y-0 right-0 z-10 w-5 bg-linear-to-l from-ink/15 to-transparent transition-opacity ${more.right ? "opacity-100" : "opacity-0"}`} />
      </div>
    </div>
  );
}
