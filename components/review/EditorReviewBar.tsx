"use client";
/** A thin strip above the editor: the linkage's sign-off state and its open review threads. */
import { useUnresolvedCounts, useSignoffs } from "./api";
import { SignoffBadge } from "./SignoffBadge";

export function EditorReviewBar({ buildId, linkageId }: { buildId: string; linkageId: string }) {
  const s = useSignoffs(buildId, linkageId);
  const open = Object.values(useUnresolvedCounts(buildId, linkageId)).reduce((a, b) => a + b, 0);
  return (
    <div className="flex items-center gap-3 border-b border-ink/10 bg-white px-3 py-1 text-[11px]" data-testid="review-bar">
      <span className="font-semibold text-ink-soft">Review</span>
      {s.data ? <SignoffBadge status={s.data.status} currentRevision={s.data.currentRevision} /> : <span className="text-ink-soft">…</span>}
      <span data-testid="review-bar-open" data-count={open} className={open ? "text-caution" : "text-ink-soft"}>
        {open} open thread{open === 1 ? "" : "s"}
      </span>
      <span className="text-ink-soft">Select nothing to see the sign-off and history; select a part or joint for its thread.</span>
    </div>
  );
}
