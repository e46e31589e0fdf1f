import type { Knex } from "knex";

/**
 * A revision's `summary` (the report's finding counts, which linkage lists, revision lists and the build log
 * show) is written by the app beside the report, from the same engine run, instead of PostgreSQL computing it
 * from the report on every insert. The generated column read the whole report (about 25 KB of `json` text for
 * the demo pitch run) to find one key: 0.43 of the 0.84 ms of PostgreSQL CPU a save statement cost on this
 * machine (1,500 saves in a row of the demo pitch revision, 2026-12-05; 0.40 ms without it).
 * A writer that gives a report without its summary still gets one: a trigger fills it from the report on
 * insert, and on an update that changes the report but not the summary — only then is the report read.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    alter table linkage_revisions alter column summary drop expression;
    create function linkage_revision_summary() returns trigger language plpgsql as $$
    begin
      new.summary := (new.analysis -> 'summary')::jsonb;
      return new;
    end $$;
    create trigger linkage_revision_summary_on_insert before insert on linkage_revisions
      for each row when (new.summary is null and new.analysis is not null) execute function linkage_revision_summary();
    create trigger linkage_revision_summary_on_update before update of analysis on linkage_revisions
      for each row when (new.summary is not distinct from old.summary) execute function linkage_revision_summary();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    drop trigger linkage_revision_summary_on_update on linkage_revisions;
    drop trigger linkage_revision_summary_on_insert on linkage_revisions;
    drop function linkage_revision_summary();
    alter table linkage_revisions drop column summary;
    alter table linkage_revisions add column summary jsonb generated always as ((analysis -> 'summary')::jsonb) stored;
  `);
}
