import "server-only";
import { db } from "./index";
import { audit } from "./audit";
import { filesByIds, type StoredFile } from "./files";
import { countOf, keysetPage, type Key, type Page, type PageArgs } from "./paging";
import type { ControlSystem } from "@/shared/linkage/schema";
import type { LogEntry, LogFilter, LogTotals } from "@/shared/schemas/log";
export type { LogEntry, LogFilter };

type EntryRow = {
  id: string; build_id: string; date: string | Date; hours: string; title: string; text: string; systems: ControlSystem[];
  linkage_id: string | null; revision: number | null; author_id: string | null; created_at: Date; updated_at: Date;
  author_name?: string | null; linkage_name?: string | null;
  revision_summary?: { hazard: number; caution: number; advisory: number } | null;
  has_picture?: boolean | null;
};

const isoDay = (d: string | Date) => (typeof d === "string" ? d.slice(0, 10) : `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, "0")}-${String(d.getDate()).padStart(2, "0")}`);

const toEntry = (r: EntryRow, files: StoredFile[] = []): LogEntry => ({
  id: r.id,
  date: isoDay(r.date),
  hours: Number(r.hours),
  title: r.title,
  text: r.text,
  systems: r.systems ?? [],
  linkageId: r.linkage_id,
  linkageName: r.linkage_name ?? null,
  revision: r.revision,
  /** Findings counts of the tied revision, as stored with it. */
  revisionSummary: r.revision_summary ? { hazard: r.revision_summary.hazard, caution: r.revision_summary.caution, advisory: r.revision_summary.advisory } : null,
  hasPicture: !!r.has_picture,
  author: r.author_name ?? null,
  createdAt: r.created_at.toISOString(),
  updatedAt: r.updated_at.toISOString(),
  files,
});


/** No filter: the whole log (its counts and totals come from `log_month_hours`). */
const unfiltered = (f: LogFilter) => !f.system && !f.from && !f.to && !(f.q && f.q.trim());

function filtered(buildId: string, f: LogFilter) {
  const q = db("log_entries as e").where("e.build_id", buildId);
  if (f.system) q.whereRaw("? = any(e.systems)", [f.system]);
  if (f.from) q.where("e.date", ">=", f.from);
  if (f.to) q.where("e.date", "<=", f.to);
  if (f.q && f.q.trim()) {
    const like = `%${f.q.trim().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    q.where((w) => w.whereILike("e.title", like).orWhereILike("e.text", like));
  }
  return q;
}

async function attachFiles(buildId: string, rows: EntryRow[]) {
  if (!rows.length) return [];
  const links = await db("log_entry_files").whereIn("entry_id", rows.map((r) => r.id)).orderBy("position");
  const files = await filesByIds(buildId, [...new Set(links.map((l: { file_id: string }) => l.file_id))]);
  const byId = new Map(files.map((f) => [f.id, f]));
  const byEntry = new Map<string, StoredFile[]>();
  for (const l of links as { entry_id: string; file_id: string }[]) {
    const f = byId.get(l.file_id);
    if (f) byEntry.set(l.entry_id, [...(byEntry.get(l.entry_id) ?? []), f]);
  }
  return rows.map((r) => toEntry(r, byEntry.get(r.id) ?? []));
}

/** Whether the tied revision's picture was kept (the entry shows it, or says how to keep one). */
const pictureKept = () => db.raw("exists (select 1 from revision_pictures rp where rp.linkage_id = e.linkage_id and rp.revision = e.revision) as has_picture");

const withJoins = (q: ReturnType<typeof filtered>) => q
  .leftJoin("users as u", "u.id", "e.author_id")
  .leftJoin("linkages as l", "l.id", "e.linkage_id")
  .leftJoin("linkage_revisions as lr", function () {
    this.on("lr.linkage_id", "e.linkage_id").andOn("lr.revision", "e.revision");
  })
  .select("e.*", "u.name as author_name", "l.name as linkage_name", "lr.summary as revision_summary", pictureKept());

/** The log's order, newest first: by date, then by when it was written (the id breaks ties). */
export const LOG_KEYS: Key[] = [{ expr: "e.date", type: "date" }, { expr: "e.created_at", type: "timestamptz" }, { expr: "e.id", type: "uuid" }];

/** How many entries the build's log holds (from the monthly rows the trigger keeps). */
async function entryCount(buildId: string) {
  const [r] = await db("log_month_hours").where({ build_id: buildId, system: "*" }).sum<{ n: string | null }[]>("entries as n");
  return Number(r?.n ?? 0);
}

/** One page of the filtered entries (newest first) and how many match in all. */
export async function pageEntries(buildId: string, f: LogFilter, page: PageArgs) {
  const [p, total] = await Promise.all([keysetPage<EntryRow>(withJoins(filtered(buildId, f)), LOG_KEYS, page), unfiltered(f) ? entryCount(buildId) : countOf(filtered(buildId, f))]);
  return { items: await attachFiles(buildId, p.items), next: p.next, total };
}

/** Every filtered entry, oldest first, a page at a time (for exports: memory holds one page of rows). */
export async function* eachEntry(buildId: string, f: LogFilter, pageSize = 250) {
  let after: string[] | null = null;
  for (;;) {
    const p: Page<EntryRow> = await keysetPage<EntryRow>(withJoins(filtered(buildId, f)), LOG_KEYS, { limit: pageSize, after }, "asc");
    if (p.items.length) yield await attachFiles(buildId, p.items);
    if (!p.next) return;
    after = p.next;
  }
}

/** How many entries, photos (and their thumbnails' bytes) and tied revisions a filter covers: the export's size estimate. */
export async function logSize(buildId: string, f: LogFilter) {
  const [r] = await filtered(buildId, f)
    .leftJoin("log_entry_files as lf", "lf.entry_id", "e.id")
    .leftJoin("files as fi", function () { this.on("fi.id", "lf.file_id").andOnVal("fi.kind", "photo"); })
    .select(
      db.raw("count(distinct e.id)::int as entries"),
      db.raw("count(distinct fi.id)::int as photos"),
      db.raw("count(distinct (e.linkage_id, e.revision)) filter (where e.linkage_id is not null)::int as revisions"),
    );
  const [b] = await db("files as fi")
    .whereIn("fi.id", filtered(buildId, f).join("log_entry_files as lf", "lf.entry_id", "e.id").select("lf.file_id"))
    .where("fi.kind", "photo")
    // A photo without a recorded thumbnail size counts as 25 kB (common practice, no source: a 320 px JPEG).
    .select(db.raw("coalesce(sum(coalesce(fi.thumb_size, 25000)), 0)::bigint as bytes"));
  return { entries: Number(r.entries), photos: Number(r.photos), photoBytes: Number(b.bytes), revisions: Number(r.revisions) };
}

/** Rows of (month, system, hours); system '*' is every entry once (the month's real total). */
type MonthRow = { month: string; system: string; hours: string };

function toTotals(rows: MonthRow[]): LogTotals {
  const bySystem: Record<string, number> = {};
  const byMonth: Record<string, Record<string, number>> = {};
  let total = 0;
  for (const r of rows) {
    const h = Number(r.hours);
    const m = (byMonth[r.month] ??= {});
    if (r.system === "*") { m.total = h; total += h; continue; }
    bySystem[r.system] = (bySystem[r.system] ?? 0) + h;
    m[r.system] = h;
  }
  const months = Object.keys(byMonth).sort().map((month) => ({ month, ...byMonth[month], total: byMonth[month].total ?? 0 }));
  return { total: Math.round(total * 100) / 100, bySystem, byMonth: months };
}

/**
 * Hours by system and by month over every filtered entry, summed in the database. An entry with
 * several systems counts toward each (so the per-system rows may add up to more than the total); a
 * month's total counts it once. Without a filter they come from `log_month_hours`, which a trigger
 * keeps up to date (a few rows a month instead of every entry of the build).
 */
export async function hourTotals(buildId: string, f: LogFilter = {}): Promise<LogTotals> {
  if (unfiltered(f)) {
    const rows = await db("log_month_hours").where({ build_id: buildId }).where("entries", ">", 0).select("month", "system", "hours");
    return toTotals(rows as MonthRow[]);
  }
  const rows = await filtered(buildId, f)
    .joinRaw("cross join lateral unnest(array['*']::text[] || case when cardinality(e.systems) = 0 then array['unassigned']::text[] else e.systems end) as s(system)")
    .select(db.raw("to_char(e.date, 'YYYY-MM') as month"), "s.system", db.raw("sum(e.hours) as hours"))
    .groupByRaw("1, 2");
  return toTotals(rows as MonthRow[]);
}

export async function getEntry(buildId: string, id: string) {
  const row = await db("log_entries as e")
    .leftJoin("users as u", "u.id", "e.author_id")
    .leftJoin("linkages as l", "l.id", "e.linkage_id")
    .leftJoin("linkage_revisions as lr", function () {
      this.on("lr.linkage_id", "e.linkage_id").andOn("lr.revision", "e.revision");
    })
    .where({ "e.build_id": buildId, "e.id": id })
    .first("e.*", "u.name as author_name", "l.name as linkage_name", "lr.summary as revision_summary", pictureKept());
  return row ? (await attachFiles(buildId, [row]))[0] : null;
}

type EntryValues = { date: string; hours: number; title: string; text: string; systems: ControlSystem[]; linkageId?: string | null; revision?: number | null; fileIds: string[] };

/** Returns "bad_files" when a file id is not one of this build's files, "bad_linkage" for a foreign linkage or revision. */
async function checkRefs(buildId: string, v: Partial<EntryValues>) {
  if (v.fileIds?.length) {
    const [{ n }] = await db("files").where("build_id", buildId).whereIn("id", v.fileIds).count<{ n: string }[]>("* as n");
    if (Number(n) !== new Set(v.fileIds).size) return "bad_files" as const;
  }
  if (v.linkageId) {
    const l = await db("linkages").where({ id: v.linkageId, build_id: buildId }).first("current_revision");
    if (!l) return "bad_linkage" as const;
    if (v.revision && !(await db("linkage_revisions").where({ linkage_id: v.linkageId, revision: v.revision }).first("id"))) return "bad_revision" as const;
  }
  return null;
}

export async function createEntry(buildId: string, userId: string, v: EntryValues) {
  const bad = await checkRefs(buildId, v);
  if (bad) return bad;
  let revision = v.revision ?? null;
  if (v.linkageId && !revision) revision = (await db("linkages").where({ id: v.linkageId }).first("current_revision")).current_revision;
  return db.transaction(async (trx) => {
    const [row] = await trx("log_entries")
      .insert({ build_id: buildId, date: v.date, hours: v.hours, title: v.title, text: v.text, systems: v.systems, linkage_id: v.linkageId ?? null, revision: v.linkageId ? revision : null, author_id: userId })
      .returning("id");
    const ids = [...new Set(v.fileIds)];
    if (ids.length) await trx("log_entry_files").insert(ids.map((file_id, position) => ({ entry_id: row.id, file_id, position })));
    await audit({ buildId, userId, action: "log.create", detail: { entryId: row.id, title: v.title } }, trx);
    return row.id as string;
  });
}

export async function updateEntry(buildId: string, id: string, userId: string, v: Partial<EntryValues>) {
  const stored = await db("log_entries").where({ build_id: buildId, id }).first<{ linkage_id: string | null } | undefined>("linkage_id");
  if (!stored) return "missing" as const;
  // A revision is checked against the linkage the entry will name: the patched one, else the stored one.
  const linkageId = v.linkageId !== undefined ? v.linkageId : stored.linkage_id;
  if (v.revision && !linkageId) return "bad_revision" as const;
  const bad = await checkRefs(buildId, { ...v, linkageId: v.revision ? linkageId : v.linkageId });
  if (bad) return bad;
  // Moved to another linkage without a revision: its current one, as for a new entry (the old number is not its).
  let revision = v.revision;
  if (v.linkageId && v.linkageId !== stored.linkage_id && !v.revision) revision = (await db("linkages").where({ id: v.linkageId }).first("current_revision")).current_revision;
  return db.transaction(async (trx) => {
    const values: Record<string, unknown> = { updated_at: trx.fn.now() };
    for (const k of ["date", "hours", "title", "text", "systems"] as const) if (v[k] !== undefined) values[k] = v[k];
    if (revision !== undefined) values.revision = revision;
    if (v.linkageId !== undefined) values.linkage_id = v.linkageId;
    if (v.linkageId === null) values.revision = null;
    const n = await trx("log_entries").where({ build_id: buildId, id }).update(values);
    if (!n) return "missing" as const;
    if (v.fileIds) {
      await trx("log_entry_files").where({ entry_id: id }).del();
      const ids = [...new Set(v.fileIds)];
      if (ids.length) await trx("log_entry_files").insert(ids.map((file_id, position) => ({ entry_id: id, file_id, position })));
    }
    await audit({ buildId, userId, action: "log.update", detail: { entryId: id } }, trx);
    return "ok" as const;
  });
}

export async function deleteEntry(buildId: string, id: string, userId: string) {
  return db.transaction(async (trx) => {
    const n = await trx("log_entries").where({ build_id: buildId, id }).del();
    if (n) await audit({ buildId, userId, action: "log.delete", detail: { entryId: id } }, trx);
    return n > 0;
  });
}

/** The latest few entries, for the build overview (no files). */
export async function recentEntries(buildId: string, limit = 5) {
  const rows = await db("log_entries as e")
    .leftJoin("users as u", "u.id", "e.author_id")
    .where("e.build_id", buildId)
    .select("e.*", "u.name as author_name")
    .orderBy([{ column: "e.date", order: "desc" }, { column: "e.created_at", order: "desc" }])
    .limit(limit);
  return (rows as EntryRow[]).map((r) => toEntry(r));
}
