import { withLinkage, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { uuidParam } from "@/shared/schemas/common";
import { deleteAcknowledgement } from "@/db/acknowledgements";

type P = { buildId: string; linkageId: string; ackId: string };

/** Withdraw an acknowledgement (the finding counts as open again). */
export const DELETE = withLinkage<P>("acknowledge", async ({ user, build, linkage, params }) => {
  const ackId = parseParams(params.ackId, uuidParam);
  if (!(await deleteAcknowledgement(build.id, linkage.id, ackId, user.id))) throw notFound("acknowledgement");
  return json({ deleted: ackId });
});
