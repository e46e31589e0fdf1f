import { Main } from "@/components/ui";
import type { Metadata } from "next";
import { requirePageLinkage } from "@/lib/page-access";
import { BuildNav } from "@/components/BuildNav";
import { can } from "@/shared/roles";
import { ChecklistScreen } from "./ChecklistScreen";

export const metadata: Metadata = { title: "Checklist" };

export default async function LinkageChecklist({ params, searchParams }: { params: Promise<{ buildId: string; linkageId: string }>; searchParams: Promise<{ revision?: string }> }) {
  const { buildId, linkageId } = await params;
  const { revision } = await searchParams;
  const { build, role, linkage } = await requirePageLinkage(buildId, linkageId, `/builds/${buildId}/checklist/${linkageId}`);
  const rev = revision && /^\d+$/.test(revision) ? Number(revision) : undefined;
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} current="/checklist" />
      <Main className="mx-auto max-w-5xl p-6">
        <ChecklistScreen buildId={build.id} linkageId={linkage.id} linkageName={linkage.name} revision={rev} canTick={can(role, "comment")} canEdit={can(role, "edit")} />
      </Main>
    </>
  );
}
