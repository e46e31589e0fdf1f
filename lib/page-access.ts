import "server-only";
import { notFound, redirect } from "next/navigation";
import { getSessionUser } from "./auth";
import { getMembership } from "@/db/builds";
import { ApiError } from "./errors";
import { UUID_RE, getLinkageOrThrow } from "./http";

/** For server pages: the signed-in user or a redirect to sign-in. */
export async function requirePageUser(next?: string) {
  const user = await getSessionUser();
  if (!user) redirect(next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
  return user;
}

/** For build pages: the user, the build and the role, or 404 for non-members. */
export async function requirePageBuild(buildId: string, next?: string) {
  const user = await requirePageUser(next);
  if (!UUID_RE.test(buildId)) notFound();
  const m = await getMembership(buildId, user.id);
  if (!m) notFound();
  return { user, ...m };
}

/** For linkage pages: requirePageBuild, then the linkage of that build (the page's 404 otherwise). */
export async function requirePageLinkage(buildId: string, linkageId: string, next?: string) {
  const access = await requirePageBuild(buildId, next);
  try {
    return { ...access, linkage: await getLinkageOrThrow(access.build.id, linkageId) };
  } catch (e) {
    if (e instanceof ApiError && e.status === 404) notFound();
    throw e;
  }
}
