/** Every write route, given a malformed body by a caller who may write: 400 with field errors, and no row changed. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, snapshot, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { apiRoutes } from "../support/routes";
import { BAD_INPUT } from "./matrix";
import type { BadInput, Ctx } from "./matrix/types";

const B = (c: Ctx) => `/api/builds/${c.buildId}`;
const L = (c: Ctx) => `${B(c)}/linkages/${c.linkageId}`;
const nodeWithoutArms = { id: "s1", kind: "stick", label: "", position: { x: 0, y: 0 }, props: {} };

// route → path and a list of malformed bodies, each with a field the error must name
// prettier-ignore
const CASES: BadInput = {
  ...BAD_INPUT,
  "POST /api/sign-up": { path: () => "/api/sign-up", bodies: [[{ name: "", email: "not-an-email", password: "short" }, "email"], [{ name: 7 }, "name"]] },
  "POST /api/sign-up/confirm": { path: () => "/api/sign-up/confirm", bodies: [[{ token: "short" }, "token"], [{}, "token"], [{ token: "A".repeat(43), extra: 1 }, "_"]] },
  "PATCH /api/me": { path: () => "/api/me", bodies: [[{ unitSystem: "imperial" }, "unitSystem"]] },
  "POST /api/me/password": { path: () => "/api/me/password", bodies: [[{ currentPassword: "", newPassword: "a long enough new password" }, "currentPassword"], [{ currentPassword: "whatever it is", newPassword: "short" }, "newPassword"], [{ newPassword: "a long enough new password" }, "currentPassword"]] },
  "POST /api/analyze": { path: () => "/api/analyze", bodies: [[{ graph: { formatVersion: 2, nodes: [], joints: [] } }, "graph.formatVersion"], [{ graph: { formatVersion: 1, nodes: [nodeWithoutArms], joints: [] } }, "graph.nodes.0.props.gripArm"]] },
  "POST /api/builds": { path: () => "/api/builds", bodies: [[{ name: "" }, "name"], [{ name: "ok", registration: "no spaces!" }, "registration"]] },
  "PATCH /api/builds/[buildId]": { path: B, bodies: [[{ name: 12 }, "name"], [{ analysisSettings: { ultimateFactor: -1 } }, "analysisSettings.ultimateFactor"]] },
  "POST /api/builds/[buildId]/members": { path: (c) => `${B(c)}/members`, bodies: [[{ email: "x", role: "viewer" }, "email"], [{ email: "a@b.test", role: "pilot" }, "role"]] },
  "PATCH /api/builds/[buildId]/members/[userId]": { path: (c) => `${B(c)}/members/${c.extraId}`, bodies: [[{ role: "captain" }, "role"]] },
  "POST /api/builds/[buildId]/invitations": { path: (c) => `${B(c)}/invitations`, bodies: [[{ email: "", role: "viewer" }, "email"]] },
  "POST /api/builds/[buildId]/linkages": { path: (c) => `${B(c)}/linkages`, bodies: [[{ name: "Roll", system: "spin" }, "system"], [{ system: "roll" }, "name"]] },
  "PATCH /api/builds/[buildId]/linkages/[linkageId]": { path: L, bodies: [[{ name: "" }, "name"], [{ system: 3 }, "system"]] },
  "PUT /api/builds/[buildId]/linkages/[linkageId]/graph": {
    path: (c) => `${L(c)}/graph`,
    bodies: [
      [{ graph: { formatVersion: 1, nodes: [], joints: [] } }, "baseRevision"],
      [{ baseRevision: 1, graph: { formatVersion: 1, nodes: [], joints: [{ id: "j", from: { node: "a", port: "x" }, to: { node: "b", port: "y" } }] } }, "graph.joints.0.from.node"],
      [{ baseRevision: 1, graph: { formatVersion: 1, nodes: [nodeWithoutArms], joints: [] } }, "graph.nodes.0.props.gripArm"],
    ],
  },
};
/** Write routes that take no body (or only a path parameter), or whose bad input is tested in their own file. */
const NO_BODY = new Set([
  "POST /api/auth/[...nextauth]", // next-auth's own
  "POST /api/invitations/[token]", // no body
  "POST /api/builds/[buildId]/exports/[jobId]/retry", // no body: retries the job the path names
  "PATCH /api/admin/users/[userId]", // tests/api/admin.test.ts (needs a site admin)
  "POST /api/verify/file", // an upload, not JSON: a text file, a PDF that is no record and an unreadable one in tests/api/revision-record.test.ts
]);

let owner: Client;
let reviewer: Client;
let ctx: Ctx;
beforeAll(async () => {
  const u = await makeUser("writer");
  const r = await makeUser("reviewer");
  const extra = await makeUser("extra");
  owner = await signIn(u.email);
  reviewer = await signIn(r.email);
  ctx = { ...(await makeBuild({ owner: u, reviewer: r, extra })), extraId: extra.id, token: "", users: {} as Ctx["users"], x: {} };
});
afterAll(() => testDb.destroy());

describe("malformed input", () => {
  it("covers every write route that takes a body", () => {
    const writes = apiRoutes().filter((r) => /^(POST|PUT|PATCH) /.test(r) && !NO_BODY.has(r));
    const all = CASES;
    expect(writes.filter((r) => !all[r])).toEqual([]);
  });

  for (const [route, c] of Object.entries(CASES)) {
    const method = route.split(" ")[0];
    it(`${route} → 400 with field errors, nothing changed`, async () => {
      const sender = c.as === "reviewer" ? reviewer : owner;
      for (const [body, field] of c.bodies) {
        const before = await snapshot();
        const res = await sender.request(method, c.path(ctx), body);
        expect(res.status, JSON.stringify(res.body)).toBe(400);
        expect(res.body.error.code).toBe("invalid_input");
        expect(Object.keys(res.body.error.fields)).toContain(field);
        expect(await snapshot()).toEqual(before);
      }
      const before = await snapshot();
      const broken = await sender.request(method, c.path(ctx), undefined, "{not json");
      expect(broken.status).toBe(400);
      expect(broken.body.error.code).toBe("invalid_json");
      expect(await snapshot()).toEqual(before);
    });
  }
});
