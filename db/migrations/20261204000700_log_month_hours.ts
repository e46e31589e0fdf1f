import type { Knex } from "knex";

/**
 * The build log's hours by month and control system, kept up to date by a trigger on `log_entries`, so
 * the log's first screen reads a few dozen rows instead of summing every entry of a ten-year build.
 * One row per (build, month, system) for each system an entry names ("unassigned" for none), and one
 * row with system '*' per (build, month) that counts every entry once: its hours are the month's real
 * total (an entry with two systems counts toward each system but once toward the total).
 * Rows whose count falls to zero stay (with zero hours) and are skipped on read; the trigger adds and
 * subtracts with `on conflict do update`, so concurrent writers of one build never lose a change.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("log_month_hours", (t) => {
    t.uuid("build_id").notNullable().references("id").inTable("builds").onDelete("CASCADE");
    t.text("month").notNullable();
    t.text("system").notNullable();
    t.decimal("hours", 12, 2).notNullable().defaultTo(0);
    t.integer("entries").notNullable().defaultTo(0);
    t.primary(["build_id", "month", "system"]);
  });
  await knex.raw(`
    create function log_month_hours_add(b uuid, d date, systems text[], h numeric, n integer) returns void
    language sql as $$
      insert into log_month_hours as m (build_id, month, system, hours, entries)
      select b, to_char(d, 'YYYY-MM'), s, h * n, n
        from unnest(array['*']::text[] || case when cardinality(systems) = 0 then array['unassigned']::text[] else systems end) as s
      on conflict (build_id, month, system) do update set hours = m.hours + excluded.hours, entries = m.entries + excluded.entries
    $$;
    create function log_month_hours_trigger() returns trigger
    language plpgsql as $$
    begin
      if tg_op in ('UPDATE', 'DELETE') then
        -- A build being deleted takes its rows with it (on delete cascade); nothing to subtract.
        if exists (select 1 from builds where id = old.build_id) then
          perform log_month_hours_add(old.build_id, old.date, old.systems, old.hours, -1);
        end if;
      end if;
      if tg_op in ('INSERT', 'UPDATE') then
        perform log_month_hours_add(new.build_id, new.date, new.systems, new.hours, 1);
      end if;
      return null;
    end $$;
    create trigger log_month_hours after insert or delete or update of build_id, date, systems, hours on log_entries
      for each row execute function log_month_hours_trigger();
    insert into log_month_hours (build_id, month, system, hours, entries)
      select e.build_id, to_char(e.date, 'YYYY-MM'), s.system, sum(e.hours), count(*)
        from log_entries e
        cross join lateral unnest(array['*']::text[] || case when cardinality(e.systems) = 0 then array['unassigned']::text[] else e.systems end) as s(system)
       group by 1, 2, 3;
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw("drop trigger if exists log_month_hours on log_entries; drop function if exists log_month_hours_trigger(); drop function if exists log_month_hours_add(uuid, date, text[], numeric, integer);");
  await knex.schema.dropTable("log_month_hours");
}
