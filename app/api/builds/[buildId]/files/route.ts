import { withBuild, json } from "@/lib/http";
import { listFiles, type FileKind } from "@/db/files";
import { readUpload, storeUpload } from "@/lib/uploads";
import { refuseJsonUpload } from "@/lib/records-http";

/** The build's uploads, newest first (`?kind=photo|pdf|linkage-picture`). */
export const GET = withBuild("read", async ({ req, build }) => {
  const k = req.nextUrl.searchParams.get("kind");
  const kind = k === "photo" || k === "pdf" || k === "linkage-picture" ? (k as FileKind) : undefined;
  return json({ files: await listFiles(build.id, kind) });
});

/** Upload a photo (JPEG, PNG, WebP; ≤ 10 MB) or a PDF (≤ 20 MB) as multipart/form-data field `file`. */
export const POST = withBuild("edit", async ({ req, user, build }) => {
  await refuseJsonUpload(req);
  const upload = await readUpload(req);
  const file = await storeUpload({ buildId: build.id, userId: user.id, upload, accept: ["photo", "pdf"] });
  return json({ file }, 201);
});
