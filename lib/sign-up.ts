import "server-only";
import { apiError, linkClosed } from "./errors";
import { hashPassword } from "./passwords";
import { confirmSignUpUrl, signInUrl } from "./urls";
import { sendAlreadyRegisteredMail, sendSignUpConfirmMail } from "./review-mail";
import { findUserByEmail } from "@/db/users";
import { CONFIRM_HOURS, confirmSignUp, recordSignUp } from "@/db/sign-ups";
import { safeNext } from "@/shared/safe-next";
import type { z } from "zod";
import type { signUpInput } from "@/shared/schemas/users";

/**
 * A sign-up: the same work whatever the address (a password hash, a row, one e-mail), so neither the answer
 * nor its time tells whether the address has an account. A new address gets the link that makes the
 * account; one with an account is told so, with the way to sign in.
 */
export async function requestSignUp(body: z.infer<typeof signUpInput>) {
  const passwordHash = await hashPassword(body.password); // also for a known address: the same cost
  const exists = !!(await findUserByEmail(body.email));
  const r = await recordSignUp({ email: body.email, name: body.name, passwordHash, next: safeNext(body.next), exists });
  if (r.send === "new") await sendSignUpConfirmMail({ to: body.email, link: confirmSignUpUrl(r.token), hours: CONFIRM_HOURS });
  else if (r.send === "existing") await sendAlreadyRegisteredMail({ to: body.email, signInLink: signInUrl() });
}

/** Opens a confirmation link: the account is made, or a 4xx that says why not and what to do. */
export async function openConfirmLink(token: string) {
  const r = await confirmSignUp(token);
  if ("created" in r) return { email: r.created.email, next: r.next };
  switch (r.closed) {
    case "unknown":
      throw apiError("not_found", "This confirmation link is not one we sent. Open the whole link from the e-mail, or sign up again to get a new one.");
    case "used":
      throw linkClosed("This confirmation link has already been used, and the account was made with it. Sign in with the e-mail and password you chose.");
    case "expired":
      throw linkClosed(`This confirmation link has expired (each works for ${CONFIRM_HOURS} hours). Sign up again to get a new one.`);
    case "exists":
      throw linkClosed("This e-mail address already has an account. Sign in with it.");
  }
}
