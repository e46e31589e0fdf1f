import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageLinkage } from "@/lib/page-access";
import { getRevision } from "@/db/linkages";
import { can } from "@/shared/roles";
import { settingsSchema } from "@/shared/analysis/types";
import { analyze } from "@/shared/analysis";
import { EditorScreen } from "./EditorScreen";

export const metadata: Metadata = { title: "Linkage" };

export default async function LinkagePage({ params }: { params: Promise<{ buildId: string; linkageId: string }> }) {
  const { buildId, linkageId } = await params;
  const { build, role, user, linkage } = await requirePageLinkage(buildId, linkageId, `/builds/${buildId}/linkages/${linkageId}`);
  const rev = await getRevision(linkage.id);
  if (!rev) notFound();
  const settings = settingsSchema.parse(build.analysisSettings ?? {});
  return (
    <EditorScreen
      buildId={build.id}
      buildName={build.name}
      linkageId={linkage.id}
      linkageName={linkage.name}
      system={linkage.system}
      // The check of this revision with the build's settings now, so the editor shows findings before (and without) its engine.
      initial={{ revision: rev.revision, graph: rev.graph, authorName: rev.author.name, createdAt: rev.createdAt, report: analyze(rev.graph, settings) }}
      canEdit={can(role, "edit")}
      canComment={can(role, "comment")}
      unitSystem={user.unitSystem}
      settings={settings}
      review={{ userId: user.id, canAcknowledge: can(role, "acknowledge"), canSignOff: can(role, "signOff") }}
      stored={{ revision: rev.revision, findings: rev.analysis?.findings ?? null }}
    />
  );
}
