import { withBuild, json, parseParams, UUID_RE } from "@/lib/http";
import { exportNotFailed, notFound } from "@/lib/errors";
import { getExport, requeueFailed, toJobView } from "@/db/exports";
import { enqueue, newQueueJobId } from "@/lib/jobs/queue";
import { z } from "zod";

type P = { buildId: string; jobId: string };

/** Puts a failed export back in the queue (202); 409 when it has not failed. */
export const POST = withBuild<P>("read", async ({ build, params }) => {
  const id = parseParams(params.jobId, z.string().regex(UUID_RE));
  const row = await getExport(build.id, id);
  if (!row) throw notFound("export");
  const queueJobId = newQueueJobId();
  const again = await requeueFailed(build.id, id, queueJobId);
  if (!again) throw exportNotFailed(`This export is ${row.status}; only a failed export can be retried.`);
  await enqueue(again.id, queueJobId);
  return json({ job: toJobView(again) }, 202);
});
