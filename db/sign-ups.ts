import "server-only";
import { randomBytes } from "node:crypto";
import { db } from "./index";
import { hashToken } from "./builds";
import type { UserRow } from "./users";

/** How long a confirmation link works. */
export const CONFIRM_HOURS = 24; // common practice, no source
/** Sign-up e-mails to one address per hour; past that the answer is the same and no mail goes out. */
export const MAX_SIGN_UP_MAILS_PER_HOUR = 5; // common practice, no source
/** Requests older than this are deleted (every link has expired long before). */
const KEEP_DAYS = 3;

/**
 * Records a sign-up request for the address and says which e-mail to send, if any. The row is written first
 * and the address's requests counted after, so requests sent at the same moment cannot run past the limit.
 * `new`: a single-use token (only its hash is stored) that makes the account when the link is opened.
 */
export async function recordSignUp(r: { email: string; name: string; passwordHash: string; next: string; exists: boolean }):
  Promise<{ send: "new"; token: string } | { send: "existing" } | { send: null }> {
  await db("sign_up_requests").where("created_at", "<", db.raw(`now() - interval '${KEEP_DAYS} days'`)).del();
  const token = r.exists ? null : randomBytes(32).toString("base64url");
  const [row] = await db("sign_up_requests")
    .insert({
      email: r.email.trim(),
      kind: r.exists ? "existing" : "new",
      ...(token
        ? { name: r.name.trim(), password_hash: r.passwordHash, next: r.next, token_hash: hashToken(token), expires_at: db.raw(`now() + interval '${CONFIRM_HOURS} hours'`) }
        : {}),
    })
    .returning(["id"]);
  const { n } = await db("sign_up_requests").whereRaw("lower(email) = lower(?)", [r.email.trim()])
    .where("created_at", ">", db.raw("now() - interval '1 hour'")).first(db.raw("count(*)::int as n"));
  if (n > MAX_SIGN_UP_MAILS_PER_HOUR) {
    await db("sign_up_requests").where({ id: row.id }).del();
    return { send: null };
  }
  return token ? { send: "new", token } : { send: "existing" };
}

export type ConfirmResult =
  | { created: UserRow; next: string }
  | { closed: "unknown" | "used" | "expired" | "exists"; email?: string };

/**
 * Opens a confirmation link: once, before it expires. Makes the account with the name and password chosen at
 * sign-up; if the address has an account by now (another link of it was opened first), the link is spent
 * and the person is told to sign in.
 */
export async function confirmSignUp(token: string): Promise<ConfirmResult> {
  try {
    return await db.transaction(async (trx): Promise<ConfirmResult> => {
      const row = await trx("sign_up_requests").where({ token_hash: hashToken(token), kind: "new" }).forUpdate()
        .first("id", "email", "name", "password_hash", "next", "used_at", db.raw("expires_at <= now() as expired"));
      if (!row) return { closed: "unknown" };
      if (row.used_at) return { closed: "used", email: row.email };
      if (row.expired) return { closed: "expired", email: row.email };
      await trx("sign_up_requests").where({ id: row.id }).update({ used_at: trx.fn.now(), password_hash: null });
      const taken = await trx("users").whereRaw("lower(email) = lower(?)", [row.email]).first("id");
      if (taken) return { closed: "exists", email: row.email };
      const [user] = await trx<UserRow>("users").insert({ email: row.email, name: row.name, password_hash: row.password_hash }).returning("*");
      return { created: user, next: row.next ?? "/builds" };
    });
  } catch (e) {
    // Two links of one address opened at the same moment: the unique e-mail index lets one make the account.
    if ((e as { code?: string }).code === "23505") return { closed: "exists" };
    throw e;
  }
}
