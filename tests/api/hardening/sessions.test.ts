/**
 * A session cookie copied to another device (or stolen) stops working when its session ends — signing out,
 * a password change — on every surface: the API, the pages and next-auth's own session endpoint, which must
 * neither tell the copy whose account it was nor renew it. Removal from a build ends the copy's access to that
 * build at once (every request checks membership), while the account's other builds stay open to it.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../../support/db";
import { client, signIn, type Client } from "../../support/http";
import { fixtureFile } from "../../support/upload";
import { APP_URL } from "../../support/env";

afterAll(() => testDb.destroy());

/** next-auth's session endpoint with a cookie: what it says, and whether it hands out a renewed session cookie. */
async function authSession(c: Client) {
  const res = await fetch(`${APP_URL}/api/auth/session`, { headers: { cookie: c.cookie } });
  const renewed = (res.headers.getSetCookie() ?? []).some((s) => s.startsWith("next-auth.session-token=") && !/=;|Max-Age=0|1970/i.test(s));
  return { body: await res.json(), renewed };
}
async function page(c: Client, path: string) {
  const res = await fetch(`${APP_URL}${path}`, { headers: { cookie: c.cookie }, redirect: "manual" });
  return { status: res.status, location: res.headers.get("location") ?? "" };
}

/** Everything a signed-in account reaches, tried with the copied cookie: all refused. */
async function expectEnded(copy: Client, buildId: string) {
  const me = await copy.request("GET", "/api/me");
  expect([me.status, me.body.error?.code]).toEqual([401, "unauthorized"]);
  expect((await copy.request("GET", `/api/builds/${buildId}`)).status).toBe(401);
  expect((await copy.request("POST", "/api/builds", { name: "Made with a copied cookie" })).status).toBe(401);
  const p = await page(copy, `/builds/${buildId}`);
  expect([p.status, p.location.includes("/sign-in")]).toEqual([307, true]);
  expect(await authSession(copy)).toEqual({ body: {}, renewed: false });
}

let ids: { buildId: string; linkageId: string };
let owner: Client;
beforeAll(async () => {
  const o = await makeUser("sess-owner");
  ids = await makeBuild({ owner: o });
  owner = await signIn(o.email);
});

describe("a copied session cookie", () => {
  it("works while its session lasts: the session endpoint answers it and renews it", async () => {
    const u = await makeUser("sess-live");
    const s = await authSession(await signIn(u.email));
    expect(s.body.user).toMatchObject({ email: u.email, id: u.id });
    expect(s.renewed).toBe(true);
  });

  it("is refused everywhere after its owner signs out (on another device)", async () => {
    const u = await makeUser("sess-out");
    await testDb("memberships").insert({ build_id: ids.buildId, user_id: u.id, role: "builder" });
    const me = await signIn(u.email);
    const copy = client(me.cookie);
    expect((await copy.request("GET", `/api/builds/${ids.buildId}`)).status).toBe(200);
    const csrf = await fetch(`${APP_URL}/api/auth/csrf`, { headers: { cookie: me.cookie } });
    const csrfCookie = (csrf.headers.getSetCookie() ?? []).map((c) => c.split(";")[0]).join("; ");
    const { csrfToken } = await csrf.json();
    const out = await fetch(`${APP_URL}/api/auth/signout`, {
      method: "POST", redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie: `${me.cookie}; ${csrfCookie}` },
      body: new URLSearchParams({ csrfToken, json: "true" }),
    });
    expect(out.status).toBeLessThan(400);
    await expectEnded(copy, ids.buildId);
    expect(await testDb("builds").where({ name: "Made with a copied cookie" })).toHaveLength(0);
  });

  it("is refused everywhere after a password change", async () => {
    const u = await makeUser("sess-pw");
    await testDb("memberships").insert({ build_id: ids.buildId, user_id: u.id, role: "viewer" });
    const me = await signIn(u.email);
    const copy = client(me.cookie);
    expect((await copy.request("GET", "/api/me")).status).toBe(200);
    const r = await me.request("POST", "/api/me/password", { currentPassword: TEST_PASSWORD, newPassword: "an entirely new passphrase" });
    expect(r.status).toBe(200);
    await expectEnded(copy, ids.buildId);
  });

  it("loses the build its account is removed from, at once and on every route and page of it; other builds stay", async () => {
    const u = await makeUser("sess-removed");
    const other = await makeBuild({ owner: u });
    await testDb("memberships").insert({ build_id: ids.buildId, user_id: u.id, role: "builder" });
    const fileId = await fixtureFile(ids.buildId, null);
    const copy = client((await signIn(u.email)).cookie);
    const L = `/api/builds/${ids.buildId}/linkages/${ids.linkageId}`;
    expect((await copy.request("GET", `${L}/graph`)).status).toBe(200);
    expect((await copy.request("GET", `/api/builds/${ids.buildId}/files/${fileId}`)).status).toBe(200);

    const removed = await owner.request("DELETE", `/api/builds/${ids.buildId}/members/${u.id}`);
    expect(removed.status).toBe(200);

    const graph = (await owner.request("GET", `${L}/graph`)).body;
    for (const [method, path, body] of [
      ["GET", `/api/builds/${ids.buildId}`],
      ["GET", `${L}/graph`],
      ["PUT", `${L}/graph`, { baseRevision: graph.revision, graph: graph.graph }],
      ["POST", `${L}/comments`, { subject: { type: "linkage", id: ids.linkageId }, body: "after removal" }],
      ["GET", `/api/builds/${ids.buildId}/files/${fileId}`],
      ["GET", `/api/builds/${ids.buildId}/log`],
    ] as [string, string, unknown?][]) {
      const r = await copy.request(method, path, body);
      expect([r.status, r.body?.error?.code], `${method} ${path}`).toEqual([404, "not_found"]);
    }
    expect((await page(copy, `/builds/${ids.buildId}`)).status).toBe(404);
    expect((await page(copy, `/builds/${ids.buildId}/linkages/${ids.linkageId}`)).status).toBe(404);
    const list = await copy.request("GET", "/api/builds");
    expect(list.body.builds.map((b: { id: string }) => b.id)).toEqual([other.buildId]);
    expect(await testDb("comments").where({ body: "after removal" })).toHaveLength(0);
    expect((await testDb("linkages").where({ id: ids.linkageId }).first()).current_revision).toBe(graph.revision);
    // The account itself is still signed in: removal from one build is not a sign-out.
    expect((await copy.request("GET", `/api/builds/${other.buildId}`)).status).toBe(200);
  });

  it("of an account demoted to viewer can no longer change the build", async () => {
    const u = await makeUser("sess-demoted");
    await testDb("memberships").insert({ build_id: ids.buildId, user_id: u.id, role: "builder" });
    const copy = client((await signIn(u.email)).cookie);
    expect((await owner.request("PATCH", `/api/builds/${ids.buildId}/members/${u.id}`, { role: "viewer" })).status).toBe(200);
    const graph = (await owner.request("GET", `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`)).body;
    const r = await copy.request("PUT", `/api/builds/${ids.buildId}/linkages/${ids.linkageId}/graph`, { baseRevision: graph.revision, graph: graph.graph });
    expect([r.status, r.body.error.code]).toEqual([403, "forbidden"]);
  });
});
