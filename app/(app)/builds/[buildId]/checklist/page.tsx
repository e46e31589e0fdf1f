import type { Metadata } from "next";
import Link from "next/link";
import { requirePageBuild } from "@/lib/page-access";
import { getRevision, listLinkages } from "@/db/linkages";
import { listTicks } from "@/db/checklist";
import { checklistFor } from "@/shared/records/checklist";
import { checklistReport } from "@/shared/records/checklist-report";
import { tickedWords } from "@/shared/records/checklist-findings";
import { BuildNav } from "@/components/BuildNav";
import { Card, EmptyState, Main } from "@/components/ui";
import { notCheckedWords } from "@/shared/check-state";
import { severityCount } from "@/shared/analysis/finding-title";

export const metadata: Metadata = { title: "Checklist" };

export default async function ChecklistIndex({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build } = await requirePageBuild(buildId, `/builds/${buildId}/checklist`);
  const linkages = await listLinkages(build.id);
  // Each linkage's list as its own page makes it (the current revision's items, from its stored report: checklistReport),
  // so the index says "N of M ticked" with the same M.
  const progress = new Map(await Promise.all(linkages.map(async (l) => {
    const rev = await getRevision(l.id);
    if (!rev) return [l.id, null] as const;
    const items = checklistFor(rev.graph, checklistReport(rev, true, build.analysisSettings));
    const ticked = new Set((await listTicks(l.id, rev.revision)).filter((t) => t.tickedAt).map((t) => `${t.jointId}|${t.code}`));
    return [l.id, { done: items.filter((i) => ticked.has(`${i.jointId}|${i.code}`)).length, total: items.length }] as const;
  })));
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="/checklist" />
      <Main className="mx-auto max-w-4xl space-y-4 p-6">
        <div>
          <h1 className="text-xl font-semibold">Inspection checklist</h1>
          <p className="text-ink-soft">Generated from each linkage&apos;s joints: the checks its hardware calls for, then travel and stops. Ticks belong to one revision — an edit to the linkage starts a fresh list.</p>
        </div>
        {linkages.length === 0 ? (
          <EmptyState title="No linkage to inspect yet">Draw a control run on the overview page; its joints become the checklist an inspector ticks.</EmptyState>
        ) : (
          <Card>
            <ul className="divide-y divide-ink/10">
              {linkages.map((l) => (
                <li key={l.id} className="flex flex-wrap items-center justify-between gap-x-3 py-2" data-testid="checklist-linkage">
                  <Link className="touch-target inline-flex items-center font-medium hover:underline" href={`/builds/${build.id}/checklist/${l.id}`}>{l.name}</Link>
                  <span className="text-xs text-ink-soft">
                    revision {l.revision}{progress.get(l.id) ? <> · <span data-testid="checklist-linkage-progress">{tickedWords(progress.get(l.id)!.done, progress.get(l.id)!.total)}</span></> : null}
                    {notCheckedWords(l) ? <> · {notCheckedWords(l)}</>
                      : l.summary?.hazard ? <> · <span className="font-semibold text-hazard" data-testid="checklist-linkage-hazards">{severityCount(l.summary.hazard, "hazard")} in its check</span></> : null}
                  </span>
                </li>
              ))}
            </ul>
          </Card>
        )}
      </Main>
    </>
  );
}
