/**
 * Routes under /linkages/[linkageId] resolve their linkage in one place (withLinkage): a linkage of
 * another build, or an id that is no linkage at all, is a 404 on every one of them and changes nothing,
 * even for a member of both builds. And no route writes an error code or status of its own.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, snapshot, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { apiRoutes } from "../support/routes";
import { MATRIX } from "./matrix";
import type { Ctx } from "./matrix/types";
import { ERROR_STATUS } from "@/lib/errors";

const LINKAGE_ROUTES = Object.keys(MATRIX).filter((r) => r.includes("/linkages/[linkageId]"));
let owner: Client, reviewer: Client;
let users: Ctx["users"];
let foreignLinkageId: string;

beforeAll(async () => {
  users = {} as Ctx["users"];
  for (const w of ["owner", "builder", "reviewer", "viewer", "outsider"] as const) users[w] = await makeUser(`lr-${w}`);
  // The same people are members of the other build: only the linkage lookup can refuse.
  foreignLinkageId = (await makeBuild({ owner: users.owner, reviewer: users.reviewer })).linkageId;
  [owner, reviewer] = await Promise.all([signIn(users.owner.email), signIn(users.reviewer.email)]);
});
afterAll(() => testDb.destroy());

/**
 * A build of its own per route, as the matrix makes, shared by that route's three cases: each case must leave
 * every row as it was (checked below), so the next one finds the build as it was made.
 */
const contexts = new Map<string, Promise<Ctx>>();
function contextFor(route: string) {
  if (!contexts.has(route)) contexts.set(route, (async () => {
    const extra = await makeUser("lr-extra");
    const ids = await makeBuild({ owner: users.owner, builder: users.builder, reviewer: users.reviewer, viewer: users.viewer, extra });
    const ctx: Ctx = { ...ids, extraId: extra.id, token: "unused", users, x: {} };
    if (MATRIX[route].prepare) ctx.x = await MATRIX[route].prepare!(ctx);
    return ctx;
  })());
  return contexts.get(route)!;
}

async function tryWith(route: string, linkageId: string) {
  const row = MATRIX[route];
  const swapped: Ctx = { ...(await contextFor(route)), linkageId };
  const before = await snapshot();
  const method = route.split(" ")[0];
  const who = row.expect.owner < 300 ? owner : reviewer; // someone the route lets through
  const res = row.send ? await row.send(who, swapped) : await who.request(method, row.path(swapped), row.body?.(swapped));
  expect(res.status, `${route} with linkage ${linkageId}: ${JSON.stringify(res.body)}`).toBe(404);
  expect(res.body.error.code).toBe("not_found");
  expect(await snapshot(), `${route} changed a row`).toEqual(before);
}

describe("linkage routes", () => {
  it("cover every route under /linkages/[linkageId]", () => {
    expect(LINKAGE_ROUTES.length).toBe(apiRoutes().filter((r) => r.includes("/linkages/[linkageId]")).length);
    expect(LINKAGE_ROUTES.length).toBeGreaterThan(20);
  });

  it("refuse a linkage of another build with a 404, changing nothing", async () => {
    for (const route of LINKAGE_ROUTES) await tryWith(route, foreignLinkageId);
  });

  it("refuse an id that is no linkage (malformed or unknown) with a 404", async () => {
    for (const route of LINKAGE_ROUTES) {
      await tryWith(route, "not-a-linkage");
      await tryWith(route, "00000000-0000-4000-8000-000000000000");
    }
  });
});

describe("error codes", () => {
  it("each code of the closed list has a 4xx or 5xx status", () => {
    for (const [code, status] of Object.entries(ERROR_STATUS)) {
      expect(code).toMatch(/^[a-z]+(_[a-z]+)*$/);
      expect(status >= 400 && status < 600, code).toBe(true);
    }
  });

  it("no route writes an error code, a status or its own linkage lookup", () => {
    const api = path.resolve(__dirname, "../../app/api");
    for (const r of apiRoutes()) {
      const dir = r.split(" ")[1].replace(/^\/api\/?/, "");
      const src = readFileSync(path.join(api, dir, "route.ts"), "utf8");
      expect(src, r).not.toMatch(/new ApiError\(|apiError\(|code:\s*"|status:\s*[45]\d\d|parseParams\(params\.linkageId|requestedRevision/);
    }
  });
});
