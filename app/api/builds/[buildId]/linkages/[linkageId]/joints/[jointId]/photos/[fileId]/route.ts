import { withBuild, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { unlinkJointPhoto } from "@/db/files";
import { uuidParam } from "@/shared/api";
import { jointIdParam, requireLinkage } from "@/lib/records-http";

type P = { buildId: string; linkageId: string; jointId: string; fileId: string };

/** Detach the photo from the joint (the upload itself stays in the build's files). */
export const DELETE = withBuild<P>("edit", async ({ build, params }) => {
  await requireLinkage(build.id, params.linkageId);
  const jointId = parseParams(params.jointId, jointIdParam);
  const fileId = parseParams(params.fileId, uuidParam);
  if (!(await unlinkJointPhoto(params.linkageId, jointId, fileId))) throw notFound("photo on this joint");
  return json({ detached: true });
});
