"use client";
import { keepPreviousData, useInfiniteQuery, type QueryKey } from "@tanstack/react-query";
import { useEffect, useRef } from "react";
import { api } from "@/components/api-client";
import { Button } from "@/components/ui";
import { pagedItems } from "@/components/paged-items";

/**
 * A list read a page at a time (newest first) through react-query's infinite query. `url` may carry
 * its own query string (filters); the cursor is appended. `first` is the server-rendered first page.
 */
export function usePagedList<T, F extends object = object>(o: { key: QueryKey; url: string; name: string; first?: Record<string, unknown> & { total: number; nextCursor: string | null } }) {
  const q = useInfiniteQuery({
    queryKey: o.key,
    queryFn: ({ pageParam }) => api<Record<string, unknown> & { total: number; nextCursor: string | null }>(pageParam ? `${o.url}${o.url.includes("?") ? "&" : "?"}cursor=${encodeURIComponent(pageParam)}` : o.url),
    initialPageParam: "",
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    initialData: o.first ? { pages: [o.first], pageParams: [""] } : undefined,
    // A new filter keeps the previous list on screen until its first page arrives.
    placeholderData: keepPreviousData,
  });
  const pages = q.data?.pages ?? [];
  // The same array while the pages are the same (a table given a new array each render re-renders forever).
  const items = pagedItems<T>(q.data?.pages, o.name);
  const first = pages[0] as (F & { total: number }) | undefined;
  return { ...q, items, total: first?.total ?? 0, first };
}

/** "entries" → "entry", "threads" → "thread". */
const singular = (noun: string) => (noun.endsWith("ies") ? `${noun.slice(0, -3)}y` : noun.replace(/s$/, ""));

/**
 * The end of a paged list: says how many of how many are shown, loads the next page when it scrolls
 * into view (an IntersectionObserver on a sentinel), and offers a button for keyboard users.
 */
export function LoadMore(p: { shown: number; total: number; noun: string; hasMore: boolean; loading: boolean; error?: unknown; onMore: () => void }) {
  const sentinel = useRef<HTMLDivElement>(null);
  const more = useRef(p.onMore);
  more.current = p.onMore;
  const ready = p.hasMore && !p.loading && !p.error;
  useEffect(() => {
    const el = sentinel.current;
    if (!el || !ready || typeof IntersectionObserver === "undefined") return;
    const io = new IntersectionObserver((es) => { if (es.some((e) => e.isIntersecting)) more.current(); }, { rootMargin: "600px 0px" });
    io.observe(el);
    return () => io.disconnect();
  }, [ready, p.shown]);
  if (p.total === 0) return null;
  return (
    <div ref={sentinel} className="flex flex-wrap items-center justify-between gap-2 py-3 text-sm text-ink-soft" data-testid="load-more">
      <span aria-live="polite" data-testid="shown-count">
        {p.hasMore ? `Showing ${p.shown.toLocaleString("en-US")} of ${p.total.toLocaleString("en-US")} ${p.noun}, newest first.` : p.total === 1 ? `1 ${singular(p.noun)} shown.` : `All ${p.total.toLocaleString("en-US")} ${p.noun} shown.`}
      </span>
      {p.error ? <span role="alert" className="text-hazard">{p.error instanceof Error ? p.error.message : "The next page could not be loaded."}</span> : null}
      {p.hasMore ? <Button tone="secondary" size="sm" onClick={() => p.onMore()} disabled={p.loading}>{p.loading ? "Loading…" : p.error ? "Try again" : "Load more"}</Button> : null}
    </div>
  );
}
