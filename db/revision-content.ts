import "server-only";
import { LRUCache } from "lru-cache";
import { db } from "./index";

/** A revision's graph and report as the JSON text PostgreSQL holds (db/linkages.ts storedRevision sends it on). */
export type RevisionContent = { graph: string; analysis: string | null };

/**
 * Revisions' JSON text by `content_id` (migration 20261204000900): a random id that is new whenever a row's graph
 * or report changes, so an entry is never stale and instances need not tell each other anything. Reading the
 * id with a request's access instead of the text saves PostgreSQL sending, and the app receiving, 33 KB for
 * each read of the demo pitch revision. Nothing here is the only copy of anything: a miss reads the row.
 * Bounded by size (LW_REVISION_CACHE_MB, 64 MB by default; 0 turns it off), least recently used first out; a
 * revision larger than an eighth of that is read each time rather than pushing out everything else. With the
 * cache off, every read of a revision takes two round trips (the access, then the text).
 */
const MAX_BYTES = cacheBytes(process.env.LW_REVISION_CACHE_MB);

/**
 * LW_REVISION_CACHE_MB as whole bytes (lru-cache takes integers only). A value that is no number of megabytes is
 * said in the log and the default used: a typo in a setting must not make every revision route fail.
 */
export function cacheBytes(raw: string | undefined): number {
  const DEFAULT = 64 * 1024 * 1024;
  if (raw === undefined || raw.trim() === "") return DEFAULT;
  const mb = Number(raw);
  if (!Number.isFinite(mb) || mb < 0) {
    console.warn(`LW_REVISION_CACHE_MB must be a number of megabytes, 0 or more; it is "${raw}", so 64 is used`);
    return DEFAULT;
  }
  return Math.floor(mb * 1024 * 1024);
}
const cache = MAX_BYTES > 0
  ? new LRUCache<string, RevisionContent>({
    maxSize: MAX_BYTES,
    maxEntrySize: Math.max(1, Math.floor(MAX_BYTES / 8)),
    // UTF-16 in memory: two bytes a character, plus the entry itself.
    sizeCalculation: (v) => 2 * (v.graph.length + (v.analysis?.length ?? 0)) + 200,
  })
  : null;

// By the row's id and what it is a revision of: a row id may be given again after a restore that resets its sequence.
const CONTENT_SQL = "select content_id, graph::text as graph, analysis::text as analysis from linkage_revisions where id = ? and linkage_id = ? and revision = ?";

/**
 * The JSON text of revision row `id` (revision `revision` of `linkageId`), whose content id was just read as `contentId`: from the cache, or read from
 * the row (and kept under the id it has then — newer than `contentId` if its report was refreshed in between,
 * which is the text to answer with anyway). Null when the row is gone (its linkage deleted in between).
 */
export async function revisionContent(ref: { id: string; linkageId: string; revision: number; contentId: string }): Promise<RevisionContent | null> {
  const hit = cache?.get(ref.contentId);
  if (hit) return hit;
  const { rows } = await db.raw(CONTENT_SQL, [ref.id, ref.linkageId, ref.revision]).options({ name: "lw_revision_content_v2" });
  const row = rows[0] as { content_id: string; graph: string; analysis: string | null } | undefined;
  if (!row) return null;
  const content = { graph: row.graph, analysis: row.analysis };
  cache?.set(row.content_id, content);
  return content;
}

/** What the cache holds now (tests and the bench). */
export const revisionCacheStats = () => ({ entries: cache?.size ?? 0, bytes: cache?.calculatedSize ?? 0, maxBytes: MAX_BYTES });
