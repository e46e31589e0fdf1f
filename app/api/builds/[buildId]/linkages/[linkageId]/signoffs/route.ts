import { withLinkage, parseBody, json, getRevisionOrThrow } from "@/lib/http";
import { fieldError, notCurrent, unacknowledgedHazards as hazardsOpen } from "@/lib/errors";
import { signoffCreate } from "@/shared/schemas/signoffs";
import { createSignoff, listSignoffs } from "@/db/signoffs";
import { listAcknowledgements } from "@/db/acknowledgements";
import { buildOwners } from "@/db/builds";
import type { Signoff } from "@/shared/schemas/signoffs";
import { reportOf } from "@/lib/review";
import { unacknowledgedHazards } from "@/shared/review/hazards";
import { notifySignoff } from "@/lib/review-mail";

function status(signoffs: Signoff[]) {
  const latest = signoffs[0] ?? null;
  return { state: !latest ? "none" : latest.stale ? "stale" : "signed", latest } as const;
}

/** Every sign-off of the linkage, newest first, each marked stale when a later revision exists. */
export const GET = withLinkage("read", async ({ linkage }) => {
  const signoffs = await listSignoffs(linkage.id, linkage.revision);
  return json({ currentRevision: linkage.revision, status: status(signoffs), signoffs });
});

/** A reviewer signs off the current revision with a statement; refused while any hazard is unacknowledged. */
export const POST = withLinkage("signOff", async ({ req, user, build, linkage }) => {
  const body = await parseBody(req, signoffCreate);
  if (body.revision > linkage.revision)
    throw fieldError("revision", `There is no revision ${body.revision} yet (current: ${linkage.revision})`);
  if (body.revision < linkage.revision)
    throw notCurrent(`Revision ${body.revision} has been replaced by revision ${linkage.revision}. Review the changes and sign the current revision.`, linkage.revision);
  const rev = await getRevisionOrThrow(linkage.id, body.revision);
  const hazards = unacknowledgedHazards(reportOf(build, rev), rev.graph, await listAcknowledgements(linkage.id));
  if (hazards.length > 0)
    throw hazardsOpen(
      `${hazards.length} hazard${hazards.length === 1 ? "" : "s"} in revision ${rev.revision} ${hazards.length === 1 ? "has" : "have"} no acknowledgement. Fix ${hazards.length === 1 ? "it" : "them"} or acknowledge with a reason before signing off.`,
      hazards.map((h) => ({ code: h.code, subject: h.subject, subjectName: h.subjectName, message: h.message, lapsed: !!h.lapsed })),
    );
  const signoff = await createSignoff({ buildId: build.id, linkageId: linkage.id, revision: rev.revision, reviewerId: user.id, statement: body.statement, graph: rev.graph });
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
