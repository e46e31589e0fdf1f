import { revisionQuery } from "@/shared/api";
import { withBuild, parseParams } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { getRevision } from "@/db/linkages";
import { listTicks } from "@/db/checklist";
import { checklistFor } from "@/shared/records/checklist";
import { pdfResponse, requireLinkage, slug } from "@/lib/records-http";
import { checklistPdf } from "@/lib/records-pdf";

type P = { buildId: string; linkageId: string };

export const GET = withBuild<P>("read", async ({ req, build, params }) => {
  const linkage = await requireLinkage(build.id, params.linkageId);
  const q = req.nextUrl.searchParams.get("revision");
  const rev = await getRevision(linkage.id, q === null ? undefined : parseParams(q, revisionQuery));
  if (!rev) throw notFound("revision");
  const ticks = await listTicks(linkage.id, rev.revision);
  const bytes = await checklistPdf(build, linkage, rev.revision, checklistFor(rev.graph), ticks);
  return pdfResponse(bytes, `${slug(build.name)}-${slug(linkage.name)}-rev${rev.revision}-checklist.pdf`);
});
