import { withBuild, parseBody, json } from "@/lib/http";
import { createEntry, getEntry, hourTotals, listEntries } from "@/db/log";
import { logEntryInput } from "@/shared/schemas/log";
import { LOG_REF_ERRORS, readLogFilter } from "@/lib/log-filter";

/** Entries (newest first) and hour totals by system and month, both over the same filter. */
export const GET = withBuild("read", async ({ req, build }) => {
  const f = readLogFilter(req);
  const [entries, totals] = await Promise.all([listEntries(build.id, f), hourTotals(build.id, f)]);
  return json({ entries, totals });
});

export const POST = withBuild("edit", async ({ req, user, build }) => {
  const v = await parseBody(req, logEntryInput);
  const id = await createEntry(build.id, user.id, v);
  if (id === "bad_files" || id === "bad_linkage" || id === "bad_revision") throw LOG_REF_ERRORS[id];
  return json({ entry: await getEntry(build.id, id) }, 201);
});
