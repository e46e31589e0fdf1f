import { withBuild, parseBody, parseParams, json } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { linkagePatch, uuidParam } from "@/shared/api";
import { deleteLinkage, getLinkage, updateLinkage } from "@/db/linkages";

type P = { buildId: string; linkageId: string };

export const GET = withBuild<P>("read", async ({ build, params }) => {
  const linkage = await getLinkage(build.id, parseParams(params.linkageId, uuidParam));
  if (!linkage) throw notFound("linkage");
  return json({ linkage });
});

export const PATCH = withBuild<P>("edit", async ({ req, user, build, params }) => {
  const id = parseParams(params.linkageId, uuidParam);
  const body = await parseBody(req, linkagePatch);
  const linkage = await updateLinkage(build.id, id, user.id, body);
  if (!linkage) throw notFound("linkage");
  return json({ linkage });
});

export const DELETE = withBuild<P>("edit", async ({ user, build, params }) => {
  const id = parseParams(params.linkageId, uuidParam);
  if (!(await deleteLinkage(build.id, id, user.id))) throw notFound("linkage");
  return json({ deleted: id });
});
