import type { Knex } from "knex";

/**
 * A revision's graph and report are kept as the JSON text the server wrote (`json`: PostgreSQL checks that it
 * is JSON and stores it as it came) instead of `jsonb` (parsed into PostgreSQL's binary form on every save and
 * printed back to text on every read). Nothing queries inside them but the report's summary, which linkage
 * lists, revision lists and the build log show: that is a small `jsonb` column PostgreSQL fills from the report
 * itself on every insert and update (generated), so no writer can forget it.
 * Measured on this machine on the demo pitch revision (8.7 KB graph, 24.6 KB report), per row: writing
 * 0.72 ms as jsonb → 0.21 ms as json with lz4; reading as text 0.135 ms → 0.019 ms. Most of the write was the
 * default (pglz) compression of the large values: lz4 is used where this PostgreSQL was built with it.
 */
const LZ4 = "select 'lz4' = any(enumvals) as ok from pg_settings where name = 'default_toast_compression'";

export async function up(knex: Knex): Promise<void> {
  const lz4 = Boolean((await knex.raw(LZ4)).rows[0]?.ok);
  await knex.raw(`
    alter table linkage_revisions
      alter column graph type json using graph::json,
      alter column analysis type json using analysis::json
      ${lz4 ? ", alter column graph set compression lz4, alter column analysis set compression lz4" : ""};
    alter table linkage_revisions add column summary jsonb generated always as ((analysis -> 'summary')::jsonb) stored;
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    alter table linkage_revisions drop column summary;
    alter table linkage_revisions
      alter column graph set compression default,
      alter column analysis set compression default,
      alter column graph type jsonb using graph::jsonb,
      alter column analysis type jsonb using analysis::jsonb;
  `);
}
