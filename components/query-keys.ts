/**
 * react-query keys, one factory per API resource. Keys nest: invalidating `linkageKeys.review(id)`
 * refreshes the comments, findings, sign-offs and revisions of that linkage at once (the editor does
 * after every save, so the review panels never poll).
 */
export const buildKeys = {
  all: ["builds"] as const,
  one: (buildId: string) => ["build", buildId] as const,
};
export const memberKeys = {
  list: (buildId: string) => [...buildKeys.one(buildId), "members"] as const,
  invitations: (buildId: string) => [...buildKeys.one(buildId), "invitations"] as const,
};
export const linkageKeys = {
  list: (buildId: string) => [...buildKeys.one(buildId), "linkages"] as const,
  one: (linkageId: string) => ["linkage", linkageId] as const,
  /** Everything a save of the graph changes: comments, findings, sign-offs, revisions. */
  review: (linkageId: string) => [...linkageKeys.one(linkageId), "review"] as const,
  revisions: (linkageId: string) => [...linkageKeys.review(linkageId), "revisions"] as const,
  diff: (linkageId: string, from: number | null, to: number | null) => [...linkageKeys.review(linkageId), "diff", from, to] as const,
};
export const commentKeys = { list: (linkageId: string) => [...linkageKeys.review(linkageId), "comments"] as const };
/** The findings of the current revision with their acknowledgements. */
export const findingKeys = { list: (linkageId: string) => [...linkageKeys.review(linkageId), "findings"] as const };
export const signoffKeys = { list: (linkageId: string) => [...linkageKeys.review(linkageId), "signoffs"] as const };
export const checklistKeys = {
  one: (linkageId: string, revision?: number) => [...linkageKeys.one(linkageId), "checklist", revision ?? "current"] as const,
};
export const jointKeys = {
  photos: (linkageId: string, jointId: string) => [...linkageKeys.one(linkageId), "joint", jointId, "photos"] as const,
  suggestions: (linkageId: string, jointId: string, revision: number) => [...linkageKeys.one(linkageId), "joint", jointId, "suggestions", revision] as const,
};
export const logKeys = {
  all: (buildId: string) => [...buildKeys.one(buildId), "log"] as const,
  list: (buildId: string, query: string) => [...logKeys.all(buildId), query] as const,
};
export const hardwareKeys = { list: (buildId: string) => [...buildKeys.one(buildId), "hardware"] as const };
/** A parts library, by its API base (`/api/parts` or `/api/builds/:id/parts`). */
export const partKeys = { list: (apiBase: string) => ["parts", apiBase] as const };
export const meKeys = { notify: ["me", "notify"] as const };
