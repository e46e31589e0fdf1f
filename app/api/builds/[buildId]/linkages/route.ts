import { withBuild, json } from "@/lib/http";
import { engineCreate } from "@/lib/engine/threads";
import { createLinkage, listLinkages } from "@/db/linkages";

export const GET = withBuild("read", async ({ build }) => json({ linkages: await listLinkages(build.id) }));

/** Create a linkage, empty or from an imported linkage file. */
export const POST = withBuild("edit", async ({ req, user, build }) => {
  // Checked against shared/schemas/linkages.ts linkageCreate, and an imported graph analysed, in an engine thread.
  const { input, analysisJson, summaryJson } = await engineCreate(req, build.analysisSettings);
  const linkage = await createLinkage(build.id, user.id, { ...input, analysisJson, summaryJson });
  return json({ linkage }, 201);
});
