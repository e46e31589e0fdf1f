import type { Metadata } from "next";
import { requirePageBuild } from "@/lib/page-access";
import { listLinkages } from "@/db/linkages";
import { listMembers } from "@/db/builds";
import { recentActivity } from "@/db/activity";
import { BuildNav } from "@/components/BuildNav";
import { Badge, Card, Caution, Main } from "@/components/ui";
import { can, ROLE_LABEL } from "@/shared/roles";
import { LinkagesPanel } from "./LinkagesPanel";
import { recentEntries } from "@/db/log";
import Link from "next/link";
import { reviewSummaryForBuild } from "@/db/signoffs";
import { OverviewReview } from "@/components/review/OverviewReview";
import { activityText } from "@/shared/activity";
import { openFindingTotals, uncheckedText } from "@/shared/check-state";

export const metadata: Metadata = { title: "Build overview" };


export default async function BuildOverview({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build, role } = await requirePageBuild(buildId, `/builds/${buildId}`);
  const [linkages, members, activity, review, log] = await Promise.all([
    listLinkages(build.id),
    listMembers(build.id),
    recentActivity(build.id),
    reviewSummaryForBuild(build.id),
    recentEntries(build.id, 5),
  ]);
  // Counted over the checked linkages only; the others are named, never added as zeros (shared/check-state.ts).
  const open = openFindingTotals(linkages);
  const unchecked = uncheckedText(open);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="" extra={<Badge>{ROLE_LABEL[role]}</Badge>} />
      <Main className="mx-auto grid max-w-6xl gap-6 p-6 lg:grid-cols-3">
        <div className="min-w-0 space-y-6 lg:col-span-2">
          <div>
            <h1 className="text-xl font-semibold">Overview</h1>
            <p className="text-ink-soft">{build.model || "Model not set"}{build.registration ? ` · ${build.registration}` : ""}</p>
          </div>
          <LinkagesPanel buildId={build.id} initial={linkages} canEdit={can(role, "edit")} />
          <Card title="Recent log entries" actions={<Link href={`/builds/${build.id}/log`} className="touch-target inline-flex min-h-6 items-center text-xs text-advisory hover:underline">Open the build log</Link>}>
            {log.length === 0 ? (
              <p className="text-ink-soft">No entries yet. Each shop session gets one: date, hours, what was done, photos.</p>
            ) : (
              <ul className="divide-y divide-ink/10" data-testid="recent-log">
                {log.map((e) => (
                  <li key={e.id} className="flex items-baseline justify-between gap-3 py-1.5">
                    <span><span className="text-xs tabular-nums text-ink-soft">{e.date}</span> <span className="font-medium">{e.title}</span></span>
                    <span className="shrink-0 text-xs text-ink-soft">{e.hours} h{e.author ? ` · ${e.author}` : ""}</span>
                  </li>
                ))}
              </ul>
            )}
          </Card>
          <Caution />
        </div>
        <aside className="min-w-0 space-y-6">
          <Card title="Open findings">
            {linkages.length === 0 ? (
              <p className="text-ink-soft">Findings appear here once a linkage has parts and joints.</p>
            ) : open.checked === 0 ? (
              <p className="text-ink-soft" data-testid="open-findings-unchecked">
                No findings to count yet: {unchecked}. Draw each run and fill in its joints&apos; hardware in the editor; the check runs as it saves.
              </p>
            ) : (
              <>
                <div className="flex gap-4" data-testid="open-findings">
                  <div><p className="text-2xl font-semibold text-hazard">{open.hazard}</p><p className="text-xs text-ink-soft">hazard{open.hazard === 1 ? "" : "s"}</p></div>
                  <div><p className="text-2xl font-semibold text-caution">{open.caution}</p><p className="text-xs text-ink-soft">caution{open.caution === 1 ? "" : "s"}</p></div>
                </div>
                {unchecked ? (
                  <p className="mt-2 text-xs text-ink-soft" data-testid="open-findings-unchecked">
                    In {open.checked} checked linkage{open.checked === 1 ? "" : "s"}; not counted: {unchecked}.
                  </p>
                ) : null}
              </>
            )}
          </Card>
          <Card title="Review and sign-off">
            <OverviewReview buildId={build.id} linkages={linkages} summary={review} />
          </Card>
          <Card title="Members">
            <ul className="space-y-1">
              {members.map((m) => (
                <li key={m.userId} className="flex justify-between"><span>{m.name}</span><span className="text-ink-soft">{ROLE_LABEL[m.role]}</span></li>
              ))}
            </ul>
          </Card>
          <Card title="Recent activity" actions={<Link href={`/builds/${build.id}/activity`} className="touch-target inline-flex min-h-6 items-center text-xs text-advisory hover:underline">All activity</Link>}>
            {activity.length === 0 ? <p className="text-ink-soft">Nothing yet.</p> : (
              <ul className="space-y-2 text-xs">
                {activity.map((a) => (
                  <li key={a.id}><span className="font-medium">{a.who}</span> {activityText(a.action, a.detail)}<br /><span className="text-ink-soft">{new Date(a.at).toLocaleString("en-CA")}</span></li>
                ))}
              </ul>
            )}
          </Card>
        </aside>
      </Main>
    </>
  );
}
