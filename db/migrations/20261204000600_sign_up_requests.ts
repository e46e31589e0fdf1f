import type { Knex } from "knex";

/**
 * Sign-up by e-mail confirmation: the account is made only when the link mailed to the address is opened,
 * so the sign-up answer never tells whether an address has an account, and an account's e-mail is one its
 * owner reads (what an invitation's "only the invited address" rule rests on). A row per sign-up request:
 * `new` holds the chosen name and password hash until the link (its SHA-256 only, single use, with an
 * expiry) is opened; `existing` only records that the address was told it already has an account, so that
 * mail to one address is limited per hour. Rows are pruned a few days after they were made.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("sign_up_requests", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.string("email", 254).notNullable();
    t.enu("kind", ["new", "existing"]).notNullable();
    t.string("name", 120).nullable();
    t.string("password_hash", 200).nullable();
    t.string("next", 2000).nullable();
    t.string("token_hash", 64).nullable().unique();
    t.timestamp("expires_at", { useTz: true }).nullable();
    t.timestamp("used_at", { useTz: true }).nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create index sign_up_requests_email on sign_up_requests (lower(email), created_at)");
  await knex.raw("create index sign_up_requests_created on sign_up_requests (created_at)");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("sign_up_requests");
}
