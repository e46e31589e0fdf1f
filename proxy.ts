/**
 * Runs before routing, only for addresses with a % in their path (the matcher below): a path whose
 * percent-encoding does not decode is answered with a JSON 400 here, because Next's router cannot match
 * it (it answered a plain-text 500). Queries are checked by the route wrappers (lib/http.ts).
 *
 * Only these paths: for a request the proxy sees, Next copies the body (up to 10 MB) and waits for all
 * of it before the route runs, which would undo the body cap's early answer (lib/body.ts) everywhere.
 */
import { NextResponse, type NextRequest } from "next/server";
import { badPathEncoding, decodes } from "./lib/url-encoding";

export function proxy(req: NextRequest) {
  if (!decodes(req.nextUrl.pathname)) return badPathEncoding().toResponse();
  return NextResponse.next();
}

export const config = { matcher: ["/(.*%.*)"] };
