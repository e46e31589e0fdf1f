import { withBuild, json, parseParams, UUID_RE } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { getExport, markSeen, toJobView } from "@/db/exports";
import { z } from "zod";

type P = { buildId: string; jobId: string };
const jobIdParam = z.string().regex(UUID_RE);

/** An export job's state: queued, running (with progress), done (with a download link) or failed (with why). */
export const GET = withBuild<P>("read", async ({ user, build, params }) => {
  const row = await getExport(build.id, parseParams(params.jobId, jobIdParam));
  if (!row) throw notFound("export");
  // The person who asked is watching: the worker need not e-mail them when it ends.
  if (row.user_id === user.id && (row.status === "queued" || row.status === "running")) await markSeen(row.id);
  return json({ job: toJobView(row) });
});
