import { withBuild, parseBody, json } from "@/lib/http";
import { createEntry, getEntry, hourTotals, pageEntries, LOG_KEYS } from "@/db/log";
import { pageBody, readPage } from "@/lib/paging";
import { logEntryInput } from "@/shared/schemas/log";
import { LOG_REF_ERRORS, readLogFilter } from "@/lib/log-filter";

/**
 * A page of entries (newest first; `?cursor=&limit=`), how many match in all, and — with the first
 * page — hour totals by system and month over every matching entry.
 */
export const GET = withBuild("read", async ({ req, build }) => {
  const f = readLogFilter(req);
  const page = readPage(req, LOG_KEYS);
  const [p, totals] = await Promise.all([pageEntries(build.id, f, page), page.after ? null : hourTotals(build.id, f)]);
  return json({ ...pageBody("entries", p, p.total), ...(totals ? { totals } : {}) });
});

export const POST = withBuild("edit", async ({ req, user, build }) => {
  const v = await parseBody(req, logEntryInput);
  const id = await createEntry(build.id, user.id, v);
  if (id === "bad_files" || id === "bad_linkage" || id === "bad_revision") throw LOG_REF_ERRORS[id];
  return json({ entry: await getEntry(build.id, id) }, 201);
});
