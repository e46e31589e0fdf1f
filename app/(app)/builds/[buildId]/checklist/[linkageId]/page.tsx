import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageBuild } from "@/lib/page-access";
import { UUID_RE } from "@/lib/http";
import { getLinkage } from "@/db/linkages";
import { BuildNav } from "@/components/BuildNav";
import { can } from "@/shared/roles";
import { ChecklistScreen } from "./ChecklistScreen";

export const metadata: Metadata = { title: "Checklist" };

export default async function LinkageChecklist({ params, searchParams }: { params: Promise<{ buildId: string; linkageId: string }>; searchParams: Promise<{ revision?: string }> }) {
  const { buildId, linkageId } = await params;
  const { revision } = await searchParams;
  const { build, role } = await requirePageBuild(buildId, `/builds/${buildId}/checklist/${linkageId}`);
  if (!UUID_RE.test(linkageId)) notFound();
  const linkage = await getLinkage(build.id, linkageId);
  if (!linkage) notFound();
  const rev = revision && /^\d+$/.test(revision) ? Number(revision) : undefined;
  return (
    <>
      <BuildNav buildId={build.id} buildName={build.name} current="/checklist" />
      <main className="mx-auto max-w-5xl p-6">
        <ChecklistScreen buildId={build.id} linkageId={linkage.id} linkageName={linkage.name} revision={rev} canTick={can(role, "comment")} canEdit={can(role, "edit")} />
      </main>
    </>
  );
}
