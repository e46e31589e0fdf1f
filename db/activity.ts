import "server-only";
import { db } from "./index";

export async function recentActivity(buildId: string, limit = 10) {
  const rows = await db("audit_events as a")
    .leftJoin("users as u", "u.id", "a.user_id")
    .where("a.build_id", buildId)
    .orderBy("a.created_at", "desc")
    .limit(limit)
    .select("a.id", "a.action", "a.detail", "a.created_at", "u.name as user_name");
  return rows.map((r: { id: string; action: string; detail: Record<string, unknown>; created_at: Date; user_name: string | null }) => ({
    id: String(r.id),
    action: r.action,
    detail: r.detail,
    at: r.created_at.toISOString(),
    who: r.user_name ?? "someone",
  }));
}
