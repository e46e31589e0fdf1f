import "server-only";
import type { NextRequest } from "next/server";
import { z } from "zod";
import { fieldError } from "./errors";
import type { Key, PageArgs } from "@/db/paging";

/** Page size: `?limit=` (1–200, default 50). */
export const PAGE_DEFAULT = 50;
export const PAGE_MAX = 200;
/**
 * The build log page's first screen: log entries carry their text and photos, so the page is drawn with
 * fewer of them and the rest (pages of PAGE_DEFAULT) load as the reader scrolls or asks.
 */
export const LOG_FIRST_SCREEN = 20;

const KEY_PART: Record<Key["type"], RegExp> = {
  date: /^\d{4}-\d{2}-\d{2}$/,
  timestamptz: /^\d{4}-\d{2}-\d{2}[ T]\d{2}:\d{2}:\d{2}(\.\d{1,6})?([+-]\d{2}(:?\d{2})?|Z)?$/,
  uuid: /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i,
  int: /^-?\d{1,10}$/,
  bigint: /^-?\d{1,19}$/,
};

const limitSchema = z.coerce.number({ error: "limit must be a number" }).int("limit must be a whole number").min(1, "limit is at least 1").max(PAGE_MAX, `limit is at most ${PAGE_MAX}`);

/** The cursor is opaque to clients: base64url of the last row's key, checked part by part against the list's key types. */
export const encodeCursor = (next: string[] | null) => (next ? Buffer.from(JSON.stringify(next)).toString("base64url") : null);

function decodeCursor(raw: string, keys: Key[]): string[] | null {
  if (raw.length > 400) return null;
  try {
    const v = JSON.parse(Buffer.from(raw, "base64url").toString("utf8"));
    if (!Array.isArray(v) || v.length !== keys.length) return null;
    return v.every((p, i) => typeof p === "string" && KEY_PART[keys[i].type].test(p)) ? v : null;
  } catch {
    return null;
  }
}

/** `?cursor=&limit=` of a paged list route; a bad value is a 400 naming it. */
export function readPage(req: NextRequest, keys: Key[]): PageArgs {
  const sp = req.nextUrl.searchParams;
  const l = sp.get("limit");
  const limit = l === null ? { success: true as const, data: PAGE_DEFAULT } : limitSchema.safeParse(l);
  if (!limit.success) throw fieldError("limit", limit.error.issues[0].message, "The page size is not valid.");
  const c = sp.get("cursor");
  if (c === null || c === "") return { limit: limit.data, after: null };
  const after = decodeCursor(c, keys);
  if (!after) throw fieldError("cursor", "not a cursor of this list", "The page cursor is not valid; start again from the first page.");
  return { limit: limit.data, after };
}

/** The JSON of one page: the items under their list's name, the total over the whole list, and the next cursor. */
export const pageBody = <T>(name: string, page: { items: T[]; next: string[] | null }, total: number) => ({ [name]: page.items, total, nextCursor: encodeCursor(page.next) });
