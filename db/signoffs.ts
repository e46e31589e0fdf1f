import "server-only";
/** Sign-offs of revisions, the stale ones whose owners were not told yet, and the review state per linkage of a build. */
import { db } from "./index";
import { audit } from "./audit";
import { person, personName } from "./people";
import type { Signoff } from "@/shared/schemas/signoffs";
import { recordFingerprint } from "@/lib/record-fingerprint";

type SignoffRow = { id: string; linkage_id: string; revision: number; reviewer_id: string | null; reviewer_name: string | null; statement: string; created_at: Date; record_fingerprint: string | null };
const toSignoff = (r: SignoffRow, current: number): Signoff => ({
  id: r.id,
  revision: r.revision,
  reviewer: person(r.reviewer_id, r.reviewer_name),
  statement: r.statement,
  createdAt: r.created_at.toISOString(),
  stale: r.revision < current,
  fingerprint: r.record_fingerprint,
});

export async function listSignoffs(linkageId: string, currentRevision: number) {
  const rows = await db("signoffs as s")
    .leftJoin("users as u", "u.id", "s.reviewer_id")
    .where("s.linkage_id", linkageId)
    .orderBy("s.created_at", "desc")
    .orderBy("s.revision", "desc")
    .select("s.*", "u.name as reviewer_name");
  return rows.map((r: SignoffRow) => toSignoff(r, currentRevision));
}

/** Records a sign-off with the fingerprint of what it signs (lib/record-fingerprint.ts), in one transaction. */
export async function createSignoff(s: { buildId: string; linkageId: string; revision: number; reviewerId: string; statement: string; graph: unknown }) {
  const row = await db.transaction(async (trx) => {
    const [r] = await trx("signoffs").insert({ linkage_id: s.linkageId, revision: s.revision, reviewer_id: s.reviewerId, statement: s.statement }).returning(["id", "created_at"]);
    const fp = recordFingerprint({
      buildId: s.buildId, linkageId: s.linkageId, revision: s.revision, graph: s.graph,
      signoff: { id: r.id, reviewerId: s.reviewerId, statement: s.statement, signedAt: new Date(r.created_at).toISOString() },
    });
    await trx("signoffs").where({ id: r.id }).update({ record_fingerprint: fp });
    await audit({ buildId: s.buildId, userId: s.reviewerId, action: "linkage.signoff", detail: { linkageId: s.linkageId, revision: s.revision } }, trx);
    return r as { id: string };
  });
  return (await listSignoffs(s.linkageId, s.revision)).find((x) => x.id === row.id)!;
}

/** Per linkage: open threads and the newest sign-off (with whether a later revision made it stale). */
export async function reviewSummaryForBuild(buildId: string) {
  const open = await db("comments as c")
    .join("linkages as l", "l.id", "c.linkage_id")
    .where("l.build_id", buildId)
    .whereNull("c.parent_id")
    .whereNull("c.resolved_at")
    .groupBy("c.linkage_id")
    .select("c.linkage_id", db.raw("count(*)::int as n"));
  const latest = await db("signoffs as s")
    .join("linkages as l", "l.id", "s.linkage_id")
    .leftJoin("users as u", "u.id", "s.reviewer_id")
    .where("l.build_id", buildId)
    .distinctOn("s.linkage_id")
    .orderBy([{ column: "s.linkage_id" }, { column: "s.created_at", order: "desc" }])
    .select("s.linkage_id", "s.revision", "s.created_at", "u.name as reviewer_name", "l.current_revision");
  const out: Record<string, { unresolved: number; signoff: { revision: number; reviewerName: string; at: string; stale: boolean } | null }> = {};
  for (const r of open as { linkage_id: string; n: number }[]) out[r.linkage_id] = { unresolved: r.n, signoff: null };
  for (const r of latest as { linkage_id: string; revision: number; created_at: Date; reviewer_name: string | null; current_revision: number }[]) {
    out[r.linkage_id] ??= { unresolved: 0, signoff: null };
    out[r.linkage_id].signoff = { revision: r.revision, reviewerName: personName(r.reviewer_name), at: r.created_at.toISOString(), stale: r.revision < r.current_revision };
  }
  return out;
}

/** The newest sign-off of one revision, if any. */
export async function signoffOfRevision(linkageId: string, revision: number, currentRevision: number) {
  const r = await db("signoffs as s").leftJoin("users as u", "u.id", "s.reviewer_id").where({ "s.linkage_id": linkageId, "s.revision": revision }).orderBy("s.created_at", "desc").first("s.*", "u.name as reviewer_name");
  return r ? toSignoff(r as SignoffRow, currentRevision) : null;
}

/**
 * What a record's fingerprint names: the signed revision, its linkage and build, who signed and when, and
 * whether it still covers the linkage as it is (no later revision, linkage not deleted). Null when no
 * sign-off has that fingerprint.
 */
export async function signedRevisionByFingerprint(fingerprint: string) {
  const r = await db("signoffs as s")
    .join("linkages as l", "l.id", "s.linkage_id")
    .join("builds as b", "b.id", "l.build_id")
    .leftJoin("users as u", "u.id", "s.reviewer_id")
    .where("s.record_fingerprint", fingerprint)
    .first("s.revision", "s.created_at", "u.name as reviewer_name", "l.name as linkage_name", "l.current_revision", "b.name as build_name", "b.registration");
  if (!r) return null;
  return {
    buildName: r.build_name as string,
    registration: (r.registration as string | null) ?? null,
    linkageName: r.linkage_name as string,
    revision: r.revision as number,
    signedBy: personName(r.reviewer_name),
    signedAt: new Date(r.created_at).toISOString(),
    currentRevision: r.current_revision as number,
    current: r.revision === r.current_revision,
  };
}
