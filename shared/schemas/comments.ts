/** Review comments: threads on a part, a joint or the linkage, replies one level deep, resolve and reopen. */
import { z } from "zod";
import { isoTime, pageFields, person, subjectSchema, text } from "./common";

/** Minutes during which the author may still change a comment's text. */
export const COMMENT_EDIT_MINUTES = 15;

const body = text("Comment", 10_000);
export const commentCreate = z.object({
  subject: subjectSchema,
  body,
  /** Reply to this comment's thread. */
  parentId: z.string().uuid("parentId must be a comment id").optional(),
});
/** `{body}` changes the text (author, within the edit window); `{resolved}` resolves or reopens the thread. */
export const commentPatch = commentCreate
  .pick({ body: true })
  .extend({ resolved: z.boolean({ error: "resolved must be true or false" }) })
  .partial()
  .refine((v) => v.body !== undefined || v.resolved !== undefined, { message: "Nothing to change", path: ["body"] });

export const comment = z.object({
  id: z.string(),
  linkageId: z.string(),
  subject: subjectSchema,
  parentId: z.string().nullable(),
  author: person,
  body: z.string(),
  revision: z.number().int(),
  createdAt: isoTime,
  editedAt: isoTime.nullable(),
  resolvedAt: isoTime.nullable(),
  resolvedBy: person.nullable(),
});
export type Comment = z.infer<typeof comment>;
/** A comment as the API shows it: with the end of its edit window. */
export const commentView = comment.extend({ editableUntil: isoTime });
export type CommentView = z.infer<typeof commentView>;

/** A page of threads, newest first: each thread's first comment, then its replies; `total` counts threads. */
export const commentsResponse = z.object({
  comments: z.array(commentView),
  ...pageFields,
  /** Open threads per subject ("joint:j1" → 2). */
  unresolved: z.record(z.string(), z.number().int()),
  /** The same subjects by name ("Aft pushrod B ↔ Elevator horn, attach"). */
  unresolvedNames: z.record(z.string(), z.string()),
  editMinutes: z.number().int(),
});
export const commentPatched = z.object({ comment, thread: comment.nullable().optional() });
