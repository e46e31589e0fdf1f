import "server-only";
import { db } from "@/db/index";
import { deleteObject, eachObjectPage, objectWrittenAt } from "./storage";

/**
 * Removes stored objects that no row names. An upload writes its objects first and its row after
 * (lib/uploads.ts), and an export writes its file before it records it (lib/jobs/worker.ts), so a
 * process killed between the two leaves an object behind that nothing will ever show or delete.
 *
 * Only objects written more than ORPHAN_MIN_AGE_MS ago are touched: a younger one may belong to an
 * upload or export still on its way to its row. Only keys of the shapes this app writes are considered,
 * and each is looked up by the id in it (a primary key), so the sweep is linear in the objects stored:
 *   builds/<build>/files/<file id>.<ext>      files.key
 *   builds/<build>/thumbs/<file id>.jpg       files.thumb_key
 *   builds/<build>/exports/<job id>/<name>    export_jobs.result_key
 * Anything else in the bucket is left alone.
 */
export const ORPHAN_MIN_AGE_MS = 60 * 60 * 1000; // an hour: far longer than any upload or export takes from its object to its row — common practice, no source

const UUID = "[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}";
const FILE_KEY = new RegExp(`^builds/${UUID}/(files|thumbs)/(${UUID})\\.[a-z0-9]+$`);
const EXPORT_KEY = new RegExp(`^builds/${UUID}/exports/(${UUID})/[^/]+$`);

type Owner = { table: "files" | "export_jobs"; id: string };
export function ownerOf(key: string): Owner | null {
  const f = FILE_KEY.exec(key);
  if (f) return { table: "files", id: f[2] };
  const e = EXPORT_KEY.exec(key);
  if (e) return { table: "export_jobs", id: e[1] };
  return null;
}

/** Of these keys (all of a shape `ownerOf` knows), the ones a row names. */
async function named(keys: string[]): Promise<Set<string>> {
  const owners = keys.map((k) => ownerOf(k)!);
  const fileIds = [...new Set(owners.filter((o) => o.table === "files").map((o) => o.id))];
  const jobIds = [...new Set(owners.filter((o) => o.table === "export_jobs").map((o) => o.id))];
  const out = new Set<string>();
  if (fileIds.length) for (const r of await db("files").whereIn("id", fileIds).select<{ key: string; thumb_key: string | null }[]>("key", "thumb_key")) {
    out.add(r.key);
    if (r.thumb_key) out.add(r.thumb_key);
  }
  if (jobIds.length) for (const r of await db("export_jobs").whereIn("id", jobIds).whereNotNull("result_key").select<{ result_key: string }[]>("result_key")) out.add(r.result_key);
  return out;
}

export type SweepResult = { listed: number; removed: string[]; young: number; other: number };

/** One pass over the bucket; `now` is for tests of the age rule. */
export async function sweepOrphans(o: { now?: number; minAgeMs?: number } = {}): Promise<SweepResult> {
  const cutoff = (o.now ?? Date.now()) - (o.minAgeMs ?? ORPHAN_MIN_AGE_MS);
  const result: SweepResult = { listed: 0, removed: [], young: 0, other: 0 };
  for await (const page of eachObjectPage("builds/")) {
    result.listed += page.length;
    const old: string[] = [];
    for (const x of page) {
      if (!ownerOf(x.key)) result.other++;
      else if (x.writtenAt.getTime() >= cutoff) result.young++;
      else old.push(x.key);
    }
    if (!old.length) continue;
    const kept = await named(old);
    for (const key of old) {
      if (kept.has(key)) continue;
      // Just before deleting, once more: still old (not written again since the listing) and still nameless.
      const at = await objectWrittenAt(key);
      if (!at || at.getTime() >= cutoff || (await named([key])).size) continue;
      await deleteObject(key);
      result.removed.push(key);
    }
  }
  return result;
}
