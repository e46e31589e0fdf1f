import "server-only";
import { createHash, randomBytes } from "node:crypto";
import type { Knex } from "knex";
import { db } from "./index";
import { audit } from "./audit";
import { refreshCurrentAnalyses } from "./linkages";
import type { LinkageGraph } from "@/shared/linkage/schema";
import type { Report } from "@/shared/analysis/types";
import type { Role } from "@/shared/roles";
import type { Build, BuildListItem } from "@/shared/schemas/builds";
import type { Invitation, Member } from "@/shared/schemas/members";
import type { Recipient } from "./users";

export type BuildRow = {
  id: string;
  name: string;
  model: string;
  registration: string | null;
  analysis_settings: Record<string, unknown>;
  created_by: string | null;
  created_at: Date;
  updated_at: Date;
};

export const toBuild = (b: BuildRow): Build => ({
  id: b.id,
  name: b.name,
  model: b.model,
  registration: b.registration,
  analysisSettings: b.analysis_settings,
  createdAt: b.created_at.toISOString(),
  updatedAt: b.updated_at.toISOString(),
});
export type { Build };

export async function listBuildsForUser(userId: string) {
  const rows = await db("memberships as m")
    .join("builds as b", "b.id", "m.build_id")
    .where("m.user_id", userId)
    .select(
      "b.*",
      "m.role",
      db.raw("(select count(*)::int from linkages l where l.build_id = b.id) as linkage_count"),
      db.raw("(select count(*)::int from memberships mm where mm.build_id = b.id) as member_count"),
    )
    .orderBy("b.updated_at", "desc");
  return rows.map((r: BuildRow & { role: Role; linkage_count: number; member_count: number }): BuildListItem => ({
    ...toBuild(r),
    role: r.role,
    linkageCount: r.linkage_count,
    memberCount: r.member_count,
  }));
}

export async function createBuild(userId: string, b: { name: string; model: string; registration?: string | null }) {
  return db.transaction(async (trx) => {
    const [row] = await trx<BuildRow>("builds")
      .insert({ name: b.name, model: b.model, registration: b.registration || null, created_by: userId })
      .returning("*");
    await trx("memberships").insert({ build_id: row.id, user_id: userId, role: "owner" });
    await audit({ buildId: row.id, userId, action: "build.create", detail: { name: b.name } }, trx);
    return toBuild(row);
  });
}

/**
 * Updates the build. With `reanalyze`, the stored analysis of every linkage's current revision is
 * computed again in the same transaction (new settings and their results land together or not at all).
 */
export async function updateBuild(
  buildId: string,
  userId: string,
  patch: Partial<{ name: string; model: string; registration: string | null; analysisSettings: Record<string, unknown> }>,
  reanalyze?: (graph: LinkageGraph) => Report,
) {
  return db.transaction(async (trx) => {
    const build = await updateBuildIn(trx, buildId, userId, patch);
    if (reanalyze) await refreshCurrentAnalyses(buildId, reanalyze, trx);
    return build;
  });
}

async function updateBuildIn(trx: Knex, buildId: string, userId: string, patch: Parameters<typeof updateBuild>[2]) {
  const values: Record<string, unknown> = { updated_at: trx.fn.now() };
  if (patch.name !== undefined) values.name = patch.name;
  if (patch.model !== undefined) values.model = patch.model;
  if (patch.registration !== undefined) values.registration = patch.registration || null;
  if (patch.analysisSettings !== undefined) values.analysis_settings = JSON.stringify(patch.analysisSettings);
  const [row] = await trx<BuildRow>("builds").where({ id: buildId }).update(values).returning("*");
  await audit({ buildId, userId, action: "build.update", detail: { fields: Object.keys(patch) } }, trx);
  return toBuild(row);
}

/**
 * Deletes the build and everything in it but its audit events, and records who deleted it (same transaction);
 * returns the storage keys of its files, for the caller to remove.
 */
export async function deleteBuild(buildId: string, userId: string): Promise<string[]> {
  return db.transaction(async (trx) => {
    const files = await trx("files").where({ build_id: buildId }).select("key", "thumb_key");
    const b = await trx("builds").where({ id: buildId }).first("name", "model", "registration");
    await trx("builds").where({ id: buildId }).del();
    await audit({ buildId, userId, action: "build.delete", detail: { name: b?.name ?? null, model: b?.model ?? null, registration: b?.registration ?? null, files: files.length } }, trx);
    return files.flatMap((f: { key: string; thumb_key: string | null }) => (f.thumb_key ? [f.key, f.thumb_key] : [f.key]));
  });
}

export async function listMembers(buildId: string) {
  const rows = await db("memberships as m")
    .join("users as u", "u.id", "m.user_id")
    .where("m.build_id", buildId)
    .select("u.id", "u.name", "u.email", "m.role", "m.created_at")
    .orderByRaw("case m.role when 'owner' then 0 when 'builder' then 1 when 'reviewer' then 2 else 3 end, u.name");
  return rows.map((r: { id: string; name: string; email: string; role: Role; created_at: Date }): Member => ({
    userId: r.id,
    name: r.name,
    email: r.email,
    role: r.role,
    since: r.created_at.toISOString(),
  }));
}

export async function addMember(buildId: string, userId: string, role: Role, byUserId: string) {
  await db.transaction(async (trx) => {
    await trx("memberships").insert({ build_id: buildId, user_id: userId, role }).onConflict(["build_id", "user_id"]).merge({ role });
    await audit({ buildId, userId: byUserId, action: "member.add", detail: { userId, role } }, trx);
  });
}

/**
 * The build's owners, their rows locked until the transaction ends: two owners demoting or removing
 * each other at the same moment are taken one after the other, so the second sees the first's change.
 */
async function lockOwners(trx: Knex.Transaction, buildId: string) {
  return (await trx("memberships").where({ build_id: buildId, role: "owner" }).orderBy("user_id").forUpdate().select("user_id")).length;
}

/** Returns "last_owner" when the change would leave the build without an owner. */
export async function setMemberRole(buildId: string, userId: string, role: Role, byUserId: string) {
  return db.transaction(async (trx) => {
    const owners = await lockOwners(trx, buildId);
    const current = await trx("memberships").where({ build_id: buildId, user_id: userId }).first<{ role: Role } | undefined>();
    if (!current) return "missing" as const;
    if (current.role === "owner" && role !== "owner" && owners <= 1) return "last_owner" as const;
    await trx("memberships").where({ build_id: buildId, user_id: userId }).update({ role });
    await audit({ buildId, userId: byUserId, action: "member.role", detail: { userId, role } }, trx);
    return "ok" as const;
  });
}

export async function removeMember(buildId: string, userId: string, byUserId: string) {
  return db.transaction(async (trx) => {
    const owners = await lockOwners(trx, buildId);
    const current = await trx("memberships").where({ build_id: buildId, user_id: userId }).first<{ role: Role } | undefined>();
    if (!current) return "missing" as const;
    if (current.role === "owner" && owners <= 1) return "last_owner" as const;
    await trx("memberships").where({ build_id: buildId, user_id: userId }).del();
    await audit({ buildId, userId: byUserId, action: "member.remove", detail: { userId } }, trx);
    return "ok" as const;
  });
}

// ---- invitations ----------------------------------------------------------------------------

export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");
const INVITE_DAYS = 14;

export async function createInvitation(buildId: string, email: string, role: Role, byUserId: string) {
  const token = randomBytes(24).toString("base64url");
  const row = await db.transaction(async (trx) => {
    const [r] = await trx("invitations")
      .insert({
        build_id: buildId,
        email: email.trim(),
        role,
        token_hash: hashToken(token),
        expires_at: trx.raw(`now() + interval '${INVITE_DAYS} days'`),
        invited_by: byUserId,
      })
      .returning(["id", "email", "role", "expires_at", "created_at"]);
    await audit({ buildId, userId: byUserId, action: "invitation.create", detail: { email, role } }, trx);
    return r;
  });
  return { token, invitation: toInvitation(row) };
}

type InvitationRow = { id: string; email: string; role: Role; expires_at: Date; created_at: Date; accepted_at?: Date | null };
const toInvitation = (r: InvitationRow): Invitation => ({
  id: r.id,
  email: r.email,
  role: r.role,
  expiresAt: r.expires_at.toISOString(),
  createdAt: r.created_at.toISOString(),
  acceptedAt: r.accepted_at ? r.accepted_at.toISOString() : null,
});

export async function listInvitations(buildId: string) {
  const rows = await db("invitations").where({ build_id: buildId }).orderBy("created_at", "desc");
  return rows.map(toInvitation);
}

export const revokeInvitation = (buildId: string, id: string) => db("invitations").where({ build_id: buildId, id }).whereNull("accepted_at").del();

/** Looks up an invitation by its token (for the invite page). */
export async function findInvitation(token: string) {
  return db("invitations as i")
    .join("builds as b", "b.id", "i.build_id")
    .where("i.token_hash", hashToken(token))
    .first<{ id: string; build_id: string; build_name: string; email: string; role: Role; expires_at: Date; accepted_at: Date | null } | undefined>(
      "i.id", "i.build_id", "b.name as build_name", "i.email", "i.role", "i.expires_at", "i.accepted_at",
    );
}

/** Single use: the update only succeeds while the invitation is open and unexpired. */
/**
 * Accepts an open invitation for the signed-in user — only the account whose e-mail it was sent to; a link
 * forwarded to (or intercepted by) someone else is refused and stays open for the invited person.
 * Returns the membership, "wrongAccount" (with the address it was sent to), or null (used, expired, withdrawn).
 */
export async function acceptInvitation(token: string, userId: string, userEmail: string): Promise<{ buildId: string; role: Role } | { wrongAccount: string } | null> {
  return db.transaction(async (trx) => {
    const [inv] = await trx("invitations")
      .where("token_hash", hashToken(token))
      .whereNull("accepted_at")
      .where("expires_at", ">", trx.fn.now())
      .whereRaw("lower(email) = lower(?)", [userEmail])
      .update({ accepted_at: trx.fn.now(), accepted_by: userId })
      .returning(["build_id", "role"]);
    if (!inv) {
      const open = await trx("invitations").where("token_hash", hashToken(token)).whereNull("accepted_at").where("expires_at", ">", trx.fn.now()).first("email");
      return open ? { wrongAccount: open.email as string } : null;
    }
    const existing = await trx("memberships").where({ build_id: inv.build_id, user_id: userId }).first();
    if (!existing) await trx("memberships").insert({ build_id: inv.build_id, user_id: userId, role: inv.role });
    await audit({ buildId: inv.build_id, userId, action: "invitation.accept", detail: { role: inv.role } }, trx);
    return { buildId: inv.build_id as string, role: (existing?.role ?? inv.role) as Role };
  });
}

/** The owners of a build, who hear about sign-offs and stale ones. */
export async function buildOwners(buildId: string): Promise<Recipient[]> {
  return db("memberships as m").join("users as u", "u.id", "m.user_id").where({ "m.build_id": buildId, "m.role": "owner" }).select("u.id", "u.email", "u.name", "u.notify", "m.role");
}
