import "server-only";
/** Review comments: threads on a subject, replies, resolve; and who follows a linkage (its commenters). */
import { db } from "./index";
import { audit } from "./audit";
import { person } from "./people";
import { countOf, keysetPage, type Key, type PageArgs } from "./paging";
import type { Recipient } from "./users";
import type { Subject } from "@/shared/schemas/common";
import type { Comment } from "@/shared/schemas/comments";

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

const toComment = (r: CommentRow): Comment => ({
  id: r.id,
  linkageId: r.linkage_id,
  subject: { type: r.subject_type, id: r.subject_id },
  parentId: r.parent_id,
  author: person(r.author_id, r.author_name),
  body: r.body,
  revision: r.revision,
  createdAt: r.created_at.toISOString(),
  editedAt: r.edited_at ? r.edited_at.toISOString() : null,
  resolvedAt: r.resolved_at ? r.resolved_at.toISOString() : null,
  resolvedBy: r.resolved_at ? person(r.resolved_by, r.resolver_name) : null,
});

const commentQuery = () =>
  db("comments as c")
    .leftJoin("users as a", "a.id", "c.author_id")
    .leftJoin("users as r", "r.id", "c.resolved_by")
    .select("c.*", "a.name as author_name", "r.name as resolver_name");

/** Threads newest first (by their first comment; the id breaks ties). */
export const THREAD_KEYS: Key[] = [{ expr: "c.created_at", type: "timestamptz" }, { expr: "c.id", type: "uuid" }];

/**
 * One page of threads of the linkage (or of one subject), newest first, each with all its replies
 * (oldest first), and how many threads there are in all.
 */
export async function pageThreads(linkageId: string, subject: Subject | undefined, page: PageArgs) {
  const roots = () => {
    const q = db("comments as c").where("c.linkage_id", linkageId).whereNull("c.parent_id");
    if (subject) q.where({ "c.subject_type": subject.type, "c.subject_id": subject.id });
    return q;
  };
  const [p, total] = await Promise.all([
    keysetPage<CommentRow>(roots().leftJoin("users as a", "a.id", "c.author_id").leftJoin("users as r", "r.id", "c.resolved_by").select("c.*", "a.name as author_name", "r.name as resolver_name"), THREAD_KEYS, page),
    countOf(roots()),
  ]);
  const replies = p.items.length ? await commentQuery().whereIn("c.parent_id", p.items.map((r) => r.id)).orderBy([{ column: "c.created_at" }, { column: "c.id" }]) : [];
  return { items: [...p.items, ...(replies as CommentRow[])].map(toComment), next: p.next, total };
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

/**
 * A comment's new body and/or its thread resolved or reopened, with their audit events, in one
 * transaction: either every part of the change is kept or none is.
 */
export async function patchComment(p: { buildId: string; linkageId: string; commentId: string; rootId: string; userId: string; body?: string; resolved?: boolean }) {
  const { buildId, linkageId, userId } = p;
  await db.transaction(async (trx) => {
    if (p.body !== undefined) {
      await trx("comments").where({ id: p.commentId, linkage_id: linkageId }).update({ body: p.body, edited_at: trx.fn.now() });
      await audit({ buildId, userId, action: "comment.edit", detail: { linkageId, commentId: p.commentId } }, trx);
    }
    if (p.resolved !== undefined) {
      await trx("comments")
        .where({ id: p.rootId, linkage_id: linkageId })
        .update(p.resolved ? { resolved_at: trx.fn.now(), resolved_by: userId } : { resolved_at: null, resolved_by: null });
      await audit({ buildId, userId, action: p.resolved ? "comment.resolve" : "comment.reopen", detail: { linkageId, commentId: p.rootId } }, trx);
    }
  });
  const [comment, root] = await Promise.all([getComment(linkageId, p.commentId), p.rootId === p.commentId ? null : getComment(linkageId, p.rootId)]);
  return { comment: comment!, root: root ?? comment! };
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

/** Followers of the linkage (commenters) and the build's owners, who are still members. */
export async function linkageAudience(buildId: string, linkageId: string): Promise<Recipient[]> {
  return db("memberships as m")
    .join("users as u", "u.id", "m.user_id")
    .where("m.build_id", buildId)
    .where((q) => q.where("m.role", "owner").orWhereExists(db("linkage_followers as f").where("f.linkage_id", linkageId).whereRaw("f.user_id = m.user_id")))
    .select("u.id", "u.email", "u.name", "u.notify", "m.role");
}
