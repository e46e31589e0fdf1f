import { withBuild, parseBody, parseParams, json, requestedRevision } from "@/lib/http";
import { ApiError, notFound } from "@/lib/errors";
import { graphPut, uuidParam } from "@/shared/api";
import { getLinkage, getRevision, saveRevision } from "@/db/linkages";
import { analyze } from "@/shared/analysis";
import { afterRevisionSaved } from "@/lib/review";

type P = { buildId: string; linkageId: string };

/** The current revision of the graph (or `?revision=N`), with the analysis stored beside it. */
export const GET = withBuild<P>("read", async ({ req, build, params }) => {
  const id = parseParams(params.linkageId, uuidParam);
  if (!(await getLinkage(build.id, id))) throw notFound("linkage");
  const rev = await requestedRevision(req, id);
  return json(rev);
});

/** Save the next revision, only if `baseRevision` is still the current one (409 otherwise). */
export const PUT = withBuild<P>("edit", async ({ req, user, build, params }) => {
  const id = parseParams(params.linkageId, uuidParam);
  const { baseRevision, graph } = await parseBody(req, graphPut);
  const analysis = analyze(graph, build.analysisSettings);
  const saved = await saveRevision(build.id, id, baseRevision, graph, analysis, user.id);
  if (saved === "missing") throw notFound("linkage");
  if (saved === "stale") {
    const current = await getRevision(id);
    throw new ApiError(409, "stale_revision", `Someone saved revision ${current?.revision} while you were editing revision ${baseRevision}.`, undefined, { current });
  }
  await afterRevisionSaved(build, user, id, saved.revision); // earlier sign-offs are now stale
  return json({ ...saved, analysis });
});
