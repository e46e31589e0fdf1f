/**
 * The authorization matrix: every API route × every kind of caller → the status it must get.
 * A route added under app/api without a row here fails the first test.
 */
import { createHash, randomBytes, randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiRoutes } from "../support/routes";
import { makeBuild, makeUser, testDb } from "../support/db";
import { anonymous, signIn, type Client } from "../support/http";
import { emptyGraph } from "@/shared/linkage/schema";

type Who = "owner" | "builder" | "reviewer" | "viewer" | "outsider" | "anon";
const WHO: Who[] = ["owner", "builder", "reviewer", "viewer", "outsider", "anon"];
type Ctx = { buildId: string; linkageId: string; invitationId: string; extraId: string; token: string };
type Row = { expect: Record<Who, number>; path: (c: Ctx) => string; body?: (c: Ctx) => unknown };

const read = { owner: 200, builder: 200, reviewer: 200, viewer: 200, outsider: 404, anon: 401 };
const edit = (ok: number) => ({ owner: ok, builder: ok, reviewer: 403, viewer: 403, outsider: 404, anon: 401 });
const manage = (ok: number) => ({ owner: ok, builder: 403, reviewer: 403, viewer: 403, outsider: 404, anon: 401 });
const signedIn = (ok: number) => ({ owner: ok, builder: ok, reviewer: ok, viewer: ok, outsider: ok, anon: 401 });
const anyone = (ok: number) => ({ owner: ok, builder: ok, reviewer: ok, viewer: ok, outsider: ok, anon: ok });
const unique = () => `new-${randomUUID().slice(0, 8)}@tests.linkwright.test`;

const B = (c: Ctx) => `/api/builds/${c.buildId}`;
const L = (c: Ctx) => `${B(c)}/linkages/${c.linkageId}`;

// prettier-ignore
const MATRIX: Record<string, Row> = {
  "GET /api/auth/[...nextauth]":                        { expect: anyone(200), path: () => "/api/auth/csrf" },
  "POST /api/auth/[...nextauth]":                       { expect: anyone(200), path: () => "/api/auth/_log", body: () => ({}) },
  "POST /api/sign-up":                                  { expect: anyone(201), path: () => "/api/sign-up", body: () => ({ name: "New Person", email: unique(), password: "long enough password" }) },
  "GET /api/me":                                        { expect: signedIn(200), path: () => "/api/me" },
  "PATCH /api/me":                                      { expect: signedIn(200), path: () => "/api/me", body: () => ({ unitSystem: "US" }) },
  "POST /api/analyze":                                  { expect: signedIn(200), path: () => "/api/analyze", body: () => ({ graph: emptyGraph() }) },
  "GET /api/builds":                                    { expect: signedIn(200), path: () => "/api/builds" },
  "POST /api/builds":                                   { expect: signedIn(201), path: () => "/api/builds", body: () => ({ name: "Another build" }) },
  "GET /api/builds/[buildId]":                          { expect: read, path: B },
  "PATCH /api/builds/[buildId]":                        { expect: manage(200), path: B, body: () => ({ name: "Renamed" }) },
  "DELETE /api/builds/[buildId]":                       { expect: manage(200), path: B },
  "GET /api/builds/[buildId]/members":                  { expect: read, path: (c) => `${B(c)}/members` },
  "POST /api/builds/[buildId]/members":                 { expect: manage(201), path: (c) => `${B(c)}/members`, body: () => ({ email: unique(), role: "viewer" }) },
  "PATCH /api/builds/[buildId]/members/[userId]":       { expect: manage(200), path: (c) => `${B(c)}/members/${c.extraId}`, body: () => ({ role: "viewer" }) },
  "DELETE /api/builds/[buildId]/members/[userId]":      { expect: manage(200), path: (c) => `${B(c)}/members/${c.extraId}` },
  "GET /api/builds/[buildId]/invitations":              { expect: manage(200), path: (c) => `${B(c)}/invitations` },
  "POST /api/builds/[buildId]/invitations":             { expect: manage(201), path: (c) => `${B(c)}/invitations`, body: () => ({ email: unique(), role: "reviewer" }) },
  "DELETE /api/builds/[buildId]/invitations/[invitationId]": { expect: manage(200), path: (c) => `${B(c)}/invitations/${c.invitationId}` },
  "POST /api/invitations/[token]":                      { expect: signedIn(200), path: (c) => `/api/invitations/${c.token}` },
  "GET /api/builds/[buildId]/linkages":                 { expect: read, path: (c) => `${B(c)}/linkages` },
  "POST /api/builds/[buildId]/linkages":                { expect: edit(201), path: (c) => `${B(c)}/linkages`, body: () => ({ name: "Roll run", system: "roll" }) },
  "GET /api/builds/[buildId]/linkages/[linkageId]":     { expect: read, path: L },
  "PATCH /api/builds/[buildId]/linkages/[linkageId]":   { expect: edit(200), path: L, body: () => ({ name: "Pitch run, renamed" }) },
  "DELETE /api/builds/[buildId]/linkages/[linkageId]":  { expect: edit(200), path: L },
  "GET /api/builds/[buildId]/linkages/[linkageId]/graph": { expect: read, path: (c) => `${L(c)}/graph` },
  "PUT /api/builds/[buildId]/linkages/[linkageId]/graph": { expect: edit(200), path: (c) => `${L(c)}/graph`, body: () => ({ baseRevision: 1, graph: emptyGraph("Pitch run", "pitch") }) },
};

/** Other issues' routes register their rows here. */
export const EXTRA_ROWS: Record<string, Row> = {};

const clients = {} as Record<Who, Client>;
const users = {} as Record<Exclude<Who, "anon">, { id: string; email: string }>;

beforeAll(async () => {
  for (const w of WHO) {
    if (w === "anon") clients.anon = anonymous();
    else {
      users[w] = await makeUser(w);
      clients[w] = await signIn(users[w].email);
    }
  }
});
afterAll(() => testDb.destroy());

async function freshContext(): Promise<Ctx> {
  const extra = await makeUser("extra");
  const ids = await makeBuild({ owner: users.owner, builder: users.builder, reviewer: users.reviewer, viewer: users.viewer, extra });
  const token = randomBytes(24).toString("base64url");
  await testDb("invitations").insert({
    build_id: ids.buildId, email: "x@tests.linkwright.test", role: "viewer",
    token_hash: createHash("sha256").update(token).digest("hex"), expires_at: testDb.raw("now() + interval '1 day'"),
  });
  return { ...ids, extraId: extra.id, token };
}

describe("authorization matrix", () => {
  it("has a row for every route and method under app/api", () => {
    const rows = { ...MATRIX, ...EXTRA_ROWS };
    const missing = apiRoutes().filter((r) => !rows[r]);
    expect(missing, `routes without a row in the matrix: ${missing.join(", ")}`).toEqual([]);
    const stale = Object.keys(rows).filter((r) => !apiRoutes().includes(r));
    expect(stale, "rows for routes that no longer exist").toEqual([]);
  });

  for (const [route, row] of Object.entries(MATRIX)) {
    const method = route.split(" ")[0];
    it(route, async () => {
      const got: Partial<Record<Who, number>> = {};
      for (const who of WHO) {
        const ctx = await freshContext();
        const res = await clients[who].request(method, row.path(ctx), row.body?.(ctx));
        got[who] = res.status;
        if (res.status >= 400 && route.startsWith(method) && !route.includes("nextauth")) {
          expect(res.body?.error?.code, `${route} as ${who}: error body`).toBeTypeOf("string");
        }
      }
      expect(got).toEqual(row.expect);
    });
  }

  it("never shows a build's data to a non-member", async () => {
    const ctx = await freshContext();
    const res = await clients.outsider.request("GET", `/api/builds/${ctx.buildId}`);
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain("test model");
    const list = await clients.outsider.request("GET", "/api/builds");
    expect(list.body.builds.map((b: { id: string }) => b.id)).not.toContain(ctx.buildId);
  });
});
