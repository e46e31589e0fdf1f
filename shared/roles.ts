/** Roles of a member in a build and what each may do. The one table every check reads. */
export const ROLES = ["owner", "builder", "reviewer", "viewer"] as const;
export type Role = (typeof ROLES)[number];

export const CAPABILITIES = {
  /** See the build and everything in it. */
  read: ["owner", "builder", "reviewer", "viewer"],
  /** Change linkages, hardware, log entries, uploads, parts. */
  edit: ["owner", "builder"],
  /** Write comments and replies. */
  comment: ["owner", "builder", "reviewer"],
  /** Acknowledge findings. */
  acknowledge: ["owner", "reviewer"],
  /** Sign off a linkage revision. */
  signOff: ["reviewer"],
  /** Members, invitations, build settings, deleting the build. */
  manage: ["owner"],
} as const satisfies Record<string, readonly Role[]>;
export type Capability = keyof typeof CAPABILITIES;

export function can(role: Role | null | undefined, capability: Capability): boolean {
  return !!role && (CAPABILITIES[capability] as readonly Role[]).includes(role);
}

export const ROLE_LABEL: Record<Role, string> = {
  owner: "Owner",
  builder: "Builder",
  reviewer: "Reviewer",
  viewer: "Viewer",
};
