import { withLinkage, parseBody, json } from "@/lib/http";
import { fieldError } from "@/lib/errors";
import { acknowledgementCreate } from "@/shared/schemas/acknowledgements";
import { createAcknowledgement, listAcknowledgements } from "@/db/acknowledgements";
import { reportOf } from "@/lib/review";
import { fingerprint } from "@/shared/review/fingerprint";
import { ackFor, findingStates } from "@/shared/review/hazards";

/** The findings of the current revision with the acknowledgement that covers each, and every acknowledgement ever written. */
export const GET = withLinkage("read", { revision: "current" }, async ({ build, linkage, revision: rev }) => {
  const acks = await listAcknowledgements(linkage.id);
  const findings = findingStates(reportOf(build, rev), rev.graph, acks);
  const withStatus = acks.map((a) => {
    const { active } = ackFor(a, rev.graph, acks);
    return { ...a, status: active?.id === a.id ? ("active" as const) : ("lapsed" as const) };
  });
  return json({ revision: rev.revision, findings, acknowledgements: withStatus });
});

/** A reviewer or the owner acknowledges a finding of the current revision, with a reason. */
export const POST = withLinkage("acknowledge", { revision: "current" }, async ({ req, user, build, linkage, revision: rev }) => {
  const body = await parseBody(req, acknowledgementCreate);
  const finding = reportOf(build, rev).findings.find((f) => f.code === body.code && f.subject.type === body.subject.type && f.subject.id === body.subject.id);
  if (!finding) throw fieldError("code", `That finding is not on that part or joint in revision ${rev.revision} (it may have been fixed); reload to see the current findings.`);
  const acknowledgement = await createAcknowledgement({
    buildId: build.id,
    linkageId: linkage.id,
    code: body.code,
    subject: body.subject,
    reason: body.reason,
    userId: user.id,
    revision: rev.revision,
    fingerprint: fingerprint(rev.graph, body.subject)!,
  });
  return json({ acknowledgement: { ...acknowledgement, status: "active" } }, 201);
});
