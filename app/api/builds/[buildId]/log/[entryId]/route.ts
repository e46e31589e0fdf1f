import { withBuild, parseBody, parseParams, json } from "@/lib/http";
import { ApiError, notFound } from "@/lib/errors";
import { deleteEntry, getEntry, updateEntry } from "@/db/log";
import { logEntryPatch } from "@/shared/records-api";
import { uuidParam } from "@/shared/api";

type P = { buildId: string; entryId: string };
const REF_ERRORS = {
  bad_files: new ApiError(400, "invalid_input", "Some attached files are not this build's uploads.", { fileIds: "not files of this build" }),
  bad_linkage: new ApiError(400, "invalid_input", "That linkage is not in this build.", { linkageId: "not a linkage of this build" }),
  bad_revision: new ApiError(400, "invalid_input", "That linkage has no such revision.", { revision: "no such revision" }),
};

export const GET = withBuild<P>("read", async ({ build, params }) => {
  const entry = await getEntry(build.id, parseParams(params.entryId, uuidParam));
  if (!entry) throw notFound("log entry");
  return json({ entry });
});

export const PATCH = withBuild<P>("edit", async ({ req, user, build, params }) => {
  const id = parseParams(params.entryId, uuidParam);
  const v = await parseBody(req, logEntryPatch);
  const r = await updateEntry(build.id, id, user.id, v);
  if (r === "missing") throw notFound("log entry");
  if (r !== "ok") throw REF_ERRORS[r];
  return json({ entry: await getEntry(build.id, id) });
});

export const DELETE = withBuild<P>("edit", async ({ user, build, params }) => {
  if (!(await deleteEntry(build.id, parseParams(params.entryId, uuidParam), user.id))) throw notFound("log entry");
  return json({ deleted: true });
});
