"use client";
/** The open revision history of a linkage (a page at a time) and the comparison of two of its revisions. */
import { useState } from "react";
import { LoadMore } from "@/components/paged";
import { useDiff, useRevisions } from "./api";
import { DiffView } from "./DiffView";
import { when } from "./format";

export function RevisionHistory({ buildId, linkageId }: { buildId: string; linkageId: string }) {
  const revs = useRevisions(buildId, linkageId, true);
  const list = revs.revisions;
  const [pick, setPick] = useState<{ from: number | null; to: number | null }>({ from: null, to: null });
  const to = pick.to ?? list[0]?.revision ?? null;
  const from = pick.from ?? (to !== null ? Math.max(1, to - 1) : null);
  const diff = useDiff(buildId, linkageId, from, to);
  return (
    <>
      <ul className="max-h-40 space-y-0.5 overflow-y-auto text-[11px]" data-testid="revision-list">
        {list.map((r) => (
          <li key={r.revision} data-testid="revision-item" className="flex gap-1">
            <span className="w-8 font-mono">r{r.revision}</span>
            <span className="flex-1 truncate">{r.author.name}</span>
            <span className="text-ink-soft">{when(r.createdAt)}</span>
            {r.summary && r.summary.hazard > 0 && <span className="text-hazard">{r.summary.hazard}H</span>}
          </li>
        ))}
        <li><LoadMore shown={list.length} total={revs.total} noun="revisions" hasMore={!!revs.hasNextPage} loading={revs.isFetchingNextPage} error={revs.isFetchNextPageError ? revs.error : null} onMore={() => void revs.fetchNextPage()} /></li>
      </ul>
      {list.length > 1 && (
        <div className="flex items-center gap-1 text-[11px]">
          Changes from
          <select data-testid="diff-from" className="rounded border border-ink/20 px-1" value={from ?? ""} onChange={(e) => setPick({ to, from: Number(e.target.value) })}>
            {list.map((r) => <option key={r.revision} value={r.revision}>r{r.revision}</option>)}
          </select>
          to
          <select data-testid="diff-to" className="rounded border border-ink/20 px-1" value={to ?? ""} onChange={(e) => setPick({ from, to: Number(e.target.value) })}>
            {list.map((r) => <option key={r.revision} value={r.revision}>r{r.revision}</option>)}
          </select>
        </div>
      )}
      {diff.data && <DiffView d={diff.data.diff} />}
    </>
  );
}
