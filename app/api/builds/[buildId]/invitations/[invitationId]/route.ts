import { withBuild, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { uuidParam } from "@/shared/schemas/common";
import { revokeInvitation } from "@/db/builds";

type P = { buildId: string; invitationId: string };

export const DELETE = withBuild<P>("manage", async ({ build, params }) => {
  const id = parseParams(params.invitationId, uuidParam);
  if (!(await revokeInvitation(build.id, id))) throw notFound("open invitation");
  return json({ revoked: id });
});
