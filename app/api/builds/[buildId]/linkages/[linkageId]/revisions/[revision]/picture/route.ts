import { z } from "zod";
import { withBuild, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { deleteFileRow, getRevisionPictureRow, setRevisionPicture } from "@/db/files";
import { getRevision } from "@/db/linkages";
import { audit } from "@/db/audit";
import { refuseJsonUpload, requireLinkage, streamObject } from "@/lib/records-http";
import { readUpload, removeObjects, storeUpload, PHOTO_MAX_BYTES } from "@/lib/uploads";

type P = { buildId: string; linkageId: string; revision: string };
const revisionParam = z.coerce.number().int().min(1).max(1_000_000);

async function requireRevision(buildId: string, linkageId: string, raw: string) {
  await requireLinkage(buildId, linkageId);
  const revision = parseParams(raw, revisionParam);
  if (!(await getRevision(linkageId, revision))) throw notFound("revision");
  return revision;
}

/** The stored picture of the revision (PNG from the editor's export). */
export const GET = withBuild<P>("read", async ({ build, params }) => {
  const revision = await requireRevision(build.id, params.linkageId, params.revision);
  const row = await getRevisionPictureRow(build.id, params.linkageId, revision);
  if (!row) throw notFound("picture for this revision");
  return streamObject(row.key, { contentType: row.content_type, name: row.name });
});

/**
 * Store the picture of a revision: the PNG (or JPEG) as the raw request body with
 * `content-type: image/png`, or as multipart/form-data field `file`. A new picture replaces the old one.
 */
export const POST = withBuild<P>("edit", async ({ req, user, build, params }) => {
  const revision = await requireRevision(build.id, params.linkageId, params.revision);
  await refuseJsonUpload(req);
  const upload = await readUpload(req, PHOTO_MAX_BYTES);
  if (!upload.name) upload.name = `linkage-${params.linkageId.slice(0, 8)}-rev${revision}.png`;
  let replaced: string | null = null;
  const file = await storeUpload({
    buildId: build.id, userId: user.id, upload, accept: ["photo"], kind: "linkage-picture",
    attach: async (trx, f) => {
      replaced = await setRevisionPicture(params.linkageId, revision, f.id, trx);
      await audit({ buildId: build.id, userId: user.id, action: "linkage.picture", detail: { linkageId: params.linkageId, revision, fileId: f.id } }, trx);
    },
  });
  if (replaced) {
    const keys = await deleteFileRow(build.id, replaced);
    if (keys) await removeObjects(keys);
  }
  return json({ picture: file, revision }, 201);
});
