import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import type { z } from "zod";
import { ApiError, invalid, notFound, serverError, unauthorized, forbidden, unavailable } from "./errors";
import { isDatabaseUnavailable } from "@/db/unavailable";
import { MAX_BODY_BYTES, parseJsonText, readTextCapped } from "./body";
import { checkQueryEncoding } from "./url-encoding";
import { getSessionUser, type SessionUser } from "./auth";
import { getMembership, type Build } from "@/db/builds";
import { getLinkage, getRevision, type Linkage, type Revision } from "@/db/linkages";
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
  const json = parseJsonText(await readTextCapped(req, MAX_BODY_BYTES));
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

/** The linkage `rawId` names in this build; 404 for a malformed id or a linkage of another build. */
export async function getLinkageOrThrow(buildId: string, rawId: string): Promise<Linkage> {
  const linkage = UUID_RE.test(rawId) ? await getLinkage(buildId, rawId) : null;
  if (!linkage) throw notFound("linkage");
  return linkage;
}

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
  return withBuild<P>(capability, async (args) => {
    const linkage = await getLinkageOrThrow(args.build.id, args.params.linkageId);
    if (typeof a === "function") return a({ ...args, linkage });
    const q = a.revision === "requested" ? args.req.nextUrl.searchParams.get("revision") : null;
    const revision = await getRevisionOrThrow(linkage.id, q === null ? undefined : parseParams(q, revisionQuery));
    return b!({ ...args, linkage, revision });
  });
}
