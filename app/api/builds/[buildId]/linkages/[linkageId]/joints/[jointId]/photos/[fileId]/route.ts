import { withLinkage, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { unlinkJointPhoto } from "@/db/files";
import { uuidParam } from "@/shared/schemas/common";
import { jointIdParam } from "@/lib/records-http";

type P = { buildId: string; linkageId: string; jointId: string; fileId: string };

/** Detach the photo from the joint (the upload itself stays in the build's files). */
export const DELETE = withLinkage<P>("edit", async ({ linkage, params }) => {
  const jointId = parseParams(params.jointId, jointIdParam);
  const fileId = parseParams(params.fileId, uuidParam);
  if (!(await unlinkJointPhoto(linkage.id, jointId, fileId))) throw notFound("photo on this joint");
  return json({ detached: true });
});
