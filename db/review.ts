import "server-only";
import { db } from "./index";
import { audit } from "./audit";
import type { Subject } from "@/shared/analysis/types";
import type { NotifyPref } from "@/shared/review-api";
import type { Report } from "@/shared/analysis/types";

// ---- comments --------------------------------------------------------------------------------

type CommentRow = {
  id: string;
  build_id: string;
  linkage_id: string;
  subject_type: Subject["type"];
  subject_id: string;
  parent_id: string | null;
  author_id: string | null;
  author_name: string | null;
  body: string;
  revision: number;
  created_at: Date;
  edited_at: Date | null;
  resolved_at: Date | null;
  resolved_by: string | null;
  resolver_name: string | null;
};

const toComment = (r: CommentRow) => ({
  id: r.id,
  linkageId: r.linkage_id,
  subject: { type: r.subject_type, id: r.subject_id } as Subject,
  parentId: r.parent_id,
  author: { id: r.author_id, name: r.author_name ?? "former member" },
  body: r.body,
  revision: r.revision,
  createdAt: r.created_at.toISOString(),
  editedAt: r.edited_at ? r.edited_at.toISOString() : null,
  resolvedAt: r.resolved_at ? r.resolved_at.toISOString() : null,
  resolvedBy: r.resolved_at ? { id: r.resolved_by, name: r.resolver_name ?? "former member" } : null,
});
export type ReviewComment = ReturnType<typeof toComment>;

const commentQuery = () =>
  db("comments as c")
    .leftJoin("users as a", "a.id", "c.author_id")
    .leftJoin("users as r", "r.id", "c.resolved_by")
    .select("c.*", "a.name as author_name", "r.name as resolver_name");

export async function listComments(linkageId: string, subject?: Subject) {
  const q = commentQuery().where("c.linkage_id", linkageId).orderBy("c.created_at", "asc").orderBy("c.id");
  if (subject) q.where({ "c.subject_type": subject.type, "c.subject_id": subject.id });
  return (await q).map(toComment);
}

export async function getComment(linkageId: string, commentId: string) {
  const row = await commentQuery().where({ "c.linkage_id": linkageId, "c.id": commentId }).first();
  return row ? toComment(row) : null;
}

export async function createComment(c: {
  buildId: string;
  linkageId: string;
  subject: Subject;
  parentId: string | null;
  authorId: string;
  body: string;
  revision: number;
}) {
  const id = await db.transaction(async (trx) => {
    const [row] = await trx("comments")
      .insert({
        build_id: c.buildId,
        linkage_id: c.linkageId,
        subject_type: c.subject.type,
        subject_id: c.subject.id,
        parent_id: c.parentId,
        author_id: c.authorId,
        body: c.body,
        revision: c.revision,
      })
      .returning("id");
    // Writing in a thread follows the linkage; a reply reopens nothing by itself.
    await trx("linkage_followers").insert({ linkage_id: c.linkageId, user_id: c.authorId }).onConflict(["linkage_id", "user_id"]).ignore();
    await trx("linkages").where({ id: c.linkageId }).update({ updated_at: trx.fn.now() });
    await audit({ buildId: c.buildId, userId: c.authorId, action: c.parentId ? "comment.reply" : "comment.create", detail: { linkageId: c.linkageId, commentId: row.id, subject: c.subject } }, trx);
    return row.id as string;
  });
  return (await getComment(c.linkageId, id))!;
}

export async function updateCommentBody(buildId: string, linkageId: string, commentId: string, userId: string, body: string) {
  await db("comments").where({ id: commentId, linkage_id: linkageId }).update({ body, edited_at: db.fn.now() });
  await audit({ buildId, userId, action: "comment.edit", detail: { linkageId, commentId } });
  return getComment(linkageId, commentId);
}

export async function setThreadResolved(buildId: string, linkageId: string, rootId: string, userId: string, resolved: boolean) {
  await db("comments")
    .where({ id: rootId, linkage_id: linkageId })
    .update(resolved ? { resolved_at: db.fn.now(), resolved_by: userId } : { resolved_at: null, resolved_by: null });
  await audit({ buildId, userId, action: resolved ? "comment.resolve" : "comment.reopen", detail: { linkageId, commentId: rootId } });
  return getComment(linkageId, rootId);
}

/** Open threads per subject ("joint:j1" → 2). */
export async function unresolvedCounts(linkageId: string): Promise<Record<string, number>> {
  const rows = await db("comments")
    .where({ linkage_id: linkageId })
    .whereNull("parent_id")
    .whereNull("resolved_at")
    .groupBy("subject_type", "subject_id")
    .select("subject_type", "subject_id", db.raw("count(*)::int as n"));
  const out: Record<string, number> = {};
  for (const r of rows as { subject_type: string; subject_id: string; n: number }[]) out[`${r.subject_type}:${r.subject_id}`] = r.n;
  return out;
}

// ---- acknowledgements ------------------------------------------------------------------------

type AckRow = {
  id: string;
  linkage_id: string;
  code: string;
  subject_type: Subject["type"];
  subject_id: string;
  reason: string;
  user_id: string | null;
  user_name: string | null;
  revision: number;
  fingerprint: string;
  created_at: Date;
};
const toAck = (r: AckRow) => ({
  id: r.id,
  code: r.code,
  subject: { type: r.subject_type, id: r.subject_id } as Subject,
  reason: r.reason,
  by: { id: r.user_id, name: r.user_name ?? "former member" },
  revision: r.revision,
  fingerprint: r.fingerprint,
  createdAt: r.created_at.toISOString(),
});
export type Acknowledgement = ReturnType<typeof toAck>;

export async function listAcknowledgements(linkageId: string) {
  const rows = await db("finding_acknowledgements as f")
    .leftJoin("users as u", "u.id", "f.user_id")
    .where("f.linkage_id", linkageId)
    .orderBy("f.created_at", "desc")
    .select("f.*", "u.name as user_name");
  return rows.map(toAck);
}

export async function createAcknowledgement(a: {
  buildId: string;
  linkageId: string;
  code: string;
  subject: Subject;
  reason: string;
  userId: string;
  revision: number;
  fingerprint: string;
}) {
  const [row] = await db("finding_acknowledgements")
    .insert({
      linkage_id: a.linkageId,
      code: a.code,
      subject_type: a.subject.type,
      subject_id: a.subject.id,
      reason: a.reason,
      user_id: a.userId,
      revision: a.revision,
      fingerprint: a.fingerprint,
    })
    .returning("id");
  await audit({ buildId: a.buildId, userId: a.userId, action: "finding.acknowledge", detail: { linkageId: a.linkageId, code: a.code, subject: a.subject } });
  return (await listAcknowledgements(a.linkageId)).find((x) => x.id === row.id)!;
}

export async function deleteAcknowledgement(buildId: string, linkageId: string, ackId: string, userId: string) {
  const n = await db("finding_acknowledgements").where({ id: ackId, linkage_id: linkageId }).del();
  if (n) await audit({ buildId, userId, action: "finding.unacknowledge", detail: { linkageId, ackId } });
  return n > 0;
}

// ---- sign-offs -------------------------------------------------------------------------------

type SignoffRow = { id: string; linkage_id: string; revision: number; reviewer_id: string | null; reviewer_name: string | null; statement: string; created_at: Date };
const toSignoff = (r: SignoffRow, current: number) => ({
  id: r.id,
  revision: r.revision,
  reviewer: { id: r.reviewer_id, name: r.reviewer_name ?? "former member" },
  statement: r.statement,
  createdAt: r.created_at.toISOString(),
  /** A later revision exists: the sign-off no longer covers the linkage as it is. */
  stale: r.revision < current,
});
export type Signoff = ReturnType<typeof toSignoff>;

export async function listSignoffs(linkageId: string, currentRevision: number) {
  const rows = await db("signoffs as s")
    .leftJoin("users as u", "u.id", "s.reviewer_id")
    .where("s.linkage_id", linkageId)
    .orderBy("s.created_at", "desc")
    .orderBy("s.revision", "desc")
    .select("s.*", "u.name as reviewer_name");
  return rows.map((r: SignoffRow) => toSignoff(r, currentRevision));
}

export async function createSignoff(s: { buildId: string; linkageId: string; revision: number; reviewerId: string; statement: string }) {
  const [row] = await db("signoffs").insert({ linkage_id: s.linkageId, revision: s.revision, reviewer_id: s.reviewerId, statement: s.statement }).returning("id");
  await audit({ buildId: s.buildId, userId: s.reviewerId, action: "linkage.signoff", detail: { linkageId: s.linkageId, revision: s.revision } });
  return (await listSignoffs(s.linkageId, s.revision)).find((x) => x.id === row.id)!;
}

/** Sign-offs made stale by `currentRevision` whose owner was not told yet; marks them told (once). */
export async function claimNewlyStaleSignoffs(linkageId: string, currentRevision: number) {
  const rows = await db("signoffs as s")
    .where("s.linkage_id", linkageId)
    .where("s.revision", "<", currentRevision)
    .whereNull("s.stale_notified_at")
    .update({ stale_notified_at: db.fn.now() })
    .returning(["s.id", "s.revision", "s.reviewer_id"]);
  if (rows.length === 0) return [];
  const names = await db("users").whereIn("id", rows.map((r: { reviewer_id: string | null }) => r.reviewer_id).filter(Boolean) as string[]).select("id", "name");
  const byId = new Map(names.map((n: { id: string; name: string }) => [n.id, n.name]));
  return rows.map((r: { id: string; revision: number; reviewer_id: string | null }) => ({ id: r.id, revision: r.revision, reviewerName: (r.reviewer_id && byId.get(r.reviewer_id)) || "a reviewer" }));
}

// ---- revisions -------------------------------------------------------------------------------

export async function listRevisions(linkageId: string) {
  const rows = await db("linkage_revisions as r")
    .leftJoin("users as u", "u.id", "r.author_id")
    .where("r.linkage_id", linkageId)
    .orderBy("r.revision", "desc")
    .select("r.revision", "r.author_id", "u.name as author_name", "r.created_at", db.raw("r.analysis -> 'summary' as summary"));
  return rows.map((r: { revision: number; author_id: string | null; author_name: string | null; created_at: Date; summary: Report["summary"] | null }) => ({
    revision: r.revision,
    author: { id: r.author_id, name: r.author_name ?? "former member" },
    createdAt: r.created_at.toISOString(),
    summary: r.summary ? { hazard: r.summary.hazard, caution: r.summary.caution, advisory: r.summary.advisory } : null,
  }));
}

// ---- who hears about it ----------------------------------------------------------------------

export type Recipient = { id: string; email: string; name: string; notify: NotifyPref; role: string };

/** Followers of the linkage (commenters) and the build's owners, who are still members. */
export async function linkageAudience(buildId: string, linkageId: string): Promise<Recipient[]> {
  return db("memberships as m")
    .join("users as u", "u.id", "m.user_id")
    .where("m.build_id", buildId)
    .where((q) => q.where("m.role", "owner").orWhereExists(db("linkage_followers as f").where("f.linkage_id", linkageId).whereRaw("f.user_id = m.user_id")))
    .select("u.id", "u.email", "u.name", "u.notify", "m.role");
}

export async function buildOwners(buildId: string): Promise<Recipient[]> {
  return db("memberships as m").join("users as u", "u.id", "m.user_id").where({ "m.build_id": buildId, "m.role": "owner" }).select("u.id", "u.email", "u.name", "u.notify", "m.role");
}

export async function getNotify(userId: string): Promise<NotifyPref> {
  const row = await db("users").where({ id: userId }).first("notify");
  return (row?.notify as NotifyPref) ?? "all";
}
export const setNotify = (userId: string, notify: NotifyPref) => db("users").where({ id: userId }).update({ notify });

// ---- the build overview ----------------------------------------------------------------------

/** Per linkage: open threads and the newest sign-off (with whether a later revision made it stale). */
export async function reviewSummaryForBuild(buildId: string) {
  const open = await db("comments as c")
    .join("linkages as l", "l.id", "c.linkage_id")
    .where("l.build_id", buildId)
    .whereNull("c.parent_id")
    .whereNull("c.resolved_at")
    .groupBy("c.linkage_id")
    .select("c.linkage_id", db.raw("count(*)::int as n"));
  const latest = await db("signoffs as s")
    .join("linkages as l", "l.id", "s.linkage_id")
    .leftJoin("users as u", "u.id", "s.reviewer_id")
    .where("l.build_id", buildId)
    .distinctOn("s.linkage_id")
    .orderBy([{ column: "s.linkage_id" }, { column: "s.created_at", order: "desc" }])
    .select("s.linkage_id", "s.revision", "s.created_at", "u.name as reviewer_name", "l.current_revision");
  const out: Record<string, { unresolved: number; signoff: { revision: number; reviewerName: string; at: string; stale: boolean } | null }> = {};
  for (const r of open as { linkage_id: string; n: number }[]) out[r.linkage_id] = { unresolved: r.n, signoff: null };
  for (const r of latest as { linkage_id: string; revision: number; created_at: Date; reviewer_name: string | null; current_revision: number }[]) {
    out[r.linkage_id] ??= { unresolved: 0, signoff: null };
    out[r.linkage_id].signoff = { revision: r.revision, reviewerName: r.reviewer_name ?? "former member", at: r.created_at.toISOString(), stale: r.revision < r.current_revision };
  }
  return out;
}
