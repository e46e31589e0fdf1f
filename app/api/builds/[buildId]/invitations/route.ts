import { withBuild, parseBody, json } from "@/lib/http";
import { invitationCreate } from "@/shared/schemas/members";
import { createInvitation, listInvitations } from "@/db/builds";
import { inviteUrl } from "@/lib/urls";
import { sendInvitationMail } from "@/lib/review-mail";

export const GET = withBuild("manage", async ({ build }) => json({ invitations: await listInvitations(build.id) }));

export const POST = withBuild("manage", async ({ req, user, build }) => {
  const body = await parseBody(req, invitationCreate);
  const { token, invitation } = await createInvitation(build.id, body.email, body.role, user.id);
  const mailed = await sendInvitationMail({ to: invitation.email, buildName: build.name, role: invitation.role, inviterName: user.name, link: inviteUrl(token), expiresAt: invitation.expiresAt });
  return json({ invitation, link: inviteUrl(token), mailed }, 201);
});
