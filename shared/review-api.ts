/** Request bodies of the review routes: comments, acknowledgements, sign-offs, notification settings. */
import { z } from "zod";

const text = (what: string, max: number) =>
  z.string({ error: `${what} is required` }).trim().min(1, `${what} is required`).max(max, `${what} is at most ${max} characters`);

export const SUBJECT_TYPES = ["node", "joint", "linkage"] as const;
export const subjectSchema = z.object({
  type: z.enum(SUBJECT_TYPES, { error: "Subject type must be node, joint or linkage" }),
  id: z.string({ error: "Subject id is required" }).min(1, "Subject id is required").max(64, "Subject id is at most 64 characters").refine((s) => !s.includes("\u0000"), "Subject id must not contain NUL characters"),
});

/** Minutes during which the author may still change a comment's text. */
export const COMMENT_EDIT_MINUTES = 15;

export const commentCreate = z.object({
  subject: subjectSchema,
  body: text("Comment", 10_000),
  /** Reply to this comment's thread. */
  parentId: z.string().uuid("parentId must be a comment id").optional(),
});

export const commentPatch = z
  .object({ body: text("Comment", 10_000).optional(), resolved: z.boolean({ error: "resolved must be true or false" }).optional() })
  .refine((v) => v.body !== undefined || v.resolved !== undefined, { message: "Nothing to change", path: ["body"] });

export const acknowledgementCreate = z.object({
  code: z.string({ error: "Finding code is required" }).trim().min(1, "Finding code is required").max(80),
  subject: subjectSchema,
  reason: text("Reason", 4000),
});

export const signoffCreate = z.object({
  revision: z.number({ error: "revision must be a number" }).int("revision must be a whole number").min(1, "revision must be 1 or more"),
  statement: text("Statement", 4000),
});

export const NOTIFY_PREFS = ["all", "mentions_signoffs", "none"] as const;
export type NotifyPref = (typeof NOTIFY_PREFS)[number];
export const notificationsPatch = z.object({
  notify: z.enum(NOTIFY_PREFS, { error: "notify must be all, mentions_signoffs or none" }),
});

export const NOTIFY_LABEL: Record<NotifyPref, string> = {
  all: "Every comment and reply on linkages I follow, and sign-offs",
  mentions_signoffs: "Only when someone @mentions me, and sign-offs",
  none: "No review e-mail",
};
