/**
 * The authorization matrix: every API route × every kind of caller → the status it must get.
 * The rows live in ./matrix/ (one file per feature). A route under app/api without a row fails the first test.
 */
import { createHash, randomBytes } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiRoutes } from "../support/routes";
import { makeBuild, makeUser, testDb } from "../support/db";
import { anonymous, signIn, type Client } from "../support/http";
import { MATRIX } from "./matrix";
import { WHO, type Ctx, type Who } from "./matrix/types";

const clients = {} as Record<Who, Client>;
const users = {} as Ctx["users"];

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

async function freshContext(): Promise<Omit<Ctx, "x">> {
  const extra = await makeUser("extra");
  const ids = await makeBuild({ owner: users.owner, builder: users.builder, reviewer: users.reviewer, viewer: users.viewer, extra });
  const token = randomBytes(24).toString("base64url");
  await testDb("invitations").insert({
    build_id: ids.buildId, email: users.outsider.email, role: "viewer", // only the invited address may accept it
    token_hash: createHash("sha256").update(token).digest("hex"), expires_at: testDb.raw("now() + interval '1 day'"),
  });
  return { ...ids, extraId: extra.id, token, users };
}

describe("authorization matrix", () => {
  it("has a row for every route and method under app/api", () => {
    const routes = apiRoutes();
    const missing = routes.filter((r) => !MATRIX[r]);
    expect(missing, `routes without a row in the matrix: ${missing.join(", ")}`).toEqual([]);
    expect(Object.keys(MATRIX).filter((r) => !routes.includes(r)), "rows for routes that no longer exist").toEqual([]);
  });

  for (const [route, row] of Object.entries(MATRIX)) {
    const method = route.split(" ")[0];
    it(route, async () => {
      const got: Partial<Record<Who, number>> = {};
      for (const who of WHO) {
        const base = await freshContext();
        const ctx: Ctx = { ...base, x: {} };
        if (row.prepare) ctx.x = await row.prepare(ctx);
        const res = row.send ? await row.send(clients[who], ctx) : await clients[who].request(method, row.path(ctx), row.body?.(ctx));
        got[who] = res.status;
        if (res.status >= 400 && !route.includes("nextauth")) expect(res.body?.error?.code, `${route} as ${who}: error body`).toBeTypeOf("string");
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
