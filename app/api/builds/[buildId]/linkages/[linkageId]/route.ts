import { withLinkage, parseBody, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { linkagePatch } from "@/shared/schemas/linkages";
import { deleteLinkage, updateLinkage } from "@/db/linkages";

export const GET = withLinkage("read", async ({ linkage }) => json({ linkage }));

export const PATCH = withLinkage("edit", async ({ req, user, build, linkage: { id } }) => {
  const body = await parseBody(req, linkagePatch);
  const linkage = await updateLinkage(build.id, id, user.id, body);
  if (!linkage) throw notFound("linkage"); // deleted while this request ran
  return json({ linkage });
});

export const DELETE = withLinkage("edit", async ({ user, build, linkage: { id } }) => {
  if (!(await deleteLinkage(build.id, id, user.id))) throw notFound("linkage");
  return json({ deleted: id });
});
