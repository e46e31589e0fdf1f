import { Main } from "@/components/ui";
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageLinkage } from "@/lib/page-access";
import { getRevision } from "@/db/linkages";
import { listAcknowledgements } from "@/db/acknowledgements";
import { BuildNav } from "@/components/BuildNav";
import { can } from "@/shared/roles";
import { findingStates } from "@/shared/review/hazards";
import { checklistFindings } from "@/shared/records/checklist-findings";
import { ChecklistScreen } from "./ChecklistScreen";

export const metadata: Metadata = { title: "Checklist" };

export default async function LinkageChecklist({ params, searchParams }: { params: Promise<{ buildId: string; linkageId: string }>; searchParams: Promise<{ revision?: string }> }) {
  const { buildId, linkageId } = await params;
  const { revision } = await searchParams;
  const { build, role, linkage } = await requirePageLinkage(buildId, linkageId, `/builds/${buildId}/checklist/${linkageId}`);
  const rev = revision && /^\d+$/.test(revision) ? Number(revision) : undefined;
  // The open hazards and cautions of the current revision, from the report stored with it (not computed again here).
  const [current, acks] = await Promise.all([getRevision(linkage.id), listAcknowledgements(linkage.id)]);
  if (!current) notFound();
  const report = current.analysis;
  const findings = checklistFindings(current.revision, current.graph.nodes.length, report ? findingStates(report, current.graph, acks) : null);
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} page="/checklist/[linkageId]" />
      <Main className="mx-auto max-w-5xl p-6">
        <ChecklistScreen buildId={build.id} linkageId={linkage.id} linkageName={linkage.name} revision={rev} canTick={can(role, "comment")} canEdit={can(role, "edit")} findings={findings} />
      </Main>
    </>
  );
}
