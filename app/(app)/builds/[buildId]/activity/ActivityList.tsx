"use client";
import { LoadMore, usePagedList } from "@/components/paged";
import { activityText } from "@/shared/activity";

type Activity = { id: string; action: string; detail?: Record<string, unknown>; at: string; who: string };

export function ActivityList(p: { buildId: string; first: { activity: Activity[]; total: number; nextCursor: string | null } }) {
  const list = usePagedList<Activity>({ key: ["activity", p.buildId], url: `/api/builds/${p.buildId}/activity`, name: "activity", first: p.first });
  if (list.total === 0) return <p className="text-ink-soft">Nothing has happened in this build yet.</p>;
  return (
    <>
      <ol className="divide-y divide-ink/10 rounded-lg border border-ink/10 bg-white text-sm" aria-label="Activity">
        {list.items.map((a) => (
          <li key={a.id} className="flex flex-wrap justify-between gap-2 px-4 py-2" data-testid="activity-row">
            <span><span className="font-medium">{a.who}</span> {activityText(a.action, a.detail)}</span>
            <time className="text-xs tabular-nums text-ink-soft" dateTime={a.at}>{new Date(a.at).toLocaleString("en-CA")}</time>
          </li>
        ))}
      </ol>
      <LoadMore shown={list.items.length} total={list.total} noun="events" hasMore={!!list.hasNextPage} loading={list.isFetchingNextPage} error={list.isFetchNextPageError ? list.error : null} onMore={() => void list.fetchNextPage()} />
    </>
  );
}
