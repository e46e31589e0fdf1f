import { withBuild, parseParams, json } from "@/lib/http";
import { uuidParam } from "@/shared/api";
import { listRevisions } from "@/db/review";
import { requireLinkage } from "@/lib/review";

type P = { buildId: string; linkageId: string };

/** The revision history, newest first: number, author, time and the counts of findings. */
export const GET = withBuild<P>("read", async ({ build, params }) => {
  const linkage = await requireLinkage(build.id, parseParams(params.linkageId, uuidParam));
  return json({ currentRevision: linkage.revision, revisions: await listRevisions(linkage.id) });
});
