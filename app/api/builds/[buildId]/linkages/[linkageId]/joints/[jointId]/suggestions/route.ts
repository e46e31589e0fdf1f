import { withLinkage, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { listParts } from "@/db/parts";
import { reportOf } from "@/lib/review";
import { suggestParts } from "@/shared/records/suggest";
import { jointIdParam } from "@/lib/records-http";

type P = { buildId: string; linkageId: string; jointId: string };

/**
 * "Suggest a part": parts of the build's library and the caller's own that fit the joint and carry the
 * required ultimate load of the current revision's stored analysis, ordered by margin.
 */
export const GET = withLinkage<P>("read", { revision: "current" }, async ({ user, build, revision: rev, params }) => {
  const jointId = parseParams(params.jointId, jointIdParam);
  const joint = rev.graph.joints.find((j) => j.id === jointId);
  if (!joint) throw notFound("joint");
  const result = reportOf(build, rev).joints.find((j) => j.jointId === jointId) ?? null;
  const [buildParts, mine] = await Promise.all([listParts({ buildId: build.id }), listParts({ userId: user.id })]);
  const tagged = [...buildParts.map((p) => ({ ...p, library: "build" as const })), ...mine.map((p) => ({ ...p, library: "personal" as const }))];
  return json({ revision: rev.revision, analysisStored: !!rev.analysis, ...suggestParts(joint, result, tagged) });
});
