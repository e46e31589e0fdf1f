import { withLinkage, parseBody, parseParams, json } from "@/lib/http";
import { fieldError } from "@/lib/errors";
import { commentCreate, COMMENT_EDIT_MINUTES } from "@/shared/schemas/comments";
import { subjectSchema } from "@/shared/schemas/common";
import { createComment, getComment, linkageAudience, pageThreads, THREAD_KEYS, unresolvedCounts } from "@/db/comments";
import type { Comment } from "@/shared/schemas/comments";
import { pageBody, readPage } from "@/lib/paging";
import { subjectExists } from "@/lib/review";
import { subjectName, subjectPhrase } from "@/shared/linkage/names";
import { notifyComment } from "@/lib/review-mail";

const withWindow = (c: Comment) => ({ ...c, editableUntil: new Date(Date.parse(c.createdAt) + COMMENT_EDIT_MINUTES * 60_000).toISOString() });

/**
 * A page of the linkage's threads (or one subject's: `?subjectType=joint&subjectId=j1`), newest first
 * (`?cursor=&limit=`), each with its replies; `total` threads in all; open-thread counts per subject.
 */
export const GET = withLinkage("read", { revision: "current" }, async ({ req, linkage, revision }) => {
  const sp = req.nextUrl.searchParams;
  const subject = sp.has("subjectType") ? parseParams({ type: sp.get("subjectType"), id: sp.get("subjectId") }, subjectSchema) : undefined;
  const [p, unresolved] = await Promise.all([pageThreads(linkage.id, subject, readPage(req, THREAD_KEYS)), unresolvedCounts(linkage.id)]);
  // Each subject with open threads by the name a person reads (from the current revision), never its id.
  const unresolvedNames = Object.fromEntries(Object.keys(unresolved).map((k) => {
    const [type, ...id] = k.split(":");
    return [k, subjectName(revision.graph, { type: type as "node" | "joint" | "linkage", id: id.join(":") })];
  }));
  return json({ ...pageBody("comments", { items: p.items.map(withWindow), next: p.next }, p.total), unresolved, unresolvedNames, editMinutes: COMMENT_EDIT_MINUTES });
});

/** A new thread on a node, a joint or the linkage, or a reply (`parentId`) in an existing thread. */
export const POST = withLinkage("comment", { revision: "current" }, async ({ req, user, build, linkage, revision: rev }) => {
  const body = await parseBody(req, commentCreate);
  let subject = body.subject;
  let parentId: string | null = null;
  if (body.parentId) {
    const parent = await getComment(linkage.id, body.parentId);
    if (!parent) throw fieldError("parentId", "No such comment on this linkage");
    parentId = parent.parentId ?? parent.id; // replies stay one level deep, under the thread's first comment
    subject = parent.subject;
  } else if (!subjectExists(rev.graph, subject, linkage.id)) {
    throw fieldError("subject.id", subject.type === "linkage" ? "For the whole linkage, the subject id is the linkage's id" : `No ${subject.type} "${subject.id}" in revision ${rev.revision}`);
  }
  const comment = await createComment({ buildId: build.id, linkageId: linkage.id, subject, parentId, authorId: user.id, body: body.body, revision: rev.revision });
  const notified = await notifyComment({
    audience: await linkageAudience(build.id, linkage.id),
    authorId: user.id,
    authorName: user.name,
    buildId: build.id,
    buildName: build.name,
    linkageId: linkage.id,
    linkageName: linkage.name,
    subject,
    subjectLabel: subjectPhrase(rev.graph, subject),
    body: body.body,
    isReply: parentId !== null,
  }).catch((e) => (console.error("[review] comment mail failed", e), [] as string[]));
  return json({ comment: withWindow(comment), notified: notified.length }, 201);
});
