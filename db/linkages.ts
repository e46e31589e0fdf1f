import "server-only";
import type { Knex } from "knex";
import { db } from "./index";
import { audit } from "./audit";
import { person } from "./people";
import { countOf, keysetPage, type Key, type PageArgs } from "./paging";
import { emptyGraph, type ControlSystem, type LinkageGraph } from "@/shared/linkage/schema";
import type { Report } from "@/shared/analysis/types";
import type { Linkage, RevisionRow } from "@/shared/schemas/linkages";
import type { Revision } from "@/shared/schemas/graph";

export type LinkageRow = {
  id: string;
  build_id: string;
  name: string;
  system: ControlSystem;
  current_revision: number;
  created_at: Date;
  updated_at: Date;
};

export const toLinkage = (r: LinkageRow & { author_name?: string | null; summary?: Report["summary"] | null; part_count?: number | null }): Linkage => ({
  id: r.id,
  buildId: r.build_id,
  name: r.name,
  system: r.system,
  revision: r.current_revision,
  createdAt: r.created_at.toISOString(),
  updatedAt: r.updated_at.toISOString(),
  lastAuthor: r.author_name ?? null,
  summary: r.summary ?? null,
  parts: r.part_count ?? null,
});
export type { Linkage, Revision };

/**
 * The build's linkages with their current revision's author, findings counts and number of parts, in one query
 * (one row per linkage, each joined to its one current revision). The part count reads the length of the graph's
 * `nodes` array (the graph is read once per linkage, as the list is drawn): a list tells "nothing drawn yet"
 * from "checked, nothing open" by it, since an empty drawing's report counts no findings either.
 */
export async function listLinkages(buildId: string) {
  const rows = await db("linkages as l")
    .leftJoin("linkage_revisions as r", function () {
      this.on("r.linkage_id", "l.id").andOn("r.revision", "l.current_revision");
    })
    .leftJoin("users as u", "u.id", "r.author_id")
    .where("l.build_id", buildId)
    .select("l.*", "u.name as author_name", "r.summary", db.raw("json_array_length(r.graph -> 'nodes') as part_count"))
    .orderByRaw("array_position(array['pitch','roll','yaw','flap','trim','other']::text[], l.system::text), l.name");
  return rows.map(toLinkage);
}

/** The build's linkages by name only (id and name, in the list's order): for links, without reading any revision. */
export async function linkageNames(buildId: string): Promise<{ id: string; name: string }[]> {
  return db("linkages").where({ build_id: buildId }).select("id", "name")
    .orderByRaw("array_position(array['pitch','roll','yaw','flap','trim','other']::text[], system::text), name");
}

export async function getLinkage(buildId: string, linkageId: string) {
  const row = await db<LinkageRow>("linkages").where({ id: linkageId, build_id: buildId }).first();
  return row ? toLinkage(row) : null;
}

export async function createLinkage(
  buildId: string,
  userId: string,
  /** `analysisJson`: the engine's report of `graph` as JSON text (lib/engine/work.ts). */
  l: { name: string; system: ControlSystem; graph?: LinkageGraph; analysisJson?: string | null; summaryJson?: string | null },
) {
  return db.transaction(async (trx) => {
    const [row] = await trx<LinkageRow>("linkages")
      .insert({ build_id: buildId, name: l.name, system: l.system, current_revision: 1 })
      .returning("*");
    const graph = { ...(l.graph ?? emptyGraph(l.name, l.system)), name: l.name, system: l.system };
    await trx("linkage_revisions").insert({
      linkage_id: row.id,
      revision: 1,
      graph: JSON.stringify(graph),
      analysis: l.analysisJson ?? null,
      summary: l.summaryJson ?? null,
      author_id: userId,
    });
    await trx("builds").where({ id: buildId }).update({ updated_at: trx.fn.now() });
    await audit({ buildId, userId, action: "linkage.create", detail: { linkageId: row.id, name: l.name } }, trx);
    return toLinkage({ ...row, part_count: graph.nodes.length });
  });
}

/** Renames or re-files a linkage; the change and its audit event are one transaction. */
export async function updateLinkage(buildId: string, linkageId: string, userId: string, patch: { name?: string; system?: ControlSystem }) {
  return db.transaction(async (trx) => {
    const [row] = await trx<LinkageRow>("linkages")
      .where({ id: linkageId, build_id: buildId })
      .update({ ...patch, updated_at: trx.fn.now() })
      .returning("*");
    if (row) await audit({ buildId, userId, action: "linkage.update", detail: { linkageId, ...patch } }, trx);
    return row ? toLinkage(row) : null;
  });
}

export async function deleteLinkage(buildId: string, linkageId: string, userId: string) {
  return db.transaction(async (trx) => {
    // The name goes into the event, so the activity can say which linkage was deleted.
    const gone = await trx("linkages").where({ id: linkageId, build_id: buildId }).del().returning("name");
    if (gone.length) await audit({ buildId, userId, action: "linkage.delete", detail: { linkageId, name: gone[0].name } }, trx);
    return gone.length > 0;
  });
}

/** The revision read by getRevision (and by db/access.ts with a request's access): fixed texts, named prepared statements. */
const REVISION_COLS = "r.revision, r.graph::text as graph, r.analysis::text as analysis, r.author_id, u.name as author_name, r.created_at";
const REVISION_SQL = {
  current: `select ${REVISION_COLS} from linkage_revisions r join linkages l on l.id = r.linkage_id and r.revision = l.current_revision left join users u on u.id = r.author_id where r.linkage_id = ? limit 1`,
  numbered: `select ${REVISION_COLS} from linkage_revisions r left join users u on u.id = r.author_id where r.linkage_id = ? and r.revision = ? limit 1`,
};

export async function getRevision(linkageId: string, revision?: number): Promise<Revision | null> {
  const { rows } = revision === undefined
    ? await db.raw(REVISION_SQL.current, [linkageId]).options({ name: "lw_revision_current" })
    : await db.raw(REVISION_SQL.numbered, [linkageId, revision]).options({ name: "lw_revision_numbered" });
  return rows[0] ? storedRevision(rows[0]) : null;
}

/** The JSON text a revision was read with (see storedRevision). */
const STORED_JSON = Symbol("stored JSON");
type StoredJson = { graph: string; analysis: string | null };

/**
 * A revision whose graph and analysis stay the JSON text Postgres sent until first read: a route that reads
 * only the graph (comments: subject names) never parses the analysis, and one that answers with the revision
 * as stored (GET graph) sends that text on (revisionJson) instead of parsing and serialising 30 KB again.
 */
export type StoredRevisionRow = { revision: number; graph: string; analysis: string | null; author_id: string | null; author_name: string | null; created_at: Date };
export function storedRevision(row: StoredRevisionRow): Revision {
  let graph: LinkageGraph | undefined;
  let analysis: Report | null | undefined;
  const rev = { revision: row.revision } as Revision;
  Object.defineProperties(rev, {
    graph: { enumerable: true, get: () => (graph ??= JSON.parse(row.graph)) },
    analysis: { enumerable: true, get: () => (analysis === undefined ? (analysis = row.analysis === null ? null : JSON.parse(row.analysis)) : analysis) },
    [STORED_JSON]: { value: { graph: row.graph, analysis: row.analysis } satisfies StoredJson },
  });
  rev.author = person(row.author_id, row.author_name);
  rev.createdAt = row.created_at.toISOString();
  return rev;
}

/** The revision as JSON, with its graph and analysis as stored when it was read by getRevision: the same answer as JSON.stringify(rev). */
export function revisionJson(rev: Revision): string {
  const stored = (rev as Revision & { [STORED_JSON]?: StoredJson })[STORED_JSON];
  if (!stored) return JSON.stringify(rev);
  return `{"revision":${JSON.stringify(rev.revision)},"graph":${stored.graph},"analysis":${stored.analysis ?? "null"},"author":${JSON.stringify(rev.author)},"createdAt":${JSON.stringify(rev.createdAt)}}`;
}

/** A sign-off of an earlier revision that a save made stale, whose owners are told once (lib/review.ts). */
export type StaleSignoff = { id: string; revision: number; reviewerName: string };

/**
 * Optimistic concurrency: the next revision is written only if `baseRevision` is still current.
 * Returns the new revision with the sign-offs it made stale, "stale" (someone saved first) or "missing".
 * One statement (atomic as a transaction is, in one round trip instead of six): the linkage's revision moves
 * on only where it is still `baseRevision` (a concurrent save waits on the row and then finds it moved), the
 * revision row is written from that update's result, the build is touched and the sign-offs of earlier
 * revisions not yet told about are marked told, each only if it happened. A fixed text, prepared once per
 * connection.
 */
const SAVE_SQL = `with moved as (
    update linkages set current_revision = current_revision + 1, updated_at = now()
    where id = :linkageId and build_id = :buildId and current_revision = :baseRevision
    returning id, current_revision
  ), saved as (
    insert into linkage_revisions (linkage_id, revision, graph, analysis, summary, author_id)
    select id, current_revision, cast(:graph as json), cast(:analysis as json), cast(:summary as jsonb), :userId from moved
    returning revision, created_at
  ), touched as (
    -- The builds list shows the day a build changed and sorts by it: its row is written at most once a minute, not
    -- on every autosave, so members saving at once do not queue on one row (and PostgreSQL does a fifth less work
    -- a save: 0.64 -> 0.52 ms, measured alone with 8 clients, 2026-12-05).
    update builds set updated_at = now() where id = :buildId and updated_at < now() - interval '1 minute' and exists (select 1 from moved)
  ), stale as (
    update signoffs s set stale_notified_at = now() from moved
    where s.linkage_id = moved.id and s.revision < moved.current_revision and s.stale_notified_at is null
    returning s.id, s.revision, s.reviewer_id
  )
  select saved.revision, saved.created_at,
    (select coalesce(json_agg(json_build_object('id', st.id, 'revision', st.revision, 'reviewerName', coalesce(nullif(ru.name, ''), 'a reviewer')) order by st.revision), '[]')
     from stale st left join users ru on ru.id = st.reviewer_id)::text as stale
  from saved`;

export async function saveRevision(
  buildId: string,
  linkageId: string,
  baseRevision: number,
  /** The graph as JSON text, checked against the graph schema (lib/engine/work.ts). */
  graphJson: string,
  /** The engine's report as JSON text (the route sends the same text back: serialised once) and its summary's. */
  analysisJson: string,
  summaryJson: string,
  userId: string,
): Promise<{ revision: number; createdAt: string; staleSignoffs: StaleSignoff[] } | "stale" | "missing"> {
  const { rows } = await db.raw(SAVE_SQL, { linkageId, buildId, baseRevision, graph: graphJson, analysis: analysisJson, summary: summaryJson, userId }).options({ name: "lw_save_revision" });
  const rev = rows[0] as { revision: number; created_at: Date; stale: string } | undefined;
  // Not put in the revision cache: text kept from every save would pass through the old generation of the heap and
  // cost each save about 1 ms of garbage collection (bench:load, 2026-12-04); the first read after a save reads it.
  if (rev) return { revision: rev.revision, createdAt: rev.created_at.toISOString(), staleSignoffs: JSON.parse(rev.stale) };
  const exists = await db("linkages").where({ id: linkageId, build_id: buildId }).first("id");
  return exists ? "stale" : "missing";
}

/** Revisions newest first: the number is the key. */
export const REVISION_KEYS: Key[] = [{ expr: "r.revision", type: "int" }];

/** One page of the revision history (newest first, with the findings counts stored with each) and how many revisions there are. */
export async function pageRevisions(linkageId: string, page: PageArgs) {
  type Row = { revision: number; author_id: string | null; author_name: string | null; created_at: Date; summary: Report["summary"] | null };
  const [p, total] = await Promise.all([
    keysetPage<Row>(db("linkage_revisions as r").leftJoin("users as u", "u.id", "r.author_id").where("r.linkage_id", linkageId)
      .select("r.revision", "r.author_id", "u.name as author_name", "r.created_at", "r.summary"), REVISION_KEYS, page),
    countOf(db("linkage_revisions as r").where("r.linkage_id", linkageId)),
  ]);
  const items = p.items.map((r): RevisionRow => ({
    revision: r.revision,
    author: person(r.author_id, r.author_name),
    createdAt: r.created_at.toISOString(),
    summary: r.summary ? { hazard: r.summary.hazard, caution: r.summary.caution, advisory: r.summary.advisory } : null,
  }));
  return { items, next: p.next, total };
}

export async function countRevisions(linkageId: string) {
  const [{ count }] = await db("linkage_revisions").where({ linkage_id: linkageId }).count<{ count: string }[]>("* as count");
  return Number(count);
}

/**
 * After the build's design settings change, the stored analysis of each linkage's current revision
 * is computed again with the new settings (older revisions keep the analysis they were saved with).
 */
export async function refreshCurrentAnalyses(buildId: string, run: (graph: LinkageGraph) => Report, trx: Knex = db) {
  const rows = await trx("linkages as l")
    .join("linkage_revisions as r", function () {
      this.on("r.linkage_id", "l.id").andOn("r.revision", "l.current_revision");
    })
    .where("l.build_id", buildId)
    .select("r.id", "r.graph");
  for (const r of rows as { id: string; graph: LinkageGraph }[]) {
    const report = run(r.graph);
    await trx("linkage_revisions").where({ id: r.id }).update({ analysis: JSON.stringify(report), summary: JSON.stringify(report.summary) });
  }
  return rows.length;
}
