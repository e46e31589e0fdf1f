import { withBuild, parseBody, json } from "@/lib/http";
import { buildPatch } from "@/shared/api";
import { deleteBuild, updateBuild } from "@/db/builds";

export const GET = withBuild("read", async ({ build, role }) => json({ build, role }));

export const PATCH = withBuild("manage", async ({ req, user, build }) => {
  const body = await parseBody(req, buildPatch);
  const analysisSettings = body.analysisSettings ? { ...build.analysisSettings, ...body.analysisSettings } : undefined;
  return json({ build: await updateBuild(build.id, user.id, { ...body, analysisSettings }) });
});

export const DELETE = withBuild("manage", async ({ build }) => {
  await deleteBuild(build.id);
  return json({ deleted: true });
});
