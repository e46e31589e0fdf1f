import type { Knex } from "knex";

/**
 * Audit events outlive their build: deleting a build no longer deletes the record of who did what in it,
 * and of who deleted it. build_id stays as the id the events were about (no foreign key: the build is gone).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("audit_events", (t) => {
    t.dropForeign(["build_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  // The events of deleted builds cannot point at a build again: they go, as they did before.
  await knex.raw("delete from audit_events a where a.build_id is not null and not exists (select 1 from builds b where b.id = a.build_id)");
  await knex.schema.alterTable("audit_events", (t) => {
    t.foreign("build_id").references("builds.id").onDelete("CASCADE");
  });
}
