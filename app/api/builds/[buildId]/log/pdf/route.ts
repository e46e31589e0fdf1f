import { withBuild } from "@/lib/http";
import { listEntries, hourTotals } from "@/db/log";
import { readLogFilter } from "@/lib/log-filter";
import { pdfResponse, slug } from "@/lib/records-http";
import { logPdf } from "@/lib/records-pdf";

/** The log (or `?from=&to=` a date range of it, other filters too) as a PDF with photos, linkage pictures and the caution. */
export const GET = withBuild("read", async ({ req, build }) => {
  const f = readLogFilter(req);
  const [entries, totals] = await Promise.all([listEntries(build.id, f), hourTotals(build.id, f)]);
  const bytes = await logPdf(build, entries.reverse(), totals, f);
  return pdfResponse(bytes, `${slug(build.name)}-log${f.from ? `-${f.from}` : ""}${f.to ? `-to-${f.to}` : ""}.pdf`);
});
