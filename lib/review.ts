import "server-only";
/** What the review routes share: the report of a revision, names of subjects, hooks after a save. */
import type { Linkage, Revision, StaleSignoff } from "@/db/linkages";
import { buildOwners } from "@/db/builds";
import type { Build } from "@/db/builds";
import type { SessionUser } from "./auth";
import { analyze } from "@/shared/analysis";
import type { Report, Subject } from "@/shared/analysis/types";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { notifyStale } from "./review-mail";

/** The analysis stored with a revision; revisions saved before the engine ran get it computed now. */
export function reportOf(build: Build, rev: Revision): Report {
  return rev.analysis ?? analyze(rev.graph, build.analysisSettings);
}

export function subjectExists(graph: LinkageGraph, s: Subject, linkageId: string) {
  if (s.type === "node") return graph.nodes.some((n) => n.id === s.id);
  if (s.type === "joint") return graph.joints.some((j) => j.id === s.id);
  return s.id === linkageId;
}

/**
 * After a new revision is saved: sign-offs of earlier revisions are stale; tell the owners once. `stale` is what
 * the save marked told (saveRevision does it in the same statement).
 */
export async function afterRevisionSaved(build: Build, user: SessionUser, linkage: Linkage, revision: number, stale: StaleSignoff[]) {
  if (stale.length === 0) return;
  try {
    await notifyStale({
      owners: await buildOwners(build.id),
      editorId: user.id,
      editorName: user.name,
      buildId: build.id,
      buildName: build.name,
      linkageId: linkage.id,
      linkageName: linkage.name,
      signed: stale,
      newRevision: revision,
    });
  } catch (e) {
    // The save itself succeeded; a mail problem must not turn it into an error.
    console.error("[review] stale sign-off notice failed", e);
  }
}
