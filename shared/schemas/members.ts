/** Members of a build and invitations to it. */
import { z } from "zod";
import { ROLES } from "../roles";
import { isoTime } from "./common";

export const roleSchema = z.enum(ROLES, { error: "Role must be owner, builder, reviewer or viewer" });
const email = z.string().trim().email("Enter a valid e-mail address").max(254);

export const memberAdd = z.object({ email, role: roleSchema });
export const memberPatch = memberAdd.pick({ role: true });
export const invitationCreate = memberAdd;

export const member = z.object({ userId: z.string(), name: z.string(), email: z.string(), role: roleSchema, since: isoTime });
export type Member = z.infer<typeof member>;
export const invitation = z.object({ id: z.string(), email: z.string(), role: roleSchema, expiresAt: isoTime, createdAt: isoTime, acceptedAt: isoTime.nullable() });
export type Invitation = z.infer<typeof invitation>;

export const membersResponse = z.object({ members: z.array(member) });
export const invitationsResponse = z.object({ invitations: z.array(invitation) });

/** An address shown to someone who is not its owner: "d…@example.test" (the first letter and the domain). */
export function maskEmail(email: string): string {
  const at = email.lastIndexOf("@");
  return at > 0 ? `${email[0]}…${email.slice(at)}` : "another address";
}
