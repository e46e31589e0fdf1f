import "server-only";
import type { Knex } from "knex";
import { db } from "./index";
import { audit } from "./audit";
import { countOf, keysetPage, type Key, type PageArgs } from "./paging";

import type { FileKind, JointPhoto, StoredFile } from "@/shared/schemas/files";
export type { FileKind, StoredFile };
type FileRow = {
  id: string; build_id: string; key: string; kind: FileKind; content_type: string; size: number; name: string;
  thumb_key: string | null; thumb_size?: number | null; width: number | null; height: number | null; uploaded_by: string | null; created_at: Date;
  uploader_name?: string | null;
};

export const toFile = (r: FileRow): StoredFile => ({
  id: r.id,
  buildId: r.build_id,
  kind: r.kind,
  contentType: r.content_type,
  size: r.size,
  name: r.name,
  hasThumbnail: !!r.thumb_key,
  width: r.width,
  height: r.height,
  uploadedBy: r.uploader_name ?? null,
  createdAt: r.created_at.toISOString(),
  url: `/api/builds/${r.build_id}/files/${r.id}`,
  thumbUrl: r.thumb_key ? `/api/builds/${r.build_id}/files/${r.id}?thumb=1` : null,
});

export async function insertFile(
  f: { id: string; buildId: string; key: string; kind: FileKind; contentType: string; size: number; name: string; thumbKey: string | null; thumbSize?: number | null; width: number | null; height: number | null; uploadedBy: string },
  trx: Knex = db,
  thumbnail?: Buffer | null,
) {
  const [row] = await trx<FileRow>("files")
    .insert({ id: f.id, build_id: f.buildId, key: f.key, kind: f.kind, content_type: f.contentType, size: f.size, name: f.name, thumb_key: f.thumbKey, thumb_size: f.thumbSize ?? null, width: f.width, height: f.height, uploaded_by: f.uploadedBy })
    .returning("*");
  if (thumbnail) await trx("file_thumbnails").insert({ file_id: f.id, bytes: thumbnail });
  return toFile(row);
}

/**
 * The database's copies of these files' thumbnails (JPEG bytes by file id; a file of another build or
 * without a copy is missing from the map). One query for a page of a log PDF's photos.
 */
export async function thumbnailBytes(buildId: string, ids: string[]): Promise<Map<string, Buffer>> {
  if (!ids.length) return new Map();
  const rows: { file_id: string; bytes: Buffer }[] = await db("file_thumbnails as t")
    .join("files as f", "f.id", "t.file_id")
    .where("f.build_id", buildId)
    .whereIn("t.file_id", ids)
    .select("t.file_id", "t.bytes");
  return new Map(rows.map((r) => [r.file_id, r.bytes]));
}

/** Keeps a copy of a thumbnail read from storage (a photo uploaded before the copies were kept). */
export async function keepThumbnail(fileId: string, bytes: Buffer) {
  await db("file_thumbnails").insert({ file_id: fileId, bytes }).onConflict("file_id").ignore();
}

/** The row with its storage keys (server only). */
export async function getFileRow(buildId: string, fileId: string) {
  return db<FileRow>("files").where({ build_id: buildId, id: fileId }).first();
}

export async function getFile(buildId: string, fileId: string) {
  const r = await getFileRow(buildId, fileId);
  return r ? toFile(r) : null;
}

const withUploader = () => db("files as f").leftJoin("users as u", "u.id", "f.uploaded_by").select("f.*", "u.name as uploader_name");

/** Uploads, newest first (the id breaks ties). */
export const FILE_KEYS: Key[] = [{ expr: "f.created_at", type: "timestamptz" }, { expr: "f.id", type: "uuid" }];

/** One page of the build's uploads (newest first) and how many there are in all. */
export async function pageFiles(buildId: string, kind: FileKind | undefined, page: PageArgs) {
  const q = () => {
    const b = db("files as f").where("f.build_id", buildId);
    if (kind) b.where("f.kind", kind);
    return b;
  };
  const [p, total] = await Promise.all([
    keysetPage<FileRow>(q().leftJoin("users as u", "u.id", "f.uploaded_by").select("f.*", "u.name as uploader_name"), FILE_KEYS, page),
    countOf(q()),
  ]);
  return { items: p.items.map(toFile), next: p.next, total };
}

export async function filesByIds(buildId: string, ids: string[]) {
  if (!ids.length) return [];
  const rows = await withUploader().where("f.build_id", buildId).whereIn("f.id", ids);
  const byId = new Map(rows.map((r: FileRow) => [r.id, toFile(r)]));
  return ids.map((id) => byId.get(id)).filter(Boolean) as StoredFile[];
}

/** Deletes the row (links cascade) and returns the storage keys to delete. */
export async function deleteFileRow(buildId: string, fileId: string, trx: Knex = db) {
  const [row] = await trx<FileRow>("files").where({ build_id: buildId, id: fileId }).del().returning(["key", "thumb_key"]);
  return row ? { key: row.key, thumbKey: row.thumb_key } : null;
}

/** A member deletes a file: the row (and every link to it) and its audit event in one transaction; the objects are the caller's to remove after. */
export async function deleteFile(buildId: string, fileId: string, userId: string) {
  return db.transaction(async (trx) => {
    const keys = await deleteFileRow(buildId, fileId, trx);
    if (keys) await audit({ buildId, userId, action: "file.delete", detail: { fileId } }, trx);
    return keys;
  });
}

// ---- joint photos ---------------------------------------------------------------------------

export async function linkJointPhoto(linkageId: string, jointId: string, fileId: string, userId: string, trx: Knex = db) {
  await trx("joint_photos").insert({ linkage_id: linkageId, joint_id: jointId, file_id: fileId, added_by: userId }).onConflict(["linkage_id", "joint_id", "file_id"]).ignore();
}

export async function unlinkJointPhoto(linkageId: string, jointId: string, fileId: string) {
  return (await db("joint_photos").where({ linkage_id: linkageId, joint_id: jointId, file_id: fileId }).del()) > 0;
}

export async function listJointPhotos(buildId: string, linkageId: string, jointId?: string) {
  const q = withUploader().join("joint_photos as jp", "jp.file_id", "f.id").where({ "f.build_id": buildId, "jp.linkage_id": linkageId }).select("jp.joint_id").orderBy("jp.created_at");
  if (jointId !== undefined) q.where("jp.joint_id", jointId);
  const rows = await q;
  return rows.map((r: FileRow & { joint_id: string }): JointPhoto => ({ ...toFile(r), jointId: r.joint_id }));
}

// ---- revision pictures ----------------------------------------------------------------------

/** Sets the picture of a revision; returns the file it replaced (to delete), if any. */
export async function setRevisionPicture(linkageId: string, revision: number, fileId: string, trx: Knex = db) {
  const old = await trx("revision_pictures").where({ linkage_id: linkageId, revision }).first<{ file_id: string } | undefined>("file_id");
  await trx("revision_pictures").insert({ linkage_id: linkageId, revision, file_id: fileId }).onConflict(["linkage_id", "revision"]).merge({ file_id: fileId, created_at: trx.fn.now() });
  return old?.file_id && old.file_id !== fileId ? old.file_id : null;
}

export async function getRevisionPicture(buildId: string, linkageId: string, revision: number) {
  const row = await withUploader().join("revision_pictures as rp", "rp.file_id", "f.id").where({ "f.build_id": buildId, "rp.linkage_id": linkageId, "rp.revision": revision }).first();
  return row ? toFile(row as FileRow) : null;
}

export async function getRevisionPictureRow(buildId: string, linkageId: string, revision: number) {
  return db("files as f").join("revision_pictures as rp", "rp.file_id", "f.id").where({ "f.build_id": buildId, "rp.linkage_id": linkageId, "rp.revision": revision }).first<FileRow | undefined>("f.*");
}

/** Storage keys of files (server only: for embedding in PDFs; a photo's thumbnail key when it has one). */
export async function fileKeys(buildId: string, ids: string[]) {
  if (!ids.length) return new Map<string, { key: string; thumbKey: string | null; contentType: string; kind: FileKind }>();
  const rows = await db<FileRow>("files").where("build_id", buildId).whereIn("id", ids).select("id", "key", "thumb_key", "content_type", "kind");
  return new Map(rows.map((r) => [r.id, { key: r.key, thumbKey: r.thumb_key, contentType: r.content_type, kind: r.kind }]));
}

export const countFiles = (buildId: string) => countOf(db("files as f").where("f.build_id", buildId));

/** Every stored file of a build, oldest first, a page at a time (the whole-build archive reads them all). */
export async function* eachFileOldestFirst(buildId: string, pageSize = 200) {
  let after: string[] | null = null;
  for (;;) {
    const p: { items: FileRow[]; next: string[] | null } = await keysetPage<FileRow>(db("files as f").where("f.build_id", buildId).select("f.id", "f.key", "f.name", "f.created_at"), FILE_KEYS, { limit: pageSize, after }, "asc");
    if (p.items.length) yield p.items;
    if (!p.next) return;
    after = p.next;
  }
}
