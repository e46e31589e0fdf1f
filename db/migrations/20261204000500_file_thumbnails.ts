import type { Knex } from "knex";

/**
 * A copy of each photo's small thumbnail (the JPEG also kept in storage under `files.thumb_key`) in the
 * database, beside its row. A log PDF of a ten-year build embeds thousands of them: read a page at a time
 * with the entries, they cost one query instead of one storage request each. A separate table keeps them
 * out of every `files` query that selects whole rows. Photos uploaded before this migration get theirs the
 * first time a PDF reads them from storage (db/files.ts keepThumbnail).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("file_thumbnails", (t) => {
    t.uuid("file_id").primary().references("id").inTable("files").onDelete("CASCADE");
    t.binary("bytes").notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("file_thumbnails");
}
