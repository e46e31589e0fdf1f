import { withUser, parseBody, json } from "@/lib/http";
import { fieldError, unauthorized } from "@/lib/errors";
import { passwordChange } from "@/shared/schemas/users";
import { beginAttempt, clearFailures, findUserById, setPassword } from "@/db/users";
import { checkPassword, hashPassword } from "@/lib/passwords";

/**
 * Change the signed-in account's password. The current one is checked as a sign-in is (the same slowing after
 * failures, counted before the check), and every session ends: this cookie too, and any copied one.
 */
export const POST = withUser(async ({ req, user }) => {
  const body = await parseBody(req, passwordChange);
  const row = await findUserById(user.id);
  if (!row) throw unauthorized();
  const attempt = await beginAttempt(row.email, `account:${row.id}`);
  if ("refused" in attempt) throw fieldError("currentPassword", `too many wrong tries: wait ${"waitS" in attempt ? attempt.waitS : 900} seconds`, "Too many wrong passwords. Wait, then try again.");
  if (!(await checkPassword(body.currentPassword, row.password_hash))) throw fieldError("currentPassword", "is not your current password", "The current password is wrong; nothing changed.");
  if (body.currentPassword === body.newPassword) throw fieldError("newPassword", "is the same as the current one");
  await setPassword(row.id, await hashPassword(body.newPassword));
  await clearFailures(row.email);
  return json({ changed: true, signedOut: true });
});
