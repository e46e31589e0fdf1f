import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import type { z } from "zod";
import { ApiError, invalid, notFound, unauthorized, forbidden } from "./errors";
import { getSessionUser, type SessionUser } from "./auth";
import { getMembership, type Build } from "@/db/builds";
import { getRevision } from "@/db/linkages";
import { revisionQuery } from "@/shared/api";
import { can, type Capability, type Role, CAPABILITIES } from "@/shared/roles";

export const MAX_BODY_BYTES = 5 * 1024 * 1024;
/** A UUID as Postgres reads it: anything else names no row (and must not reach a uuid column). */
export const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The path of the first string (or key) holding U+0000, which Postgres text and jsonb cannot store. */
function nulPath(v: unknown, path: string[] = []): string | null {
  if (typeof v === "string") return v.includes("\u0000") ? path.join(".") || "_" : null;
  if (!v || typeof v !== "object") return null;
  for (const [k, x] of Object.entries(v)) {
    if (k.includes("\u0000")) return [...path, "_"].join(".");
    const p = nulPath(x, [...path, k]);
    if (p) return p;
  }
  return null;
}

/** Read a JSON body and parse it with a zod schema: 400 with field errors when it does not fit. */
export async function parseBody<S extends z.ZodTypeAny>(req: Request, schema: S): Promise<z.infer<S>> {
  const text = await req.text();
  if (text.length > MAX_BODY_BYTES) throw new ApiError(413, "too_large", "The request body is larger than 5 MB.");
  let json: unknown;
  try {
    json = text.length ? JSON.parse(text) : undefined;
  } catch {
    throw new ApiError(400, "invalid_json", "The request body is not valid JSON.");
  }
  // A NUL can only come in as the escape \u0000 (JSON has no raw control characters in strings).
  const nul = text.includes("\\u0000") ? nulPath(json) : null;
  if (nul) throw new ApiError(400, "invalid_input", "Some fields need attention.", { [nul]: "must not contain NUL characters" });
  const r = schema.safeParse(json);
  if (!r.success) throw invalid(r.error);
  return r.data;
}

export function parseParams<S extends z.ZodTypeAny>(params: unknown, schema: S): z.infer<S> {
  const r = schema.safeParse(params);
  // A malformed id names nothing we have: the same 404 as a build the user cannot see.
  if (!r.success) throw notFound("item");
  return r.data;
}

function errorResponse(e: unknown) {
  if (e instanceof ApiError) return e.toResponse();
  console.error(e);
  return NextResponse.json({ error: { code: "server_error", message: "Something went wrong on the server. Nothing was changed." } }, { status: 500 });
}

type RouteCtx<P> = { params: Promise<P> };

/** A route for any signed-in user. */
export function withUser<P = Record<string, string>>(
  handler: (a: { req: NextRequest; user: SessionUser; params: P }) => Promise<Response>,
) {
  return async (req: NextRequest, ctx: RouteCtx<P>) => {
    try {
      const user = await getSessionUser();
      if (!user) throw unauthorized();
      return await handler({ req, user, params: (await ctx?.params) ?? ({} as P) });
    } catch (e) {
      return errorResponse(e);
    }
  };
}

/** A route for site admins (user management only; they are not members of builds by default). */
export function withSiteAdmin<P = Record<string, string>>(handler: (a: { req: NextRequest; user: SessionUser; params: P }) => Promise<Response>) {
  return withUser<P>(async (a) => {
    if (!a.user.isSiteAdmin) throw forbidden("Only a site admin can do this.");
    return handler(a);
  });
}

/** A public route (sign-up): errors still come back in the one shape. */
export function withErrors<P = Record<string, string>>(handler: (a: { req: NextRequest; params: P }) => Promise<Response>) {
  return async (req: NextRequest, ctx: RouteCtx<P>) => {
    try {
      return await handler({ req, params: (await ctx?.params) ?? ({} as P) });
    } catch (e) {
      return errorResponse(e);
    }
  };
}

const WHY: Record<Capability, string> = {
  read: "You are not a member of this build.",
  edit: "Only the build's owner and builders can change this.",
  comment: "Viewers can read but not comment.",
  acknowledge: "Only a reviewer or the owner can acknowledge a finding.",
  signOff: "Only a reviewer can sign off a revision.",
  manage: "Only the build's owner can do this.",
};

export async function requireBuild(user: SessionUser, buildId: string, capability: Capability) {
  if (!UUID_RE.test(buildId)) throw notFound();
  const m = await getMembership(buildId, user.id);
  if (!m) throw notFound(); // non-members never learn the build exists
  if (!can(m.role, capability)) throw forbidden(WHY[capability]);
  return m;
}

/**
 * Every build route goes through this: session (401), membership (404), role (403), then the body.
 *   export const GET = withBuild("read", async ({ build, role, user, params }) => …)
 */
export function withBuild<P extends { buildId: string } = { buildId: string }>(
  capability: Capability,
  handler: (a: { req: NextRequest; user: SessionUser; build: Build; role: Role; params: P }) => Promise<Response>,
) {
  return withUser<P>(async ({ req, user, params }) => {
    const { build, role } = await requireBuild(user, params.buildId, capability);
    return handler({ req, user, build, role, params });
  });
}

export const json = (data: unknown, status = 200) => NextResponse.json(data, { status });
export { CAPABILITIES };

/** The revision a request names with `?revision=N` (the current one when absent); 404 when there is none. */
export async function requestedRevision(req: NextRequest, linkageId: string) {
  const q = req.nextUrl.searchParams.get("revision");
  const rev = await getRevision(linkageId, q === null ? undefined : parseParams(q, revisionQuery));
  if (!rev) throw notFound("revision");
  return rev;
}
