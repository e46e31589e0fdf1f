import { withBuild, parseParams, requestedRevision } from "@/lib/http";
import { notFound } from "@/lib/errors";
import { uuidParam } from "@/shared/api";
import { getLinkage } from "@/db/linkages";
import { serializeLinkage } from "@/shared/linkage/io";

type P = { buildId: string; linkageId: string };

/** The linkage as a file in the linkage format (`?revision=N` for an older one), to keep outside Linkwright. */
export const GET = withBuild<P>("read", async ({ req, build, params }) => {
  const id = parseParams(params.linkageId, uuidParam);
  const linkage = await getLinkage(build.id, id);
  if (!linkage) throw notFound("linkage");
  const rev = await requestedRevision(req, id);
  const base = (linkage.name || "linkage").toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "linkage";
  return new Response(serializeLinkage({ ...rev.graph, name: linkage.name, system: linkage.system }), {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="${base}-rev${rev.revision}.linkage.json"`,
      "x-content-type-options": "nosniff",
    },
  });
});
