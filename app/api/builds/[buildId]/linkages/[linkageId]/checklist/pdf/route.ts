import { withBuild, requestedRevision } from "@/lib/http";
import { listTicks } from "@/db/checklist";
import { checklistFor } from "@/shared/records/checklist";
import { pdfResponse, requireLinkage, slug } from "@/lib/records-http";
import { checklistPdf } from "@/lib/records-pdf";

type P = { buildId: string; linkageId: string };

export const GET = withBuild<P>("read", async ({ req, build, params }) => {
  const linkage = await requireLinkage(build.id, params.linkageId);
  const rev = await requestedRevision(req, linkage.id);
  const ticks = await listTicks(linkage.id, rev.revision);
  const bytes = await checklistPdf(build, linkage, rev.revision, checklistFor(rev.graph), ticks);
  return pdfResponse(bytes, `${slug(build.name)}-${slug(linkage.name)}-rev${rev.revision}-checklist.pdf`);
});
