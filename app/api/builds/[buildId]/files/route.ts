import { withBuild, json } from "@/lib/http";
import { fieldError } from "@/lib/errors";
import { FILE_KEYS, pageFiles, type FileKind } from "@/db/files";
import { pageBody, readPage } from "@/lib/paging";
import { readUpload, storeUpload } from "@/lib/uploads";
import { refuseJsonUpload } from "@/lib/records-http";

/** A page of the build's uploads, newest first (`?kind=photo|pdf|linkage-picture&cursor=&limit=`), and the total. */
export const GET = withBuild("read", async ({ req, build }) => {
  const k = req.nextUrl.searchParams.get("kind");
  if (k && k !== "photo" && k !== "pdf" && k !== "linkage-picture") throw fieldError("kind", "photo, pdf or linkage-picture", "Unknown kind of file.");
  const p = await pageFiles(build.id, (k || undefined) as FileKind | undefined, readPage(req, FILE_KEYS));
  return json(pageBody("files", p, p.total));
});

/** Upload a photo (JPEG, PNG, WebP; ≤ 10 MB) or a PDF (≤ 20 MB) as multipart/form-data field `file`. */
export const POST = withBuild("edit", async ({ req, user, build }) => {
  await refuseJsonUpload(req);
  const upload = await readUpload(req);
  const file = await storeUpload({ buildId: build.id, userId: user.id, upload, accept: ["photo", "pdf"] });
  return json({ file }, 201);
});
