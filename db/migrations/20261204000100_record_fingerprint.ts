import { createHash } from "node:crypto";
import type { Knex } from "knex";

// Version 1 of lib/record-fingerprint.ts, kept here as it was so this migration does not change with it
// (and runs from a copied migrations folder): SHA-256 of the value as JSON with its object keys sorted.
function sorted(v: unknown): string {
  if (v === undefined) return "null";
  if (v === null || typeof v !== "object") return JSON.stringify(v);
  if (Array.isArray(v)) return `[${v.map(sorted).join(",")}]`;
  const o = v as Record<string, unknown>;
  return `{${Object.keys(o).filter((k) => o[k] !== undefined).sort().map((k) => `${JSON.stringify(k)}:${sorted(o[k])}`).join(",")}}`;
}
const recordFingerprint = (s: object) => createHash("sha256").update(sorted({ v: 1, ...s }), "utf8").digest("hex");

/**
 * Each sign-off keeps the fingerprint of what it signed (lib/record-fingerprint.ts), printed on the revision's
 * record PDF and looked up by the verification page. Sign-offs made before this migration get theirs here,
 * from their revision's stored graph, a page of rows at a time.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("signoffs", (t) => {
    t.string("record_fingerprint", 64).nullable().unique();
  });
  let after = "";
  for (;;) {
    const rows = await knex("signoffs as s")
      .join("linkages as l", "l.id", "s.linkage_id")
      .join("linkage_revisions as r", function () { this.on("r.linkage_id", "s.linkage_id").andOn("r.revision", "s.revision"); })
      .where("s.id", ">", after || "00000000-0000-0000-0000-000000000000")
      .orderBy("s.id")
      .limit(200)
      .select("s.id", "s.linkage_id", "s.revision", "s.reviewer_id", "s.statement", "s.created_at", "l.build_id", "r.graph");
    if (rows.length === 0) break;
    for (const r of rows) {
      const fp = recordFingerprint({
        buildId: r.build_id, linkageId: r.linkage_id, revision: r.revision, graph: r.graph,
        signoff: { id: r.id, reviewerId: r.reviewer_id, statement: r.statement, signedAt: new Date(r.created_at).toISOString() },
      });
      await knex("signoffs").where({ id: r.id }).update({ record_fingerprint: fp });
    }
    after = rows[rows.length - 1].id;
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("signoffs", (t) => {
    t.dropColumn("record_fingerprint");
  });
}
