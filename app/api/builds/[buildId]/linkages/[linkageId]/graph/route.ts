import { withLinkage, jsonText } from "@/lib/http";
import { engineSave } from "@/lib/engine/threads";
import { notFound, staleRevision } from "@/lib/errors";
import { PREFER_MINIMAL, prefersMinimal } from "@/shared/prefer";
import { getRevision, revisionJson, saveRevision } from "@/db/linkages";
import { afterRevisionSaved } from "@/lib/review";

/** The current revision of the graph (or `?revision=N`), with the analysis stored beside it (sent on as stored). */
export const GET = withLinkage("read", { revision: "requested" }, async ({ revision }) => jsonText(revisionJson(revision)));

/** Save the next revision, only if `baseRevision` is still the current one (409 otherwise). */
export const PUT = withLinkage("edit", async ({ req, user, build, linkage }) => {
  const { id } = linkage;
  // Parsed, checked (shared/schemas/graph.ts graphPut), analysed and serialised in an engine thread: the report's
  // text is stored with the revision and sent back as the same text.
  const { baseRevision, graphJson, analysisJson, summaryJson } = await engineSave(req, build.analysisSettings);
  const saved = await saveRevision(build.id, id, baseRevision, graphJson, analysisJson, summaryJson, user.id);
  if (saved === "missing") throw notFound("linkage"); // deleted while this request ran
  if (saved === "stale") {
    const current = await getRevision(id);
    throw staleRevision(`Someone saved revision ${current?.revision} while you were editing revision ${baseRevision}.`, current);
  }
  await afterRevisionSaved(build, user, linkage, saved.revision, saved.staleSignoffs); // earlier sign-offs are now stale
  const head = `{"revision":${saved.revision},"createdAt":${JSON.stringify(saved.createdAt)}`;
  if (prefersMinimal(req.headers.get("prefer"))) {
    const res = jsonText(`${head},"summary":${summaryJson}}`);
    res.headers.set("Preference-Applied", PREFER_MINIMAL);
    return res;
  }
  return jsonText(`${head},"analysis":${analysisJson}}`);
});

