import type { Knex } from "knex";

/**
 * Keyset paging (newest first) for every long list, and the export jobs table.
 * Each index matches one list's order so a page is an index range scan, not a sort of the whole list.
 * The job queue itself is pg-boss's own schema ("pgboss"), which pg-boss creates and migrates on start;
 * export_jobs holds what the app shows: who asked, progress, the stored result or why it failed.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw("create index log_entries_build_page on log_entries (build_id, date desc, created_at desc, id desc)");
  await knex.raw("drop index if exists log_entries_build_date");
  await knex.raw("create index files_build_page on files (build_id, created_at desc, id desc)");
  await knex.raw("create index files_build_kind_page on files (build_id, kind, created_at desc, id desc)");
  await knex.raw("drop index if exists files_build");
  await knex.raw("create index log_entry_files_file on log_entry_files (file_id)");
  await knex.raw("create index comments_linkage_page on comments (linkage_id, created_at desc, id desc)");
  await knex.raw("create index audit_events_build_page on audit_events (build_id, created_at desc, id desc)");
  await knex.raw("drop index if exists audit_events_build");
  await knex.raw("create index parts_build_page on parts (build_id, created_at desc, id desc) where build_id is not null");
  await knex.raw("create index parts_user_page on parts (owner_user_id, created_at desc, id desc) where owner_user_id is not null");

  /** The thumbnail's byte size: a log PDF embeds thumbnails, so its size can be told before it is made. */
  await knex.schema.alterTable("files", (t) => t.integer("thumb_size").nullable());

  await knex.schema.createTable("export_jobs", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("build_id").notNullable().references("builds.id").onDelete("CASCADE");
    t.uuid("user_id").nullable().references("users.id").onDelete("SET NULL");
    /** One of lib/jobs/kinds.ts (log-pdf, checklist-pdf, hardware-csv, …). */
    t.string("kind", 40).notNullable();
    t.jsonb("params").notNullable().defaultTo("{}");
    t.string("label", 300).notNullable();
    t.enu("status", ["queued", "running", "done", "failed"]).notNullable().defaultTo("queued");
    t.float("progress").notNullable().defaultTo(0);
    t.string("progress_note", 200).notNullable().defaultTo("");
    t.bigInteger("estimated_bytes").nullable();
    t.string("result_key", 300).nullable();
    t.string("result_name", 200).nullable();
    t.string("result_type", 100).nullable();
    t.bigInteger("result_size").nullable();
    t.text("error").nullable();
    t.integer("attempts").notNullable().defaultTo(0);
    /** The pg-boss job that carries the current attempt; an older delivery of the same row is ignored. */
    t.string("queue_job_id", 64).nullable();
    /** host:pid of the worker running it, and its heartbeat: a running job whose worker is gone is queued again. */
    t.string("worker", 120).nullable();
    t.timestamp("heartbeat_at", { useTz: true }).nullable();
    /** When the person who asked last looked at the job's progress (they may have left the page). */
    t.timestamp("seen_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("mailed_at", { useTz: true }).nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("started_at", { useTz: true }).nullable();
    t.timestamp("finished_at", { useTz: true }).nullable();
  });
  await knex.raw("create index export_jobs_build on export_jobs (build_id, created_at desc, id desc)");
  await knex.raw("create index export_jobs_running on export_jobs (status, heartbeat_at) where status = 'running'");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("export_jobs");
  await knex.schema.alterTable("files", (t) => t.dropColumn("thumb_size"));
  for (const i of ["parts_user_page", "parts_build_page", "audit_events_build_page", "comments_linkage_page", "log_entry_files_file", "files_build_kind_page", "files_build_page", "log_entries_build_page"]) {
    await knex.raw(`drop index if exists ${i}`);
  }
  await knex.raw("create index if not exists log_entries_build_date on log_entries (build_id, date desc)");
  await knex.raw("create index if not exists files_build on files (build_id, created_at desc)");
  await knex.raw("create index if not exists audit_events_build on audit_events (build_id, created_at desc)");
  await knex.raw("drop schema if exists pgboss cascade");
}
