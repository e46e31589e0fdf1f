import { withUser, json } from "@/lib/http";
import { invitationClosed } from "@/lib/errors";
import { acceptInvitation } from "@/db/builds";

/** The signed-in user accepts an invitation: single use, until it expires. */
export const POST = withUser<{ token: string }>(async ({ user, params }) => {
  const token = String(params.token ?? "");
  const accepted = /^[A-Za-z0-9_-]{20,64}$/.test(token) ? await acceptInvitation(token, user.id) : null;
  if (!accepted) throw invitationClosed("This invitation link has been used, has expired or was withdrawn. Ask the build's owner for a new one.");
  return json(accepted);
});
