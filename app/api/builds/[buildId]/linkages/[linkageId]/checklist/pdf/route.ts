import { withLinkage } from "@/lib/http";
import { listTicks } from "@/db/checklist";
import { checklistFor } from "@/shared/records/checklist";
import { pdfResponse, slug } from "@/lib/records-http";
import { checklistPdf } from "@/lib/records-pdf";

export const GET = withLinkage("read", { revision: "requested" }, async ({ build, linkage, revision: rev }) => {
  const ticks = await listTicks(linkage.id, rev.revision);
  const bytes = await checklistPdf(build, linkage, rev.revision, checklistFor(rev.graph), ticks);
  return pdfResponse(bytes, `${slug(build.name)}-${slug(linkage.name)}-rev${rev.revision}-checklist.pdf`);
});
