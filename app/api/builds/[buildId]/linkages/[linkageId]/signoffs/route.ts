import { withBuild, parseBody, parseParams, json } from "@/lib/http";
import { ApiError } from "@/lib/errors";
import { uuidParam } from "@/shared/api";
import { signoffCreate } from "@/shared/review-api";
import { buildOwners, createSignoff, listAcknowledgements, listSignoffs, type Signoff } from "@/db/review";
import { reportOf, requireLinkage, requireRevision } from "@/lib/review";
import { unacknowledgedHazards } from "@/shared/review/hazards";
import { notifySignoff } from "@/lib/review-mail";

type P = { buildId: string; linkageId: string };

function status(signoffs: Signoff[]) {
  const latest = signoffs[0] ?? null;
  return { state: !latest ? "none" : latest.stale ? "stale" : "signed", latest } as const;
}

/** Every sign-off of the linkage, newest first, each marked stale when a later revision exists. */
export const GET = withBuild<P>("read", async ({ build, params }) => {
  const linkage = await requireLinkage(build.id, parseParams(params.linkageId, uuidParam));
  const signoffs = await listSignoffs(linkage.id, linkage.revision);
  return json({ currentRevision: linkage.revision, status: status(signoffs), signoffs });
});

/** A reviewer signs off the current revision with a statement; refused while any hazard is unacknowledged. */
export const POST = withBuild<P>("signOff", async ({ req, user, build, params }) => {
  const linkageId = parseParams(params.linkageId, uuidParam);
  const body = await parseBody(req, signoffCreate);
  const linkage = await requireLinkage(build.id, linkageId);
  if (body.revision > linkage.revision)
    throw new ApiError(400, "invalid_input", "Some fields need attention.", { revision: `There is no revision ${body.revision} yet (current: ${linkage.revision})` });
  if (body.revision < linkage.revision)
    throw new ApiError(409, "not_current", `Revision ${body.revision} has been replaced by revision ${linkage.revision}. Review the changes and sign the current revision.`, undefined, { currentRevision: linkage.revision });
  const rev = await requireRevision(linkage.id, body.revision);
  const hazards = unacknowledgedHazards(reportOf(build, rev), rev.graph, await listAcknowledgements(linkage.id));
  if (hazards.length > 0)
    throw new ApiError(
      409,
      "unacknowledged_hazards",
      `${hazards.length} hazard${hazards.length === 1 ? "" : "s"} in revision ${rev.revision} ${hazards.length === 1 ? "has" : "have"} no acknowledgement. Fix ${hazards.length === 1 ? "it" : "them"} or acknowledge with a reason before signing off.`,
      undefined,
      { hazards: hazards.map((h) => ({ code: h.code, subject: h.subject, message: h.message, lapsed: !!h.lapsed })) },
    );
  const signoff = await createSignoff({ buildId: build.id, linkageId: linkage.id, revision: rev.revision, reviewerId: user.id, statement: body.statement });
  await notifySignoff({
    owners: await buildOwners(build.id),
    reviewerId: user.id,
    reviewerName: user.name,
    buildId: build.id,
    buildName: build.name,
    linkageId: linkage.id,
    linkageName: linkage.name,
    revision: rev.revision,
    statement: body.statement,
  }).catch((e) => console.error("[review] sign-off mail failed", e));
  return json({ signoff }, 201);
});
