import { withBuild, json } from "@/lib/http";
import { ACTIVITY_KEYS, pageActivity } from "@/db/activity";
import { pageBody, readPage } from "@/lib/paging";

/** A page of the build's activity, newest first (`?cursor=&limit=`), and how many events there are. */
export const GET = withBuild("read", async ({ req, build }) => {
  const p = await pageActivity(build.id, readPage(req, ACTIVITY_KEYS));
  return json(pageBody("activity", p, p.total));
});
