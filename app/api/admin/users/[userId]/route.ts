import { withSiteAdmin, parseBody, parseParams, json } from "@/lib/http";
import { lastAdmin, notFound } from "@/lib/errors";
import { adminUserPatch } from "@/shared/schemas/users";
import { uuidParam } from "@/shared/schemas/common";
import { setSiteAdmin } from "@/db/users";
import { audit } from "@/db/audit";

export const PATCH = withSiteAdmin<{ userId: string }>(async ({ req, user, params }) => {
  const id = parseParams(params.userId, uuidParam);
  const body = await parseBody(req, adminUserPatch);
  const r = await setSiteAdmin(id, body.isSiteAdmin);
  if (r === "missing") throw notFound("user");
  if (r === "last_admin") throw lastAdmin("The site needs at least one admin.");
  await audit({ buildId: null, userId: user.id, action: "admin.site-admin", detail: { target: id, isSiteAdmin: body.isSiteAdmin } });
  return json({ id, isSiteAdmin: body.isSiteAdmin });
});
