/** Accounts: sign-up, the signed-in user's settings (units, review e-mail), and site admins. */
import { z } from "zod";
import { NOTIFY_PREFS } from "../notify";
import { text } from "./common";

export { NOTIFY_LABEL, NOTIFY_PREFS, type NotifyPref } from "../notify";

export const signUpInput = z.object({
  name: text("Name", 120),
  email: z.string().trim().email("Enter a valid e-mail address").max(254),
  password: z.string().min(10, "Use at least 10 characters").max(200, "At most 200 characters"),
  /** Where to go after the first sign-in (a path on this site; anything else goes to the builds list). */
  next: z.string().max(2000, "At most 2000 characters").optional(),
});

/**
 * The one answer to every accepted sign-up, whether or not the address has an account: the e-mail sent
 * tells which (a link that makes the account, or a reminder to sign in).
 */
export const SIGN_UP_SENT = "Check your e-mail to finish creating your account.";
export const signUpResponse = z.object({ message: z.literal(SIGN_UP_SENT) });

/** The token from a confirmation link. */
export const signUpConfirm = z.object({
  token: z.string({ error: "The link has no token" }).regex(/^[A-Za-z0-9_-]{20,64}$/, "This is not a whole confirmation link: copy all of it from the e-mail"),
}).strict();
export const signUpConfirmResponse = z.object({ email: z.string(), next: z.string() });

/** A new password for the signed-in account; every session ends with it (the person signs in again). */
export const passwordChange = z.object({
  currentPassword: z.string({ error: "Enter your current password" }).min(1, "Enter your current password").max(200, "At most 200 characters"),
  newPassword: z.string({ error: "Enter a new password" }).min(10, "Use at least 10 characters").max(200, "At most 200 characters"),
}).strict();

export const UNIT_SYSTEMS = ["US", "SI"] as const;
export const mePatch = z.object({ unitSystem: z.enum(UNIT_SYSTEMS) });
export const publicUser = z.object({ id: z.string(), email: z.string(), name: z.string(), isSiteAdmin: z.boolean(), unitSystem: z.enum(UNIT_SYSTEMS) });
export type PublicUser = z.infer<typeof publicUser>;

export const adminUserPatch = z.object({ isSiteAdmin: z.boolean({ error: "isSiteAdmin must be true or false" }) });

export const notificationsPatch = z.object({ notify: z.enum(NOTIFY_PREFS, { error: "notify must be all, mentions_signoffs or none" }) });
export const notifyResponse = notificationsPatch;
