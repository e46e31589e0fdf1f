import { withBuild, parseBody, json } from "@/lib/http";
import { createExport, toJobView } from "@/db/exports";
import { KINDS } from "@/lib/jobs/kinds";
import { enqueue, newQueueJobId } from "@/lib/jobs/queue";
import { exportRequest } from "@/shared/schemas/exports";

/**
 * Starts an export as a background job (`{kind, params}`): 202 with the job, whose progress, result
 * or failure `GET …/exports/:jobId` tells. The file is made by a worker process, never on this request.
 */
export const POST = withBuild("read", async ({ req, user, build, role }) => {
  const body = await parseBody(req, exportRequest);
  const { label, estimatedBytes } = await KINDS[body.kind].prepare(build, body.params as never, role);
  const queueJobId = newQueueJobId();
  const row = await createExport({ buildId: build.id, userId: user.id, kind: body.kind, params: body.params, label, estimatedBytes, queueJobId });
  await enqueue(row.id, queueJobId);
  return json({ job: toJobView(row) }, 202);
});
