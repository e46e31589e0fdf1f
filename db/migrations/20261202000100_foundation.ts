import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.raw('create extension if not exists "pgcrypto"');
  await knex.schema.createTable("users", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.string("email", 254).notNullable();
    t.string("name", 120).notNullable();
    t.string("password_hash", 200).notNullable();
    t.boolean("is_site_admin").notNullable().defaultTo(false);
    t.enu("unit_system", ["US", "SI"]).notNullable().defaultTo("US");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create unique index users_email_lower on users (lower(email))");

  await knex.schema.createTable("builds", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.string("name", 120).notNullable();
    t.string("model", 120).notNullable().defaultTo("");
    t.string("registration", 20).nullable();
    t.jsonb("analysis_settings").notNullable().defaultTo("{}");
    t.uuid("created_by").references("users.id").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable("memberships", (t) => {
    t.uuid("build_id").notNullable().references("builds.id").onDelete("CASCADE");
    t.uuid("user_id").notNullable().references("users.id").onDelete("CASCADE");
    t.enu("role", ["owner", "builder", "reviewer", "viewer"]).notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(["build_id", "user_id"]);
  });
  await knex.raw("create index memberships_user on memberships (user_id)");

  await knex.schema.createTable("invitations", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("build_id").notNullable().references("builds.id").onDelete("CASCADE");
    t.string("email", 254).notNullable();
    t.enu("role", ["owner", "builder", "reviewer", "viewer"]).notNullable();
    t.string("token_hash", 64).notNullable().unique();
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("accepted_at", { useTz: true }).nullable();
    t.uuid("accepted_by").nullable().references("users.id").onDelete("SET NULL");
    t.uuid("invited_by").nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable("linkages", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("build_id").notNullable().references("builds.id").onDelete("CASCADE");
    t.string("name", 120).notNullable();
    t.enu("system", ["pitch", "roll", "yaw", "flap", "trim", "other"]).notNullable();
    t.integer("current_revision").notNullable().defaultTo(0);
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create index linkages_build on linkages (build_id)");

  await knex.schema.createTable("linkage_revisions", (t) => {
    t.bigIncrements("id").primary();
    t.uuid("linkage_id").notNullable().references("linkages.id").onDelete("CASCADE");
    t.integer("revision").notNullable();
    t.jsonb("graph").notNullable();
    t.jsonb("analysis").nullable();
    t.uuid("author_id").nullable().references("users.id").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["linkage_id", "revision"]);
  });

  await knex.schema.createTable("audit_events", (t) => {
    t.bigIncrements("id").primary();
    t.uuid("build_id").nullable().references("builds.id").onDelete("CASCADE");
    t.uuid("user_id").nullable().references("users.id").onDelete("SET NULL");
    t.string("action", 60).notNullable();
    t.jsonb("detail").notNullable().defaultTo("{}");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create index audit_events_build on audit_events (build_id, created_at desc)");

  await knex.schema.createTable("sign_in_attempts", (t) => {
    t.bigIncrements("id").primary();
    t.string("email", 254).notNullable();
    t.string("ip", 64).notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create index sign_in_attempts_email on sign_in_attempts (lower(email), created_at)");
  await knex.raw("create index sign_in_attempts_ip on sign_in_attempts (ip, created_at)");
}

export async function down(knex: Knex): Promise<void> {
  for (const t of ["sign_in_attempts", "audit_events", "linkage_revisions", "linkages", "invitations", "memberships", "builds", "users"]) {
    await knex.schema.dropTableIfExists(t);
  }
}
