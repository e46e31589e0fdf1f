import "server-only";
import { notFound, redirect } from "next/navigation";
import { getSessionAccess, getSessionUser } from "./auth";
import { UUID_RE } from "./http";

function toSignIn(next?: string): never {
  redirect(next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
}

/** For server pages: the signed-in user or a redirect to sign-in. */
export async function requirePageUser(next?: string) {
  const user = await getSessionUser();
  if (!user) toSignIn(next);
  return user;
}

/** The user, the membership and the linkage of a page, from one query: sign-in when signed out, 404 for non-members or malformed ids. */
async function pageAccess(buildId: string, linkageId: string | undefined, next?: string) {
  const buildOk = UUID_RE.test(buildId);
  const linkageOk = linkageId !== undefined && UUID_RE.test(linkageId);
  const access = await getSessionAccess(buildOk ? buildId : undefined, buildOk && linkageOk ? linkageId : undefined);
  if (!access) toSignIn(next);
  if (!access.member) notFound();
  return { user: access.user, ...access.member, linkage: access.linkage };
}

/** For build pages: the user, the build and the role, or 404 for non-members. */
export async function requirePageBuild(buildId: string, next?: string) {
  const { user, build, role } = await pageAccess(buildId, undefined, next);
  return { user, build, role };
}

/** For linkage pages: requirePageBuild, then the linkage of that build (the page's 404 otherwise). */
export async function requirePageLinkage(buildId: string, linkageId: string, next?: string) {
  const { linkage, ...access } = await pageAccess(buildId, linkageId, next);
  if (!linkage) notFound();
  return { ...access, linkage };
}
