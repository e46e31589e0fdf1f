import { withBuild, json } from "@/lib/http";
import { readLogFilter } from "@/lib/log-filter";
import { estimateLogPdf } from "@/lib/jobs/kinds";

/** What a log PDF of this filter would hold and about how large it would be, before it is made. */
export const GET = withBuild("read", async ({ req, build }) => json({ estimate: await estimateLogPdf(build.id, readLogFilter(req)) }));
