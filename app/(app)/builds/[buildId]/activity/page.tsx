import { Main } from "@/components/ui";
import type { Metadata } from "next";
import { requirePageBuild } from "@/lib/page-access";
import { pageActivity } from "@/db/activity";
import { encodeCursor, PAGE_DEFAULT } from "@/lib/paging";
import { BuildNav } from "@/components/BuildNav";
import { ActivityList } from "./ActivityList";

export const metadata: Metadata = { title: "Activity" };

export default async function ActivityPage({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build } = await requirePageBuild(buildId, `/builds/${buildId}/activity`);
  const first = await pageActivity(build.id, { limit: PAGE_DEFAULT, after: null });
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="/activity" />
      <Main className="mx-auto max-w-3xl space-y-4 p-6">
        <h1 className="text-xl font-semibold">Activity</h1>
        <p className="text-ink-soft">Everything done in this build, newest first: who did it and when.</p>
        <ActivityList buildId={build.id} first={{ activity: first.items, total: first.total, nextCursor: encodeCursor(first.next) }} />
      </Main>
    </>
  );
}
