import knex from "knex";
import bcrypt from "bcryptjs";
import { randomUUID } from "node:crypto";
import { TEST_DB_URL } from "./env";
import type { Role } from "@/shared/roles";
import { emptyGraph } from "@/shared/linkage/schema";

/** Direct access to the test database for fixtures and for checking what a request changed. */
export const testDb = knex({ client: "pg", connection: TEST_DB_URL, pool: { min: 0, max: 5 } });

export const TEST_PASSWORD = "correct horse battery staple";
let hash: string | null = null;

export async function makeUser(label: string) {
  hash ??= await bcrypt.hash(TEST_PASSWORD, 4);
  const email = `${label}-${randomUUID().slice(0, 8)}@tests.linkwright.test`;
  const [row] = await testDb("users").insert({ email, name: `Test ${label}`, password_hash: hash }).returning(["id", "email", "name"]);
  return row as { id: string; email: string; name: string };
}

/** A build with one member per role (and an extra builder to act on), a linkage at revision 1 and an open invitation. */
export async function makeBuild(members: Partial<Record<Role, { id: string }>> & { extra?: { id: string } }) {
  const [build] = await testDb("builds").insert({ name: `Build ${randomUUID().slice(0, 6)}`, model: "test model" }).returning("id");
  for (const role of ["owner", "builder", "reviewer", "viewer"] as const) {
    const u = members[role];
    if (u) await testDb("memberships").insert({ build_id: build.id, user_id: u.id, role });
  }
  if (members.extra) await testDb("memberships").insert({ build_id: build.id, user_id: members.extra.id, role: "builder" });
  const [linkage] = await testDb("linkages").insert({ build_id: build.id, name: "Pitch run", system: "pitch", current_revision: 1 }).returning("id");
  await testDb("linkage_revisions").insert({ linkage_id: linkage.id, revision: 1, graph: JSON.stringify(emptyGraph("Pitch run", "pitch")), author_id: members.owner?.id ?? null });
  const [inv] = await testDb("invitations")
    .insert({ build_id: build.id, email: "invitee@tests.linkwright.test", role: "viewer", token_hash: randomUUID().replace(/-/g, ""), expires_at: testDb.raw("now() + interval '1 day'") })
    .returning("id");
  return { buildId: build.id as string, linkageId: linkage.id as string, invitationId: inv.id as string };
}

/**
 * Each table's content digest, remembered under the versions of its rows that it was made from: a row's
 * version (ctid, xmin) is new on every insert and update, and the same versions are the same rows, so a
 * table whose versions have not moved has the digest it had, and only a table that was written is read
 * whole again.
 */
const digests = new Map<string, { versions: string; digest: string }>();

/** A fingerprint of every application table: equal fingerprints mean no row changed. */
export async function snapshot() {
  // One snapshot of the database for every table (a repeatable-read transaction), so a digest and the versions
  // it is remembered under describe the same rows.
  return testDb.transaction(async (trx) => {
    const tables = (await trx.raw("select tablename from pg_tables where schemaname = 'public' and tablename not like 'knex_%' and tablename not in ('sign_in_attempts', 'audit_events') order by 1")).rows as { tablename: string }[];
    // Every table's row versions in one query.
    const versions = new Map(((await trx.raw(tables.map(({ tablename }) => `select '${tablename}' as t, count(*)::int || ':' || coalesce(md5(string_agg(ctid::text || '/' || xmin::text, ',' order by ctid)), '') as v from "${tablename}"`).join(" union all "))).rows as { t: string; v: string }[]).map((r) => [r.t, r.v]));
    const out: Record<string, string> = {};
    for (const { tablename } of tables) {
      const v = versions.get(tablename)!;
      const known = digests.get(tablename);
      if (known?.versions === v) {
        out[tablename] = known.digest;
        continue;
      }
      // Of export_jobs only what a request writes: the export worker moves other tests' jobs on (status, progress,
      // heartbeat, result) at any moment.
      // Of file_thumbnails the bytes' digest: the same change found without sorting kilobytes of hex per row.
      const rows = tablename === "export_jobs" ? "(select id, build_id, user_id, kind, params, label, created_at from export_jobs)"
        : tablename === "file_thumbnails" ? "(select file_id, md5(bytes) as bytes from file_thumbnails)" : `"${tablename}"`;
      // Each row's digest, sorted: a whole-row text sort costs as much as the rows are long (stored graphs are).
      const r = await trx.raw(`select count(*)::int as n, coalesce(md5(string_agg(md5(t::text), '|' order by md5(t::text))), '') as h from ${rows} t`);
      out[tablename] = `${r.rows[0].n}:${r.rows[0].h}`;
      digests.set(tablename, { versions: v, digest: out[tablename] });
    }
    return out;
  }, { isolationLevel: "repeatable read", readOnly: true });
}
