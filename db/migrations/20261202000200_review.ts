import type { Knex } from "knex";

/**
 * Review and sign-off: comment threads on a node, a joint or a whole linkage; acknowledgements of
 * findings (bound to the subject's hardware fingerprint, so they lapse when it changes); sign-offs of
 * an exact linkage revision; who follows a linkage; each user's e-mail preference.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("users", (t) => {
    t.enu("notify", ["all", "mentions_signoffs", "none"]).notNullable().defaultTo("all");
  });

  await knex.schema.createTable("comments", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("build_id").notNullable().references("builds.id").onDelete("CASCADE");
    t.uuid("linkage_id").notNullable().references("linkages.id").onDelete("CASCADE");
    t.enu("subject_type", ["node", "joint", "linkage"]).notNullable();
    t.string("subject_id", 64).notNullable();
    /** Replies point at the first comment of their thread; a thread's root has none. */
    t.uuid("parent_id").nullable().references("comments.id").onDelete("CASCADE");
    t.uuid("author_id").nullable().references("users.id").onDelete("SET NULL");
    t.text("body").notNullable();
    /** The revision that was current when the comment was written. */
    t.integer("revision").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("edited_at", { useTz: true }).nullable();
    /** Set on a thread's root only. */
    t.timestamp("resolved_at", { useTz: true }).nullable();
    t.uuid("resolved_by").nullable().references("users.id").onDelete("SET NULL");
  });
  await knex.raw("create index comments_linkage on comments (linkage_id, subject_type, subject_id, created_at)");
  await knex.raw("create index comments_parent on comments (parent_id)");

  await knex.schema.createTable("finding_acknowledgements", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("linkage_id").notNullable().references("linkages.id").onDelete("CASCADE");
    t.string("code", 80).notNullable();
    t.enu("subject_type", ["node", "joint", "linkage"]).notNullable();
    t.string("subject_id", 64).notNullable();
    t.text("reason").notNullable();
    t.uuid("user_id").nullable().references("users.id").onDelete("SET NULL");
    t.integer("revision").notNullable();
    /** Stable hash of the subject's hardware (joint) or props (node) when acknowledged. */
    t.string("fingerprint", 64).notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create index finding_acks_linkage on finding_acknowledgements (linkage_id, code, subject_type, subject_id, created_at desc)");

  await knex.schema.createTable("signoffs", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("linkage_id").notNullable().references("linkages.id").onDelete("CASCADE");
    t.integer("revision").notNullable();
    t.uuid("reviewer_id").nullable().references("users.id").onDelete("SET NULL");
    t.text("statement").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    /** When the owner was told a later revision made this sign-off stale (once). */
    t.timestamp("stale_notified_at", { useTz: true }).nullable();
  });
  await knex.raw("create index signoffs_linkage on signoffs (linkage_id, created_at desc)");

  await knex.schema.createTable("linkage_followers", (t) => {
    t.uuid("linkage_id").notNullable().references("linkages.id").onDelete("CASCADE");
    t.uuid("user_id").notNullable().references("users.id").onDelete("CASCADE");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(["linkage_id", "user_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const t of ["linkage_followers", "signoffs", "finding_acknowledgements", "comments"]) await knex.schema.dropTableIfExists(t);
  await knex.schema.alterTable("users", (t) => t.dropColumn("notify"));
}
