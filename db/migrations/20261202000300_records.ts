import type { Knex } from "knex";

/**
 * Build records: uploaded files (photos, PDFs, linkage pictures), joint photo links, the build log,
 * parts libraries (per user or per build), hardware states, inspection checklist ticks.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("files", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("build_id").notNullable().references("builds.id").onDelete("CASCADE");
    t.string("key", 300).notNullable().unique();
    t.enu("kind", ["photo", "pdf", "linkage-picture"]).notNullable();
    /** From the magic bytes, never from the client. */
    t.string("content_type", 100).notNullable();
    t.integer("size").notNullable();
    /** Sanitised display name (no path parts, no control characters). */
    t.string("name", 200).notNullable();
    t.string("thumb_key", 300).nullable();
    t.integer("width").nullable();
    t.integer("height").nullable();
    t.uuid("uploaded_by").nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create index files_build on files (build_id, created_at desc)");

  await knex.schema.createTable("joint_photos", (t) => {
    t.uuid("linkage_id").notNullable().references("linkages.id").onDelete("CASCADE");
    t.string("joint_id", 64).notNullable();
    t.uuid("file_id").notNullable().references("files.id").onDelete("CASCADE");
    t.uuid("added_by").nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(["linkage_id", "joint_id", "file_id"]);
  });

  /** The exported picture of a linkage revision (one per revision; a new upload replaces it). */
  await knex.schema.createTable("revision_pictures", (t) => {
    t.uuid("linkage_id").notNullable().references("linkages.id").onDelete("CASCADE");
    t.integer("revision").notNullable();
    t.uuid("file_id").notNullable().references("files.id").onDelete("CASCADE");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(["linkage_id", "revision"]);
  });

  await knex.schema.createTable("log_entries", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("build_id").notNullable().references("builds.id").onDelete("CASCADE");
    t.date("date").notNullable();
    t.decimal("hours", 6, 2).notNullable().defaultTo(0);
    t.string("title", 200).notNullable();
    t.text("text").notNullable().defaultTo("");
    t.specificType("systems", "text[]").notNullable().defaultTo("{}");
    t.uuid("linkage_id").nullable().references("linkages.id").onDelete("SET NULL");
    t.integer("revision").nullable();
    t.uuid("author_id").nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create index log_entries_build_date on log_entries (build_id, date desc)");

  await knex.schema.createTable("log_entry_files", (t) => {
    t.uuid("entry_id").notNullable().references("log_entries.id").onDelete("CASCADE");
    t.uuid("file_id").notNullable().references("files.id").onDelete("CASCADE");
    t.integer("position").notNullable().defaultTo(0);
    t.primary(["entry_id", "file_id"]);
  });

  await knex.schema.createTable("parts", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("owner_user_id").nullable().references("users.id").onDelete("CASCADE");
    t.uuid("build_id").nullable().references("builds.id").onDelete("CASCADE");
    t.enu("kind", ["rodEnd", "bolt", "nut", "washer", "tube", "bushing"]).notNullable();
    t.string("part_number", 60).notNullable();
    t.string("description", 200).notNullable().defaultTo("");
    /** Validated per kind by shared/records/parts.ts (US units: in, lbf). */
    t.jsonb("spec").notNullable().defaultTo("{}");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("alter table parts add constraint parts_one_library check ((owner_user_id is null) <> (build_id is null))");
  await knex.raw("create unique index parts_user_number on parts (owner_user_id, lower(part_number)) where owner_user_id is not null");
  await knex.raw("create unique index parts_build_number on parts (build_id, lower(part_number)) where build_id is not null");

  await knex.schema.createTable("hardware_states", (t) => {
    t.uuid("build_id").notNullable().references("builds.id").onDelete("CASCADE");
    t.string("part_key", 200).notNullable();
    t.enu("state", ["to_order", "ordered", "received", "installed", "inspected"]).notNullable();
    t.uuid("updated_by").nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(["build_id", "part_key"]);
  });

  await knex.schema.createTable("checklist_items", (t) => {
    t.bigIncrements("id").primary();
    t.uuid("linkage_id").notNullable().references("linkages.id").onDelete("CASCADE");
    t.integer("revision").notNullable();
    /** "" for items of the whole linkage (travel, stops). */
    t.string("joint_id", 64).notNullable().defaultTo("");
    t.string("item_code", 40).notNullable();
    t.uuid("ticked_by").nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("ticked_at", { useTz: true }).nullable();
    t.text("note").notNullable().defaultTo("");
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["linkage_id", "revision", "joint_id", "item_code"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const t of ["checklist_items", "hardware_states", "parts", "log_entry_files", "log_entries", "revision_pictures", "joint_photos", "files"]) {
    await knex.schema.dropTableIfExists(t);
  }
}
