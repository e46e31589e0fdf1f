import { withBuild, parseBody, json } from "@/lib/http";
import { buildPatch } from "@/shared/schemas/builds";
import { deleteBuild, updateBuild } from "@/db/builds";
import { analyze, settingsSchema } from "@/shared/analysis";
import { deleteObject } from "@/lib/storage";

export const GET = withBuild("read", async ({ build, role }) => json({ build, role }));

export const PATCH = withBuild("manage", async ({ req, user, build }) => {
  const body = await parseBody(req, buildPatch);
  const stored = settingsSchema.parse(build.analysisSettings ?? {});
  const patch = body.analysisSettings;
  const analysisSettings = patch ? settingsSchema.parse({ ...stored, ...patch, pilotForce: { ...stored.pilotForce, ...patch.pilotForce } }) : undefined;
  // New factors or forces change every number: the current revisions are checked again with them.
  const reanalyze = analysisSettings ? (graph: Parameters<typeof analyze>[0]) => analyze(graph, analysisSettings) : undefined;
  return json({ build: await updateBuild(build.id, user.id, { ...body, analysisSettings }, reanalyze) });
});

export const DELETE = withBuild("manage", async ({ build, user }) => {
  const keys = await deleteBuild(build.id, user.id);
  // The rows are gone; the stored objects follow (a failure here leaves orphans, never dangling rows).
  await Promise.allSettled(keys.map((k) => deleteObject(k)));
  return json({ deleted: true, filesRemoved: keys.length });
});
