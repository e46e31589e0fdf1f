import { withBuild, parseBody, parseParams, json } from "@/lib/http";
import { lastOwner, notFound } from "@/lib/errors";
import { memberPatch } from "@/shared/schemas/members";
import { uuidParam } from "@/shared/schemas/common";
import { removeMember, setMemberRole } from "@/db/builds";

type P = { buildId: string; userId: string };
const LAST_OWNER = "A build needs at least one owner. Make someone else owner first.";

export const PATCH = withBuild<P>("manage", async ({ req, user, build, params }) => {
  const userId = parseParams(params.userId, uuidParam);
  const body = await parseBody(req, memberPatch);
  const r = await setMemberRole(build.id, userId, body.role, user.id);
  if (r === "missing") throw notFound("member");
  if (r === "last_owner") throw lastOwner(LAST_OWNER);
  return json({ userId, role: body.role });
});

export const DELETE = withBuild<P>("manage", async ({ user, build, params }) => {
  const userId = parseParams(params.userId, uuidParam);
  const r = await removeMember(build.id, userId, user.id);
  if (r === "missing") throw notFound("member");
  if (r === "last_owner") throw lastOwner(LAST_OWNER);
  return json({ removed: userId });
});
