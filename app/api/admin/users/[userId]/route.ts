import { withSiteAdmin, parseBody, parseParams, json } from "@/lib/http";
import { lastAdmin, notFound } from "@/lib/errors";
import { adminUserPatch } from "@/shared/schemas/users";
import { uuidParam } from "@/shared/schemas/common";
import { setSiteAdmin } from "@/db/users";

export const PATCH = withSiteAdmin<{ userId: string }>(async ({ req, user, params }) => {
  const id = parseParams(params.userId, uuidParam);
  const body = await parseBody(req, adminUserPatch);
  const r = await setSiteAdmin(id, body.isSiteAdmin, user.id);
  if (r === "missing") throw notFound("user");
  if (r === "last_admin") throw lastAdmin("The site needs at least one admin.");
  return json({ id, isSiteAdmin: body.isSiteAdmin });
});
