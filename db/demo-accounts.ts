/** The demo's sign-ins, shared by the seed and the start command's printout. Demo only. */
export const DEMO_USERS = [
  { email: "dana@demo.linkwright.test", name: "Dana Ortiz", password: "larkspur-builder", role: "owner" as const, isSiteAdmin: false },
  { email: "sam@demo.linkwright.test", name: "Sam Okafor", password: "larkspur-reviewer", role: "reviewer" as const, isSiteAdmin: false },
  { email: "lee@demo.linkwright.test", name: "Lee Park", password: "larkspur-viewer", role: "viewer" as const, isSiteAdmin: false },
  { email: "admin@demo.linkwright.test", name: "Site Admin", password: "larkspur-admin", role: null, isSiteAdmin: true },
];
export const DEMO_BUILD = { name: "Larkspur LX-2", model: "Larkspur LX-2 two-seat low-wing (plans-built)", registration: "N-LX2" };
