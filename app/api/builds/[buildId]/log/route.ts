import { withBuild, parseBody, json } from "@/lib/http";
import { ApiError } from "@/lib/errors";
import { createEntry, getEntry, hourTotals, listEntries } from "@/db/log";
import { logEntryInput } from "@/shared/records-api";
import { readLogFilter } from "@/lib/log-filter";

const REF_ERRORS = {
  bad_files: new ApiError(400, "invalid_input", "Some attached files are not this build's uploads.", { fileIds: "not files of this build" }),
  bad_linkage: new ApiError(400, "invalid_input", "That linkage is not in this build.", { linkageId: "not a linkage of this build" }),
  bad_revision: new ApiError(400, "invalid_input", "That linkage has no such revision.", { revision: "no such revision" }),
};

/** Entries (newest first) and hour totals by system and month, both over the same filter. */
export const GET = withBuild("read", async ({ req, build }) => {
  const f = readLogFilter(req);
  const [entries, totals] = await Promise.all([listEntries(build.id, f), hourTotals(build.id, f)]);
  return json({ entries, totals });
});

export const POST = withBuild("edit", async ({ req, user, build }) => {
  const v = await parseBody(req, logEntryInput);
  const id = await createEntry(build.id, user.id, v);
  if (id === "bad_files" || id === "bad_linkage" || id === "bad_revision") throw REF_ERRORS[id];
  return json({ entry: await getEntry(build.id, id) }, 201);
});
