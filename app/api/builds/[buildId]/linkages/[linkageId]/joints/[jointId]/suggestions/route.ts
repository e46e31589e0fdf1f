import { withBuild, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { getRevision } from "@/db/linkages";
import { listParts } from "@/db/parts";
import { analyze } from "@/shared/analysis";
import { suggestParts } from "@/shared/records/suggest";
import { jointIdParam, requireLinkage } from "@/lib/records-http";

type P = { buildId: string; linkageId: string; jointId: string };

/**
 * "Suggest a part": parts of the build's library and the caller's own that fit the joint and carry the
 * required ultimate load of the current revision's stored analysis, ordered by margin.
 */
export const GET = withBuild<P>("read", async ({ user, build, params }) => {
  await requireLinkage(build.id, params.linkageId);
  const jointId = parseParams(params.jointId, jointIdParam);
  const rev = await getRevision(params.linkageId);
  const joint = rev?.graph.joints.find((j) => j.id === jointId);
  if (!rev || !joint) throw notFound("joint");
  const analysis = rev.analysis ?? analyze(rev.graph, build.analysisSettings);
  const result = analysis.joints.find((j) => j.jointId === jointId) ?? null;
  const [buildParts, mine] = await Promise.all([listParts({ buildId: build.id }), listParts({ userId: user.id })]);
  const tagged = [...buildParts.map((p) => ({ ...p, library: "build" as const })), ...mine.map((p) => ({ ...p, library: "personal" as const }))];
  return json({ revision: rev.revision, analysisStored: !!rev.analysis, ...suggestParts(joint, result, tagged) });
});
