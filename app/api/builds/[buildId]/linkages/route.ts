import { withBuild, parseBody, json } from "@/lib/http";
import { linkageCreate } from "@/shared/schemas/linkages";
import { createLinkage, listLinkages } from "@/db/linkages";
import { analyze } from "@/shared/analysis";

export const GET = withBuild("read", async ({ build }) => json({ linkages: await listLinkages(build.id) }));

/** Create a linkage, empty or from an imported linkage file. */
export const POST = withBuild("edit", async ({ req, user, build }) => {
  const body = await parseBody(req, linkageCreate);
  const analysis = body.graph ? analyze(body.graph, build.analysisSettings) : null;
  const linkage = await createLinkage(build.id, user.id, { ...body, analysis });
  return json({ linkage }, 201);
});
