/** Uploaded files of a build (photos, PDFs, linkage pictures) and photos tied to a joint. */
import { z } from "zod";
import { isoTime, pageFields } from "./common";

export const FILE_KINDS = ["photo", "pdf", "linkage-picture"] as const;
export type FileKind = (typeof FILE_KINDS)[number];

export const storedFile = z.object({
  id: z.string(),
  buildId: z.string(),
  kind: z.enum(FILE_KINDS),
  contentType: z.string(),
  size: z.number().int(),
  name: z.string(),
  hasThumbnail: z.boolean(),
  width: z.number().int().nullable(),
  height: z.number().int().nullable(),
  /** The uploader's name (null once the account is gone). */
  uploadedBy: z.string().nullable(),
  createdAt: isoTime,
  url: z.string(),
  thumbUrl: z.string().nullable(),
});
export type StoredFile = z.infer<typeof storedFile>;
/** A page of the build's uploads, newest first. */
export const filesResponse = z.object({ files: z.array(storedFile), ...pageFields });
export const fileResponse = z.object({ file: storedFile });

/** Link a photo already uploaded to the build to a joint. */
export const jointPhotoLink = z.object({ fileId: z.string({ error: "fileId is required" }).uuid("fileId must be a file id") });
export const jointPhoto = storedFile.extend({ jointId: z.string() });
export type JointPhoto = z.infer<typeof jointPhoto>;
export const jointPhotosResponse = z.object({ photos: z.array(jointPhoto) });
