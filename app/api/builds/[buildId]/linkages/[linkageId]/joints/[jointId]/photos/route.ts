import { withLinkage, parseBody, parseParams, json } from "@/lib/http";
import { fieldError, notFound } from "@/lib/errors";
import { getFile, linkJointPhoto, listJointPhotos } from "@/db/files";
import type { Revision } from "@/db/linkages";
import { audit } from "@/db/audit";
import { jointPhotoLink } from "@/shared/schemas/files";
import { jointIdParam } from "@/lib/records-http";
import { readUpload, storeUpload, PHOTO_MAX_BYTES } from "@/lib/uploads";

type P = { buildId: string; linkageId: string; jointId: string };

/** The joint must be on the current revision of the linkage. */
function requireJoint(rev: Revision, rawJointId: string) {
  const jointId = parseParams(rawJointId, jointIdParam);
  if (!rev.graph.joints.some((j) => j.id === jointId)) throw notFound("joint");
  return jointId;
}

/** The photos that show this joint (evidence: witness hole, jam nut, washer), oldest first. */
export const GET = withLinkage<P>("read", { revision: "current" }, async ({ build, linkage, revision, params }) => {
  const jointId = requireJoint(revision, params.jointId);
  return json({ photos: await listJointPhotos(build.id, linkage.id, jointId) });
});

/**
 * Attach a photo to the joint: multipart/form-data with the image in `file` (uploaded, thumbnailed and
 * linked in one step), or JSON `{fileId}` to link a photo already uploaded to this build.
 */
export const POST = withLinkage<P>("edit", { revision: "current" }, async ({ req, user, build, linkage, revision, params }) => {
  parseParams(params.jointId, jointIdParam);
  if ((req.headers.get("content-type") || "").includes("application/json")) {
    const { fileId } = await parseBody(req, jointPhotoLink);
    const jointId = requireJoint(revision, params.jointId);
    const file = await getFile(build.id, fileId);
    if (!file) throw fieldError("fileId", "no such file in this build", "That file is not one of this build's uploads.");
    if (file.kind !== "photo") throw fieldError("fileId", "not a photo", "Only photos attach to a joint.");
    await linkJointPhoto(linkage.id, jointId, fileId, user.id);
    return json({ photo: { ...file, jointId } }, 201);
  }
  const jointId = requireJoint(revision, params.jointId);
  const upload = await readUpload(req, PHOTO_MAX_BYTES);
  const file = await storeUpload({
    buildId: build.id, userId: user.id, upload, accept: ["photo"],
    attach: async (trx, f) => {
      await linkJointPhoto(linkage.id, jointId, f.id, user.id, trx);
      await audit({ buildId: build.id, userId: user.id, action: "joint.photo", detail: { linkageId: linkage.id, jointId, fileId: f.id } }, trx);
    },
  });
  return json({ photo: { ...file, jointId } }, 201);
});
