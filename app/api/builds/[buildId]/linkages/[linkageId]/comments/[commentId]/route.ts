import { withLinkage, parseBody, parseParams, json } from "@/lib/http";
import { editWindowClosed, forbidden, notFound } from "@/lib/errors";
import { uuidParam } from "@/shared/schemas/common";
import { commentPatch, COMMENT_EDIT_MINUTES } from "@/shared/schemas/comments";
import { getComment, patchComment } from "@/db/comments";

type P = { buildId: string; linkageId: string; commentId: string };

/**
 * `{body}`: the author changes their own comment within the edit window.
 * `{resolved}`: anyone who may comment resolves or reopens the comment's thread.
 */
export const PATCH = withLinkage<P>("comment", async ({ req, user, build, linkage, params }) => {
  const commentId = parseParams(params.commentId, uuidParam);
  const patch = await parseBody(req, commentPatch);
  const comment = await getComment(linkage.id, commentId);
  if (!comment) throw notFound("comment");
  if (patch.body !== undefined) {
    if (comment.author.id !== user.id) throw forbidden("You can change only your own comments.");
    if (Date.now() - Date.parse(comment.createdAt) > COMMENT_EDIT_MINUTES * 60_000)
      throw editWindowClosed(`A comment can be changed for ${COMMENT_EDIT_MINUTES} minutes after it is written. Add a reply instead.`);
  }
  if (patch.body === undefined && patch.resolved === undefined) return json({ comment });
  const rootId = comment.parentId ?? comment.id;
  const saved = await patchComment({ buildId: build.id, linkageId: linkage.id, commentId: comment.id, rootId, userId: user.id, body: patch.body, resolved: patch.resolved });
  return json(patch.resolved !== undefined ? { comment: saved.comment, thread: saved.root } : { comment: saved.comment });
});
