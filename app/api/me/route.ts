import { withUser, parseBody, json } from "@/lib/http";
import { mePatch } from "@/shared/schemas/users";
import { setUnitSystem } from "@/db/users";

export const GET = withUser(async ({ user }) => json({ user }));

export const PATCH = withUser(async ({ req, user }) => {
  const body = await parseBody(req, mePatch);
  await setUnitSystem(user.id, body.unitSystem);
  return json({ user: { ...user, unitSystem: body.unitSystem } });
});
