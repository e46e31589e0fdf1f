import { withBuild, parseBody, json } from "@/lib/http";
import { alreadyMember } from "@/lib/errors";
import { memberAdd } from "@/shared/schemas/members";
import { addMember, createInvitation, listMembers } from "@/db/builds";
import { findUserByEmail } from "@/db/users";
import { inviteUrl } from "@/lib/urls";
import { sendInvitationMail } from "@/lib/review-mail";

export const GET = withBuild("read", async ({ build }) => json({ members: await listMembers(build.id) }));

/**
 * Owner adds a member by e-mail. A registered user joins at once; anyone else gets an invitation
 * whose link works when opened by that person.
 */
export const POST = withBuild("manage", async ({ req, user, build }) => {
  const body = await parseBody(req, memberAdd);
  const existing = await findUserByEmail(body.email);
  if (existing) {
    const members = await listMembers(build.id);
    if (members.some((m) => m.userId === existing.id))
      throw alreadyMember(`${existing.name} is already a member of this build.`, { email: "Already a member" });
    await addMember(build.id, existing.id, body.role, user.id);
    return json({ added: { userId: existing.id, name: existing.name, role: body.role } }, 201);
  }
  const { token, invitation } = await createInvitation(build.id, body.email, body.role, user.id);
  const mailed = await sendInvitationMail({ to: invitation.email, buildName: build.name, role: invitation.role, inviterName: user.name, link: inviteUrl(token), expiresAt: invitation.expiresAt });
  return json({ invitation, link: inviteUrl(token), mailed }, 201);
});
