import { withLinkage, json } from "@/lib/http";
import { pageRevisions, REVISION_KEYS } from "@/db/linkages";
import { pageBody, readPage } from "@/lib/paging";

/** A page of the revision history, newest first (`?cursor=&limit=`): number, author, time and the counts of findings; and the total. */
export const GET = withLinkage("read", async ({ req, linkage }) => {
  const p = await pageRevisions(linkage.id, readPage(req, REVISION_KEYS));
  return json({ currentRevision: linkage.revision, ...pageBody("revisions", p, p.total) });
});
