import { withUser, json } from "@/lib/http";
import { forbidden, invitationClosed } from "@/lib/errors";
import { acceptInvitation } from "@/db/builds";
import { maskEmail } from "@/shared/schemas/members";

/** The signed-in user accepts an invitation: single use, until it expires, and only by the account it was sent to. */
export const POST = withUser<{ token: string }>(async ({ user, params }) => {
  const token = String(params.token ?? "");
  const accepted = /^[A-Za-z0-9_-]{20,64}$/.test(token) ? await acceptInvitation(token, user.id, user.email) : null;
  if (!accepted) throw invitationClosed("This invitation link has been used, has expired or was withdrawn. Ask the build's owner for a new one.");
  if ("wrongAccount" in accepted) throw forbidden(`This invitation was sent to ${maskEmail(accepted.wrongAccount)}, and you are signed in as ${user.email}. Sign in with the invited address to accept it, or ask the build's owner to invite this one.`);
  return json(accepted);
});
