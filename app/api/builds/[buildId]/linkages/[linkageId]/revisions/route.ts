import { withLinkage, json } from "@/lib/http";
import { listRevisions } from "@/db/linkages";

/** The revision history, newest first: number, author, time and the counts of findings. */
export const GET = withLinkage("read", async ({ linkage }) =>
  json({ currentRevision: linkage.revision, revisions: await listRevisions(linkage.id) }),
);
