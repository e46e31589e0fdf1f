import { withBuild, parseBody, parseParams, json } from "@/lib/http";
import { ApiError, notFound } from "@/lib/errors";
import { getFile, linkJointPhoto, listJointPhotos } from "@/db/files";
import { getRevision } from "@/db/linkages";
import { audit } from "@/db/audit";
import { jointPhotoLink } from "@/shared/records-api";
import { jointIdParam, requireLinkage } from "@/lib/records-http";
import { readUpload, storeUpload, PHOTO_MAX_BYTES } from "@/lib/uploads";

type P = { buildId: string; linkageId: string; jointId: string };

/** The joint must be on the current revision of the linkage. */
async function requireJoint(buildId: string, linkageId: string, rawJointId: string) {
  await requireLinkage(buildId, linkageId);
  const jointId = parseParams(rawJointId, jointIdParam);
  const rev = await getRevision(linkageId);
  if (!rev?.graph.joints.some((j) => j.id === jointId)) throw notFound("joint");
  return jointId;
}

/** The photos that show this joint (evidence: witness hole, jam nut, washer), oldest first. */
export const GET = withBuild<P>("read", async ({ build, params }) => {
  const jointId = await requireJoint(build.id, params.linkageId, params.jointId);
  return json({ photos: await listJointPhotos(build.id, params.linkageId, jointId) });
});

/**
 * Attach a photo to the joint: multipart/form-data with the image in `file` (uploaded, thumbnailed and
 * linked in one step), or JSON `{fileId}` to link a photo already uploaded to this build.
 */
export const POST = withBuild<P>("edit", async ({ req, user, build, params }) => {
  await requireLinkage(build.id, params.linkageId);
  parseParams(params.jointId, jointIdParam);
  if ((req.headers.get("content-type") || "").includes("application/json")) {
    const { fileId } = await parseBody(req, jointPhotoLink);
    const jointId = await requireJoint(build.id, params.linkageId, params.jointId);
    const file = await getFile(build.id, fileId);
    if (!file) throw new ApiError(400, "invalid_input", "That file is not one of this build's uploads.", { fileId: "no such file in this build" });
    if (file.kind !== "photo") throw new ApiError(400, "invalid_input", "Only photos attach to a joint.", { fileId: "not a photo" });
    await linkJointPhoto(params.linkageId, jointId, fileId, user.id);
    return json({ photo: { ...file, jointId } }, 201);
  }
  const jointId = await requireJoint(build.id, params.linkageId, params.jointId);
  const upload = await readUpload(req, PHOTO_MAX_BYTES);
  const file = await storeUpload({
    buildId: build.id, userId: user.id, upload, accept: ["photo"],
    attach: async (trx, f) => {
      await linkJointPhoto(params.linkageId, jointId, f.id, user.id, trx);
      await audit({ buildId: build.id, userId: user.id, action: "joint.photo", detail: { linkageId: params.linkageId, jointId, fileId: f.id } }, trx);
    },
  });
  return json({ photo: { ...file, jointId } }, 201);
});
