import { withBuild, parseBody, json } from "@/lib/http";
import { buildPatch } from "@/shared/api";
import { deleteBuild, updateBuild } from "@/db/builds";
import { refreshCurrentAnalyses } from "@/db/linkages";
import { analyze, settingsSchema } from "@/shared/analysis";
import { deleteObject } from "@/lib/storage";

export const GET = withBuild("read", async ({ build, role }) => json({ build, role }));

export const PATCH = withBuild("manage", async ({ req, user, build }) => {
  const body = await parseBody(req, buildPatch);
  const stored = settingsSchema.parse(build.analysisSettings ?? {});
  const patch = body.analysisSettings;
  const analysisSettings = patch ? settingsSchema.parse({ ...stored, ...patch, pilotForce: { ...stored.pilotForce, ...patch.pilotForce } }) : undefined;
  const updated = await updateBuild(build.id, user.id, { ...body, analysisSettings });
  // New factors or forces change every number: the current revisions are checked again with them.
  if (analysisSettings) await refreshCurrentAnalyses(build.id, (graph) => analyze(graph, analysisSettings));
  return json({ build: updated });
});

export const DELETE = withBuild("manage", async ({ build }) => {
  const keys = await deleteBuild(build.id);
  // The rows are gone; the stored objects follow (a failure here leaves orphans, never dangling rows).
  await Promise.allSettled(keys.map((k) => deleteObject(k)));
  return json({ deleted: true, filesRemoved: keys.length });
});
