import { withLinkage, parseParams, json, getRevisionOrThrow } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { deleteFileRow, getRevisionPictureRow, setRevisionPicture } from "@/db/files";
import type { Linkage } from "@/db/linkages";
import { audit } from "@/db/audit";
import { revisionQuery } from "@/shared/schemas/common";
import { refuseJsonUpload, streamObject } from "@/lib/records-http";
import { readUpload, removeObjects, storeUpload, PHOTO_MAX_BYTES } from "@/lib/uploads";

type P = { buildId: string; linkageId: string; revision: string };

/** The revision the path names (404 for a malformed or unknown number). */
async function pathRevision(linkage: Linkage, raw: string) {
  return (await getRevisionOrThrow(linkage.id, parseParams(raw, revisionQuery))).revision;
}

/** The stored picture of the revision (PNG from the editor's export). */
export const GET = withLinkage<P>("read", async ({ build, linkage, params }) => {
  const revision = await pathRevision(linkage, params.revision);
  const row = await getRevisionPictureRow(build.id, linkage.id, revision);
  if (!row) throw notFound("picture for this revision");
  return streamObject(row.key, { contentType: row.content_type, name: row.name });
});

/**
 * Store the picture of a revision: the PNG (or JPEG) as the raw request body with
 * `content-type: image/png`, or as multipart/form-data field `file`. A new picture replaces the old one.
 */
export const POST = withLinkage<P>("edit", async ({ req, user, build, linkage, params }) => {
  const revision = await pathRevision(linkage, params.revision);
  await refuseJsonUpload(req);
  const upload = await readUpload(req, PHOTO_MAX_BYTES);
  if (!upload.name) upload.name = `linkage-${linkage.id.slice(0, 8)}-rev${revision}.png`;
  let replaced: string | null = null;
  const file = await storeUpload({
    buildId: build.id, userId: user.id, upload, accept: ["photo"], kind: "linkage-picture",
    attach: async (trx, f) => {
      replaced = await setRevisionPicture(linkage.id, revision, f.id, trx);
      await audit({ buildId: build.id, userId: user.id, action: "linkage.picture", detail: { linkageId: linkage.id, revision, fileId: f.id } }, trx);
    },
  });
  if (replaced) {
    const keys = await deleteFileRow(build.id, replaced);
    if (keys) await removeObjects(keys);
  }
  return json({ picture: file, revision }, 201);
});
