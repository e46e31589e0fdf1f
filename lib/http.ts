import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import type { z } from "zod";
import { ApiError, notFound, serverError, unauthorized, forbidden, unavailable } from "./errors";
import { isDatabaseUnavailable } from "@/db/unavailable";
import { MAX_BODY_BYTES, parseJsonWith, readTextCapped } from "./body";
import { checkQueryEncoding } from "./url-encoding";
import { getSessionAccess, getSessionUser, type SessionUser } from "./auth";
import type { Build } from "@/db/builds";
import { getRevision, type Linkage, type Revision } from "@/db/linkages";
import { revisionQuery } from "@/shared/schemas/common";
import { can, type Capability, type Role, CAPABILITIES } from "@/shared/roles";

export { MAX_BODY_BYTES };
/** A UUID as Postgres reads it: anything else names no row (and must not reach a uuid column). */
export const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * Read a JSON body (at most 5 MB, counted as it streams in; UTF-8; at most 64 levels deep) and parse it
 * with a zod schema: 400 with field errors when it does not fit.
 */
export async function parseBody<S extends z.ZodTypeAny>(req: Request, schema: S): Promise<z.infer<S>> {
  return parseJsonWith(await readTextCapped(req, MAX_BODY_BYTES), schema);
}

export function parseParams<S extends z.ZodTypeAny>(params: unknown, schema: S): z.infer<S> {
  const r = schema.safeParse(params);
  // A malformed id names nothing we have: the same 404 as a build the user cannot see.
  if (!r.success) throw notFound("item");
  return r.data;
}

function errorResponse(e: unknown) {
  if (e instanceof ApiError) return e.toResponse();
  if (isDatabaseUnavailable(e)) {
    // One line, not a stack per request: every request fails the same way until the database is back.
    console.warn(`database not answering: ${(e as Error).message?.split("\n")[0] ?? e}`);
    return unavailable().toResponse();
  }
  console.error(e);
  return serverError().toResponse();
}

type RouteCtx<P> = { params: Promise<P> };

/** A route for any signed-in user. */
export function withUser<P = Record<string, string>>(
  handler: (a: { req: NextRequest; user: SessionUser; params: P }) => Promise<Response>,
) {
  return async (req: NextRequest, ctx: RouteCtx<P>) => {
    try {
      checkQueryEncoding(req);
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
      checkQueryEncoding(req);
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

/**
 * The session, the membership and (for a linkage route) the linkage, from one query (getSessionAccess), checked
 * in this order: 401 signed out, 404 a malformed id or a build the user is not a member of (non-members never
 * learn the build exists), 403 a role without the capability, then 404 a linkage not in this build.
 */
async function authorise(capability: Capability, buildId: string, linkageId?: string, revision?: number | "current") {
  const buildOk = UUID_RE.test(buildId);
  const linkageOk = linkageId !== undefined && UUID_RE.test(linkageId);
  const access = await getSessionAccess(buildOk ? buildId : undefined, buildOk && linkageOk ? linkageId : undefined, buildOk && linkageOk ? revision : undefined);
  if (!access) throw unauthorized();
  if (!access.member) throw notFound();
  if (!can(access.member.role, capability)) throw forbidden(WHY[capability]);
  return { user: access.user, build: access.member.build, role: access.member.role, linkage: access.linkage, revision: access.revision };
}

type BuildArgs<P> = { req: NextRequest; user: SessionUser; build: Build; role: Role; params: P };

/**
 * Every build route goes through this: session (401), membership (404), role (403), then the body.
 *   export const GET = withBuild("read", async ({ build, role, user, params }) => …)
 */
export function withBuild<P extends { buildId: string } = { buildId: string }>(
  capability: Capability,
  handler: (a: BuildArgs<P>) => Promise<Response>,
) {
  return async (req: NextRequest, ctx: RouteCtx<P>) => {
    try {
      const params = (await ctx?.params) ?? ({} as P);
      const { user, build, role } = await authorise(capability, params.buildId);
      return await handler({ req, user, build, role, params });
    } catch (e) {
      return errorResponse(e);
    }
  };
}

export const json = (data: unknown, status = 200) => NextResponse.json(data, { status });
/** An answer whose body is JSON text already (e.g. revisionJson: a stored revision sent on without parsing it). */
export const jsonText = (text: string) => new NextResponse(text, { status: 200, headers: { "content-type": "application/json" } });
export { CAPABILITIES };

/** A revision of the linkage (the current one when `revision` is undefined); 404 when there is none. */
export async function getRevisionOrThrow(linkageId: string, revision?: number): Promise<Revision> {
  const rev = await getRevision(linkageId, revision);
  if (!rev) throw notFound("revision");
  return rev;
}

type LinkageArgs<P> = { req: NextRequest; user: SessionUser; build: Build; role: Role; linkage: Linkage; params: P };
/**
 * Which revision the handler receives: "current", or "requested" (`?revision=N`, the current one when
 * absent). A malformed or unknown N is a 404.
 */
type RevisionChoice = { revision: "current" | "requested" };

/**
 * A linkage route: withBuild's checks, then the linkage of `params.linkageId` in that build (404 otherwise),
 * and, when asked for, the revision it acts on.
 *   export const GET = withLinkage<P>("read", { revision: "requested" }, async ({ linkage, revision }) => …)
 */
export function withLinkage<P extends { buildId: string; linkageId: string } = { buildId: string; linkageId: string }>(
  capability: Capability,
  handler: (a: LinkageArgs<P>) => Promise<Response>,
): ReturnType<typeof withBuild<P>>;
export function withLinkage<P extends { buildId: string; linkageId: string } = { buildId: string; linkageId: string }>(
  capability: Capability,
  choice: RevisionChoice,
  handler: (a: LinkageArgs<P> & { revision: Revision }) => Promise<Response>,
): ReturnType<typeof withBuild<P>>;
export function withLinkage<P extends { buildId: string; linkageId: string }>(
  capability: Capability,
  a: RevisionChoice | ((a: LinkageArgs<P>) => Promise<Response>),
  b?: (a: LinkageArgs<P> & { revision: Revision }) => Promise<Response>,
) {
  return async (req: NextRequest, ctx: RouteCtx<P>) => {
    try {
      const params = (await ctx?.params) ?? ({} as P);
      // The revision is read with the access (one round trip); a malformed `?revision=` is a 404, but only after
      // the checks above have passed, as for any other id.
      const q = typeof a !== "function" && a.revision === "requested" ? req.nextUrl.searchParams.get("revision") : null;
      const asked = q === null ? undefined : revisionQuery.safeParse(q);
      const wanted = typeof a === "function" ? undefined : asked === undefined ? "current" : asked.success ? asked.data : undefined;
      const { user, build, role, linkage, revision } = await authorise(capability, params.buildId, params.linkageId, wanted);
      if (!linkage) throw notFound("linkage");
      const args = { req, user, build, role, linkage, params };
      if (typeof a === "function") return await a(args);
      if (asked && !asked.success) throw notFound("item");
      if (!revision) throw notFound("revision");
      return await b!({ ...args, revision });
    } catch (e) {
      return errorResponse(e);
    }
  };
}
