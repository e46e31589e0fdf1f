import type { Metadata } from "next";
import Link from "next/link";
import { requirePageBuild } from "@/lib/page-access";
import { listLinkages } from "@/db/linkages";
import { BuildNav } from "@/components/BuildNav";
import { Card, EmptyState, Main } from "@/components/ui";
import { db } from "@/db/index";
import { notCheckedWords } from "@/shared/check-state";
import { severityCount } from "@/shared/analysis/finding-title";

export const metadata: Metadata = { title: "Checklist" };

export default async function ChecklistIndex({ params }: { params: Promise<{ buildId: string }> }) {
  const { buildId } = await params;
  const { build } = await requirePageBuild(buildId, `/builds/${buildId}/checklist`);
  const linkages = await listLinkages(build.id);
  const ticked = linkages.length
    ? await db("checklist_items as c").join("linkages as l", function () { this.on("l.id", "c.linkage_id").andOn("l.current_revision", "c.revision"); })
      .where("l.build_id", build.id).whereNotNull("c.ticked_at").groupBy("c.linkage_id").select("c.linkage_id", db.raw("count(*)::int as n"))
    : [];
  const n = new Map(ticked.map((t: { linkage_id: string; n: number }) => [t.linkage_id, t.n]));
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
                    revision {l.revision} · {n.get(l.id) ?? 0} ticked
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
