import { withLinkage, parseParams, json, getRevisionOrThrow } from "@/lib/http";
import { revisionQuery } from "@/shared/schemas/common";
import { diffGraphs } from "@/shared/review/diff";

/** `?from=A&to=B`: what changed from revision A to revision B (defaults: the current one and the one before). */
export const GET = withLinkage("read", async ({ req, linkage }) => {
  const sp = req.nextUrl.searchParams;
  const to = sp.get("to") ? parseParams(sp.get("to"), revisionQuery) : linkage.revision;
  const from = sp.get("from") ? parseParams(sp.get("from"), revisionQuery) : Math.max(1, to - 1);
  const [a, b] = await Promise.all([getRevisionOrThrow(linkage.id, from), getRevisionOrThrow(linkage.id, to)]);
  return json({
    from: { revision: a.revision, author: a.author, createdAt: a.createdAt },
    to: { revision: b.revision, author: b.author, createdAt: b.createdAt },
    diff: diffGraphs(a.graph, b.graph),
  });
});
