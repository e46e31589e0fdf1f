import "server-only";
import type { Knex } from "knex";
import { db } from "./index";

/**
 * Keyset paging, newest first. A list names its sort key (columns, each with its Postgres type), all
 * descending (exports may walk a list oldest first); a page is the `limit` rows after the cursor, and the cursor is the last row's key as
 * Postgres prints it (text keeps a timestamp's microseconds, which a JS Date would drop). One row more
 * than asked is read to know whether another page follows. A matching index (see the paging migration)
 * makes every page an index range scan, however deep.
 */
export type Key = { expr: string; type: "date" | "timestamptz" | "uuid" | "int" | "bigint" };
export type PageArgs = { limit: number; after: string[] | null };
export type Page<T> = { items: T[]; next: string[] | null };

export async function keysetPage<R extends Record<string, unknown>>(q: Knex.QueryBuilder, keys: Key[], page: PageArgs, order: "desc" | "asc" = "desc"): Promise<Page<R>> {
  if (page.after) {
    if (page.after.length !== keys.length) throw new Error("cursor does not fit this list");
    q.whereRaw(`(${keys.map((k) => k.expr).join(", ")}) ${order === "desc" ? "<" : ">"} (${keys.map((k) => `?::${k.type}`).join(", ")})`, page.after);
  }
  keys.forEach((k, i) => q.select(db.raw(`${k.expr}::text as "_k${i}"`)));
  q.orderByRaw(keys.map((k) => `${k.expr} ${order}`).join(", ")).limit(page.limit + 1);
  const rows = (await q) as R[];
  const more = rows.length > page.limit;
  const items = more ? rows.slice(0, page.limit) : rows;
  const last = items[items.length - 1];
  return { items, next: more && last ? keys.map((_, i) => String(last[`_k${i}`])) : null };
}

/** How many rows a list has in all (the same filter, no paging). */
export async function countOf(q: Knex.QueryBuilder): Promise<number> {
  const [{ n }] = await q.clearSelect().clearOrder().count<{ n: string }[]>("* as n");
  return Number(n);
}
