import "server-only";
import { db } from "./index";
import { toBuild, type Build, type BuildRow } from "./builds";
import { storedRevision, toLinkage, type Linkage, type LinkageRow, type Revision, type StoredRevisionRow } from "./linkages";
import type { UserRow } from "./users";
import { revisionContent } from "./revision-content";
import type { Role } from "@/shared/roles";

/** The columns of the user a request acts as (never the password hash). */
export type AccessUser = Pick<UserRow, "id" | "email" | "name" | "session_version" | "is_site_admin" | "unit_system">;
export type Access = {
  user: AccessUser;
  /** The build and the user's role in it; null when not a member (or no build was asked for). */
  member: { role: Role; build: Build } | null;
  /** The linkage asked for, when it is in that build and the user is a member; null otherwise. */
  linkage: Linkage | null;
  /** The revision asked for (see getAccess), when the linkage is there and has it; null otherwise. */
  revision: Revision | null;
};

const BUILD_COLS = ["id", "name", "model", "registration", "analysis_settings", "created_by", "created_at", "updated_at"] as const;
const LINKAGE_COLS = ["id", "build_id", "name", "system", "current_revision", "created_at", "updated_at"] as const;

/**
 * The query's text for each depth (user; + build; + linkage; + revision): fixed texts, each a named prepared
 * statement, so PostgreSQL parses and plans it once per connection instead of on every request.
 */
const DEPTHS = ["user", "build", "linkage", "revision"] as const;
type Depth = (typeof DEPTHS)[number];
const SQL: Record<Depth, string> = Object.fromEntries(DEPTHS.map((depth, i) => {
  const cols = ["u.id", "u.email", "u.name", "u.session_version", "u.is_site_admin", "u.unit_system"];
  const joins: string[] = [];
  if (i >= 1) {
    cols.push("m.role", ...BUILD_COLS.map((c) => `b.${c} as b_${c}`));
    joins.push("left join memberships m on m.user_id = u.id and m.build_id = ?::uuid", "left join builds b on b.id = m.build_id");
  }
  if (i >= 2) {
    cols.push(...LINKAGE_COLS.map((c) => `l.${c} as l_${c}`));
    joins.push("left join linkages l on l.id = ?::uuid and l.build_id = b.id");
  }
  if (i >= 3) {
    // The requested revision, or the linkage's current one when none is asked for: its content id, not its text
    // (graph and report come from db/revision-content.ts, cached under that id, and are sent on unparsed).
    cols.push("r.id as r_id", "r.content_id as r_content_id", "r.revision as r_revision", "r.author_id as r_author_id", "ra.name as r_author_name", "r.created_at as r_created_at");
    joins.push("left join linkage_revisions r on r.linkage_id = l.id and r.revision = coalesce(?::int, l.current_revision)", "left join users ra on ra.id = r.author_id");
  }
  return [depth, `select ${cols.join(", ")} from users u ${joins.join(" ")} where u.id = ? limit 1`];
})) as Record<Depth, string>;

/**
 * What a request needs before its route runs, in one round trip: the user (with the session version its cookie
 * must match), their membership of `buildId` with the build, the linkage `linkageId` of that build and, when
 * `revision` is given, that revision of it ("current": the linkage's current one). Ids must be well-formed
 * uuids (the caller checks; a malformed one is passed as undefined). Null when the user no longer exists.
 */
export async function getAccess(userId: string, buildId?: string, linkageId?: string, revision?: number | "current"): Promise<Access | null> {
  const depth: Depth = !buildId ? "user" : !linkageId ? "build" : revision === undefined ? "linkage" : "revision";
  const bindings: (string | number | null)[] = [];
  if (depth !== "user") bindings.push(buildId!);
  if (depth === "linkage" || depth === "revision") bindings.push(linkageId!);
  if (depth === "revision") bindings.push(revision === "current" ? null : revision!);
  bindings.push(userId);
  const { rows } = await db.raw(SQL[depth], bindings).options({ name: `lw_access_${depth}` });
  const row = rows[0] as Record<string, unknown> | undefined;
  if (!row) return null;
  const pick = (prefix: string, cols: readonly string[]) => Object.fromEntries(cols.map((c) => [c, row[`${prefix}${c}`]]));
  const content = row.l_id && row.r_revision != null ? await revisionContent({ id: row.r_id as string, linkageId: row.l_id as string, revision: row.r_revision as number, contentId: row.r_content_id as string }) : null;
  return {
    user: { id: row.id, email: row.email, name: row.name, session_version: row.session_version, is_site_admin: row.is_site_admin, unit_system: row.unit_system } as AccessUser,
    member: row.b_id ? { role: row.role as Role, build: toBuild(pick("b_", BUILD_COLS) as BuildRow) } : null,
    linkage: row.l_id ? toLinkage(pick("l_", LINKAGE_COLS) as LinkageRow) : null,
    revision: content
      ? storedRevision({ revision: row.r_revision, ...content, author_id: row.r_author_id, author_name: row.r_author_name, created_at: row.r_created_at } as StoredRevisionRow)
      : null,
  };
}
