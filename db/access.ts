import "server-only";
import { db } from "./index";
import { toBuild, type Build, type BuildRow } from "./builds";
import { toLinkage, type Linkage, type LinkageRow } from "./linkages";
import type { UserRow } from "./users";
import type { Role } from "@/shared/roles";

/** The columns of the user a request acts as (never the password hash). */
export type AccessUser = Pick<UserRow, "id" | "email" | "name" | "session_version" | "is_site_admin" | "unit_system">;
export type Access = {
  user: AccessUser;
  /** The build and the user's role in it; null when not a member (or no build was asked for). */
  member: { role: Role; build: Build } | null;
  /** The linkage asked for, when it is in that build and the user is a member; null otherwise. */
  linkage: Linkage | null;
};

const BUILD_COLS = ["id", "name", "model", "registration", "analysis_settings", "created_by", "created_at", "updated_at"] as const;
const LINKAGE_COLS = ["id", "build_id", "name", "system", "current_revision", "created_at", "updated_at"] as const;

/**
 * What a request needs before its route runs, in one round trip: the user (with the session version its cookie
 * must match), their membership of `buildId` with the build, and the linkage `linkageId` of that build. Ids
 * must be well-formed uuids (the caller checks; a malformed one is passed as undefined). Null when the user
 * no longer exists.
 */
export async function getAccess(userId: string, buildId?: string, linkageId?: string): Promise<Access | null> {
  const q = db("users as u").where("u.id", userId).select("u.id", "u.email", "u.name", "u.session_version", "u.is_site_admin", "u.unit_system");
  if (buildId) {
    q.leftJoin("memberships as m", function () {
      this.on("m.user_id", "u.id").andOn("m.build_id", db.raw("?::uuid", [buildId]));
    })
      .leftJoin("builds as b", "b.id", "m.build_id")
      .select("m.role", ...BUILD_COLS.map((c) => `b.${c} as b_${c}`));
    if (linkageId) {
      q.leftJoin("linkages as l", function () {
        this.on("l.id", db.raw("?::uuid", [linkageId])).andOn("l.build_id", "b.id");
      }).select(...LINKAGE_COLS.map((c) => `l.${c} as l_${c}`));
    }
  }
  const row: Record<string, unknown> | undefined = await q.first();
  if (!row) return null;
  const pick = (prefix: string, cols: readonly string[]) => Object.fromEntries(cols.map((c) => [c, row[`${prefix}${c}`]]));
  return {
    user: { id: row.id, email: row.email, name: row.name, session_version: row.session_version, is_site_admin: row.is_site_admin, unit_system: row.unit_system } as AccessUser,
    member: row.b_id ? { role: row.role as Role, build: toBuild(pick("b_", BUILD_COLS) as BuildRow) } : null,
    linkage: row.l_id ? toLinkage(pick("l_", LINKAGE_COLS) as LinkageRow) : null,
  };
}
