/**
 * Percent-encodings in a request's address: each % must start an escape of valid UTF-8 (%20, %C3%A9).
 * Next's router cannot match a path that does not decode (it answered a plain-text 500), and a query
 * read leniently would hand a route text the client never meant, so both are a 400 in the one error shape.
 * Used by proxy.ts (paths) and by the route wrappers in lib/http.ts (queries). Linear in the address.
 */
import { apiError } from "./errors";

/** Whether `s` (a path, or a query without its "?") decodes: every % starts valid UTF-8. */
export function decodes(s: string, form = false): boolean {
  if (!s.includes("%")) return true;
  try {
    for (const part of form ? s.split("&") : [s]) decodeURIComponent(form ? part.replace(/\+/g, " ") : part);
    return true;
  } catch {
    return false;
  }
}

export const badPathEncoding = () =>
  apiError("invalid_input", "The address has a bad percent-encoding: each % must start a valid UTF-8 escape such as %20.", { fields: { path: "bad percent-encoding" } });
export const badQueryEncoding = () =>
  apiError("invalid_input", "The query has a bad percent-encoding: each % must start a valid UTF-8 escape such as %20.", { fields: { query: "bad percent-encoding" } });

/**
 * Set on a request whose query does not decode, by `markBadQueries` from the raw request line: Next
 * re-encodes the query before a route sees it (`%ZZ` arrives as `%25ZZ`). A value a client sent under
 * this name is removed.
 */
export const BAD_QUERY_HEADER = "x-linkwright-bad-query";

/** Whether the query part of a request target (path?query#fragment) does not decode. */
export function badQueryIn(target: string) {
  const q = target.indexOf("?");
  return q >= 0 && !decodes(target.slice(q + 1).split("#")[0], true);
}

/** In the route wrappers: a request marked by `markBadQueries` is a 400. */
export function checkQueryEncoding(req: Request) {
  if (req.headers.get(BAD_QUERY_HEADER) === "1" || badQueryIn(req.url)) throw badQueryEncoding();
}

const g = globalThis as unknown as { __lwBadQueries?: boolean };

/**
 * Marks each request whose raw query does not decode (BAD_QUERY_HEADER) before Next reads it: Node
 * publishes every incoming request on this channel just before the server's 'request' event. Called
 * once from instrumentation.ts.
 */
export async function markBadQueries() {
  if (g.__lwBadQueries) return;
  g.__lwBadQueries = true;
  const dc = await import("node:diagnostics_channel");
  dc.subscribe("http.server.request.start", (message) => {
    const { request } = message as { request: { url?: string; headers: Record<string, unknown> } };
    delete request.headers[BAD_QUERY_HEADER];
    if (badQueryIn(request.url ?? "")) request.headers[BAD_QUERY_HEADER] = "1";
  });
}
