import { withBuild, parseBody, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { LOG_REF_ERRORS } from "@/lib/log-filter";
import { deleteEntry, getEntry, updateEntry } from "@/db/log";
import { logEntryPatch } from "@/shared/schemas/log";
import { uuidParam } from "@/shared/schemas/common";

type P = { buildId: string; entryId: string };

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
  if (r !== "ok") throw LOG_REF_ERRORS[r];
  return json({ entry: await getEntry(build.id, id) });
});

export const DELETE = withBuild<P>("edit", async ({ user, build, params }) => {
  if (!(await deleteEntry(build.id, parseParams(params.entryId, uuidParam), user.id))) throw notFound("log entry");
  return json({ deleted: true });
});
