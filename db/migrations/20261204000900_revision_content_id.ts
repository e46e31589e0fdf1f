import type { Knex } from "knex";

/**
 * `content_id`: a random id of what a revision row holds (its graph and report), new on insert and on every
 * change of either (the report is computed again when the build's design settings change). The app keeps a
 * bounded cache of revisions' JSON text under this id (db/revision-content.ts): an id never names two
 * contents — not across instances, nor after a restore from backup — so a cached text is never stale, and
 * GET graph reads the id instead of 33 KB of text from PostgreSQL on every request.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    alter table linkage_revisions add column content_id uuid not null default gen_random_uuid();
    create function linkage_revision_new_content() returns trigger language plpgsql as $$
    begin
      new.content_id := gen_random_uuid();
      return new;
    end $$;
    create trigger linkage_revision_new_content before update of graph, analysis on linkage_revisions
      for each row execute function linkage_revision_new_content();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    drop trigger linkage_revision_new_content on linkage_revisions;
    drop function linkage_revision_new_content();
    alter table linkage_revisions drop column content_id;
  `);
}
