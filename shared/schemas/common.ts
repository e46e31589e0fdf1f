/**
 * What the API contracts share: the one `text()` field, ids, revision numbers, dates, a person, a
 * subject of review, and `patchOf` for patches derived from a request schema.
 */
import { z } from "zod";

/** A trimmed, required, length-capped text field whose messages name it: `text("Comment", 10_000)`. */
export const text = (what: string, max: number) =>
  z.string({ error: `${what} is required` }).trim().min(1, `${what} is required`).max(max, `${what} is at most ${max} characters`);

export const uuidParam = z.string().uuid();

/** Revision numbers are Postgres integers: anything above fits no revision (and must not reach the database). */
export const REVISION_MAX = 2_147_483_647;
/** `?revision=N` and the like: a whole number from 1 to REVISION_MAX. */
export const revisionQuery = z.coerce.number().int().min(1).max(REVISION_MAX);
/** A revision number in a JSON body. */
export const revisionNumber = (what = "revision") =>
  z.number({ error: `${what} must be a number` }).int(`${what} must be a whole number`).min(1, `${what} must be 1 or more`).max(REVISION_MAX);

/** A time as the API writes it (ISO 8601, UTC). */
export const isoTime = z.iso.datetime();

/** Someone who wrote, signed or ticked something; `id` is null once the account is gone ("former member"). */
export const person = z.object({ id: z.string().nullable(), name: z.string() });
export type Person = z.infer<typeof person>;

/** What a comment or an acknowledgement is about: a part, a joint, or the whole linkage (its id). */
export const SUBJECT_TYPES = ["node", "joint", "linkage"] as const;
export const subjectSchema = z.object({
  type: z.enum(SUBJECT_TYPES, { error: "Subject type must be node, joint or linkage" }),
  id: z.string({ error: "Subject id is required" }).min(1, "Subject id is required").max(64, "Subject id is at most 64 characters").refine((s) => !s.includes("\u0000"), "Subject id must not contain NUL characters"),
});

export type Subject = z.infer<typeof subjectSchema>;

/** Findings counts by severity, as stored with a revision. */
/**
 * A page of a long list (newest first): how many items the whole list has, and the cursor of the next
 * page (null on the last). The items sit beside these under the list's own name.
 */
export const pageFields = { total: z.number().int().min(0), nextCursor: z.string().nullable() };

export const severityCounts = z.object({ hazard: z.number().int(), caution: z.number().int(), advisory: z.number().int() });

/** A patch names at least one field. */
export const notEmpty = <T extends object>(v: T) => Object.values(v).some((x) => x !== undefined);

/**
 * A patch of a schema: every field optional and no defaults filled in, nested objects too, so that
 * a patch naming one field leaves the stored others alone (zod's `.partial()` would fill defaults).
 */
export function patchOf<S extends z.ZodObject>(schema: S) {
  return patchShape(schema) as unknown as z.ZodType<DeepPartial<z.output<S>>, DeepPartial<z.input<S>>>;
}
function patchShape(schema: z.ZodObject): z.ZodObject {
  const shape: Record<string, z.ZodType> = {};
  for (const [key, field] of Object.entries(schema.shape)) {
    let inner: z.ZodType = field instanceof z.ZodDefault ? (field.unwrap() as z.ZodType) : (field as z.ZodType);
    if (inner instanceof z.ZodObject) inner = patchShape(inner);
    shape[key] = inner.optional();
  }
  return z.object(shape);
}
/** A patch that names at least one field. */
export const patchWithSomething = <S extends z.ZodObject>(schema: S) =>
  (patchShape(schema).refine(notEmpty, "Nothing to change") as unknown as ReturnType<typeof patchOf<S>>);
export type DeepPartial<T> = { [K in keyof T]?: T[K] extends readonly unknown[] ? T[K] : T[K] extends object ? DeepPartial<T[K]> : T[K] };
