import { withBuild, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { deleteFile, getFileRow } from "@/db/files";
import { uuidParam } from "@/shared/schemas/common";
import { streamObject } from "@/lib/records-http";
import { removeObjects } from "@/lib/uploads";

type P = { buildId: string; fileId: string };

/** The file's bytes (or `?thumb=1` its thumbnail), streamed to members only. */
export const GET = withBuild<P>("read", async ({ req, build, params }) => {
  const id = parseParams(params.fileId, uuidParam);
  const row = await getFileRow(build.id, id);
  if (!row) throw notFound("file");
  const thumb = req.nextUrl.searchParams.get("thumb") === "1";
  if (thumb && !row.thumb_key) throw notFound("thumbnail");
  return thumb
    ? streamObject(row.thumb_key!, { contentType: "image/jpeg", name: `thumb-${row.name.replace(/\.[^.]+$/, "")}.jpg` })
    : streamObject(row.key, { contentType: row.content_type, name: row.name, download: req.nextUrl.searchParams.get("download") === "1" });
});

/** Deletes the file, its thumbnail and every link to it (joints, log entries, revision pictures). */
export const DELETE = withBuild<P>("edit", async ({ user, build, params }) => {
  const id = parseParams(params.fileId, uuidParam);
  const keys = await deleteFile(build.id, id, user.id);
  if (!keys) throw notFound("file");
  // After the row is gone for good: a failed delete leaves the file whole.
  await removeObjects(keys);
  return json({ deleted: true });
});
