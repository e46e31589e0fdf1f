import type { Knex } from "knex";

/**
 * A session version per user: every session cookie carries the version it was issued with, and a request
 * whose cookie carries an older one is signed out. Signing out raises it, so a copied cookie stops working
 * the moment its owner signs out (JWT cookies cannot be taken back otherwise).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("users", (t) => {
    t.integer("session_version").notNullable().defaultTo(0);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("users", (t) => {
    t.dropColumn("session_version");
  });
}
