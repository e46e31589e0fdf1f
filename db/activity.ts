import "server-only";
import { db } from "./index";
import { countOf, keysetPage, type Key, type PageArgs } from "./paging";

type ActivityRow = { id: string; action: string; detail: Record<string, unknown>; created_at: Date; user_name: string | null };
const toActivity = (r: ActivityRow) => ({ id: String(r.id), action: r.action, detail: r.detail, at: r.created_at.toISOString(), who: r.user_name ?? "someone" });
export type Activity = ReturnType<typeof toActivity>;

const rowsOf = (buildId: string) => db("audit_events as a").leftJoin("users as u", "u.id", "a.user_id").where("a.build_id", buildId);

export async function recentActivity(buildId: string, limit = 10) {
  const rows = await rowsOf(buildId).orderBy([{ column: "a.created_at", order: "desc" }, { column: "a.id", order: "desc" }]).limit(limit)
    .select("a.id", "a.action", "a.detail", "a.created_at", "u.name as user_name");
  return (rows as ActivityRow[]).map(toActivity);
}

/** The build's activity, newest first (the id breaks ties). */
export const ACTIVITY_KEYS: Key[] = [{ expr: "a.created_at", type: "timestamptz" }, { expr: "a.id", type: "bigint" }];

export async function pageActivity(buildId: string, page: PageArgs) {
  const [p, total] = await Promise.all([
    keysetPage<ActivityRow>(rowsOf(buildId).select("a.id", "a.action", "a.detail", "a.created_at", "u.name as user_name"), ACTIVITY_KEYS, page),
    countOf(db("audit_events as a").where("a.build_id", buildId)),
  ]);
  return { items: p.items.map(toActivity), next: p.next, total };
}
