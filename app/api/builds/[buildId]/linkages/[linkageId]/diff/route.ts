import { withBuild, parseParams, json } from "@/lib/http";
import { revisionQuery, uuidParam } from "@/shared/api";
import { requireLinkage, requireRevision } from "@/lib/review";
import { diffGraphs } from "@/shared/review/diff";

type P = { buildId: string; linkageId: string };

/** `?from=A&to=B`: what changed from revision A to revision B (defaults: the current one and the one before). */
export const GET = withBuild<P>("read", async ({ req, build, params }) => {
  const linkage = await requireLinkage(build.id, parseParams(params.linkageId, uuidParam));
  const sp = req.nextUrl.searchParams;
  const to = sp.get("to") ? parseParams(sp.get("to"), revisionQuery) : linkage.revision;
  const from = sp.get("from") ? parseParams(sp.get("from"), revisionQuery) : Math.max(1, to - 1);
  const [a, b] = await Promise.all([requireRevision(linkage.id, from), requireRevision(linkage.id, to)]);
  return json({
    from: { revision: a.revision, author: a.author, createdAt: a.createdAt },
    to: { revision: b.revision, author: b.author, createdAt: b.createdAt },
    diff: diffGraphs(a.graph, b.graph),
  });
});
