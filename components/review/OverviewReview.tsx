import Link from "next/link";
import { SignoffBadge } from "./SignoffBadge";

type Summary = Record<string, { unresolved: number; signoff: { revision: number; reviewerName: string; at: string; stale: boolean } | null }>;

/** The build overview's review card: each linkage's sign-off state and open review threads. */
export function OverviewReview({ buildId, linkages, summary }: { buildId: string; linkages: { id: string; name: string; revision: number }[]; summary: Summary }) {
  if (linkages.length === 0) return <p className="text-ink-soft">Sign-offs and open review threads appear here once the build has a linkage.</p>;
  return (
    <ul className="space-y-2" data-testid="overview-review">
      {linkages.map((l) => {
        const s = summary[l.id];
        const so = s?.signoff;
        const status = so
          ? { state: so.stale ? ("stale" as const) : ("signed" as const), latest: { revision: so.revision, reviewer: { name: so.reviewerName }, createdAt: so.at } }
          : { state: "none" as const, latest: null };
        const open = s?.unresolved ?? 0;
        return (
          <li key={l.id} data-testid="overview-review-item" data-linkage-id={l.id} className="space-y-0.5">
            <Link href={`/builds/${buildId}/linkages/${l.id}`} className="font-medium hover:underline">{l.name}</Link>
            <div className="flex flex-wrap items-center gap-2">
              <SignoffBadge status={status} currentRevision={l.revision} />
              <span data-testid="overview-open-threads" data-count={open} className={`text-xs ${open ? "text-caution" : "text-ink-soft"}`}>
                {open} open thread{open === 1 ? "" : "s"}
              </span>
            </div>
          </li>
        );
      })}
    </ul>
  );
}
