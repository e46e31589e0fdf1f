import { randomUUID } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { anonymous, client, signIn, signUp } from "../support/http";
import { encode } from "next-auth/jwt";
import { APP_URL, TEST_SECRET } from "../support/env";

afterAll(() => testDb.destroy());

async function attempt(email: string, password: string) {
  try {
    await signIn(email, password);
    return "signed in";
  } catch {
    return "refused";
  }
}

describe("accounts and sign-in", () => {
  it("sign-up makes the account once its e-mailed link is followed; it then signs in, its password stored hashed", async () => {
    const email = `Fresh-${randomUUID().slice(0, 6)}@tests.linkwright.test`;
    await signUp({ name: "Fresh Builder", email, password: "a long password" });
    const stored = await testDb("users").whereRaw("lower(email) = lower(?)", [email]).first();
    expect(stored.password_hash).not.toContain("a long password");
    expect(stored.password_hash).toMatch(/^\$2[aby]\$/);
    expect(await attempt(email.toLowerCase(), "a long password")).toBe("signed in");
  });

  it("a password change checks the current one, ends every session (a copied cookie too), and the new one signs in", async () => {
    const u = await makeUser("password-change");
    const a = await signIn(u.email);
    const copy = client(a.cookie); // the same cookie, as if copied to another device
    const wrong = await a.request("POST", "/api/me/password", { currentPassword: "not it at all", newPassword: "a brand new passphrase" });
    expect([wrong.status, Object.keys(wrong.body.error.fields)]).toEqual([400, ["currentPassword"]]);
    const same = await a.request("POST", "/api/me/password", { currentPassword: "correct horse battery staple", newPassword: "correct horse battery staple" });
    expect([same.status, Object.keys(same.body.error.fields)]).toEqual([400, ["newPassword"]]);
    expect((await copy.request("GET", "/api/me")).status).toBe(200); // nothing changed yet
    const ok = await a.request("POST", "/api/me/password", { currentPassword: "correct horse battery staple", newPassword: "a brand new passphrase" });
    expect([ok.status, ok.body]).toEqual([200, { changed: true, signedOut: true }]);
    expect((await a.request("GET", "/api/me")).status).toBe(401);
    expect((await copy.request("GET", "/api/me")).status).toBe(401);
    expect(await attempt(u.email, "correct horse battery staple")).toBe("refused");
    expect(await attempt(u.email, "a brand new passphrase")).toBe("signed in");
  });

  it("five failed sign-ins make that e-mail wait (even with the right password), and only for a while; others are not affected", async () => {
    const victim = await makeUser("victim");
    const bystander = await makeUser("bystander");
    for (let i = 0; i < 5; i++) expect(await attempt(victim.email, "wrong password")).toBe("refused");
    expect(await attempt(victim.email, "correct horse battery staple")).toBe("refused");
    expect(await attempt(bystander.email, "correct horse battery staple")).toBe("signed in");
    expect(Number((await testDb("sign_in_attempts").where({ email: victim.email }).count("* as n"))[0].n)).toBe(5); // the refused try checked nothing
    // Someone failing the victim's address on purpose delays the victim, never shuts them out: once the wait
    // (15 s after the fifth failure, at most a minute) has passed, the right password signs in.
    await testDb("sign_in_attempts").where({ email: victim.email }).update({ created_at: testDb.raw("created_at - interval '61 seconds'") });
    expect(await attempt(victim.email, "correct horse battery staple")).toBe("signed in");
    expect(Number((await testDb("sign_in_attempts").where({ email: victim.email }).count("* as n"))[0].n)).toBe(0);
  });

  it("signing out ends the session on the server: a copy of the cookie is refused afterwards, other sessions too", async () => {
    const u = await makeUser("signs-out");
    const me = await signIn(u.email);
    const phone = await signIn(u.email); // a second session of the same account
    const stolen = client(me.cookie); // the same cookie, copied before sign-out
    expect((await stolen.request("GET", "/api/me")).status).toBe(200);
    // Sign out as the browser does: next-auth's sign-out endpoint with its CSRF token.
    const csrf = await fetch(`${APP_URL}/api/auth/csrf`, { headers: { cookie: me.cookie } });
    const csrfCookie = (csrf.headers.getSetCookie() ?? []).map((c) => c.split(";")[0]).join("; ");
    const { csrfToken } = await csrf.json();
    const out = await fetch(`${APP_URL}/api/auth/signout`, {
      method: "POST", redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie: `${me.cookie}; ${csrfCookie}` },
      body: new URLSearchParams({ csrfToken, json: "true" }),
    });
    expect(out.status).toBeLessThan(400);
    const after = await stolen.request("GET", "/api/me");
    expect([after.status, after.body.error.code]).toEqual([401, "unauthorized"]);
    expect((await phone.request("GET", "/api/me")).status).toBe(401); // every session of that account ends
    expect((await (await signIn(u.email)).request("GET", "/api/me")).status).toBe(200); // signing in again works
  });

  it("a cookie from before sign-out is refused (401) on build, linkage and page requests too, and a deleted account's as well", async () => {
    const u = await makeUser("signs-out-build");
    const { buildId, linkageId } = await makeBuild({ owner: u });
    const me = await signIn(u.email);
    const stolen = client(me.cookie);
    const graph = `/api/builds/${buildId}/linkages/${linkageId}/graph`;
    const page = () => fetch(`${APP_URL}/builds/${buildId}`, { redirect: "manual", headers: { cookie: me.cookie } });
    expect((await stolen.request("GET", `/api/builds/${buildId}`)).status).toBe(200);
    expect((await stolen.request("GET", graph)).status).toBe(200);
    expect((await page()).status).toBe(200);
    await testDb("users").where({ id: u.id }).increment("session_version", 1); // what signing out (on any instance) does
    for (const [method, path] of [["GET", `/api/builds/${buildId}`], ["GET", graph], ["GET", `/api/builds/${buildId}/linkages/${linkageId}/comments`]]) {
      const r = await stolen.request(method, path);
      expect([method, path, r.status, r.body.error?.code]).toEqual([method, path, 401, "unauthorized"]);
    }
    const put = await stolen.request("PUT", graph, { baseRevision: 1, graph: { nodes: [], joints: [] } });
    expect(put.status).toBe(401);
    expect((await testDb("linkages").where({ id: linkageId }).first()).current_revision).toBe(1);
    const p = await page();
    expect([p.status, p.headers.get("location")]).toEqual([307, expect.stringContaining("/sign-in")]);

    const gone = await makeUser("deleted-account");
    const theirs = await signIn(gone.email);
    expect((await theirs.request("GET", "/api/me")).status).toBe(200);
    await testDb("users").where({ id: gone.id }).del();
    expect((await theirs.request("GET", "/api/me")).status).toBe(401);
  });

  it("the session token counts only as the session cookie: sent as a bearer token it signs nobody in", async () => {
    const u = await makeUser("bearer");
    const me = await signIn(u.email);
    const token = me.cookie.slice(me.cookie.indexOf("=") + 1);
    const res = await fetch(`${APP_URL}/api/me`, { headers: { authorization: `Bearer ${token}` } });
    expect(res.status).toBe(401);
  });

  it("a session cookie that has expired, or was sealed with another secret, signs nobody in", async () => {
    const u = await makeUser("sealed");
    const cookieOf = async (secret: string, maxAge: number) => `next-auth.session-token=${await encode({ token: { sub: u.id, sv: 0 }, secret, maxAge })}`;
    expect((await client(await cookieOf(TEST_SECRET, 3600)).request("GET", "/api/me")).status).toBe(200); // sealed as the server seals it
    expect((await client(await cookieOf(TEST_SECRET, -60)).request("GET", "/api/me")).status).toBe(401); // a minute past its expiry
    expect((await client(await cookieOf("some other secret", 3600)).request("GET", "/api/me")).status).toBe(401);
  });

  it("guesses sent at the same moment cannot run past the limit: at most five passwords are checked", async () => {
    const target = await makeUser("parallel-target");
    const results = await Promise.all(Array.from({ length: 16 }, () => attempt(target.email, "wrong password")));
    expect(results.every((r) => r === "refused")).toBe(true);
    const checked = Number((await testDb("sign_in_attempts").where({ email: target.email }).count("* as n"))[0].n);
    expect(checked).toBeGreaterThan(0);
    expect(checked).toBeLessThanOrEqual(5);
  });

  it("takes as long for an unknown e-mail as for a known one with a wrong password (a password check either way)", async () => {
    const known = await makeUser("timing-known");
    const time = async (email: string) => { const t0 = performance.now(); await attempt(email, "wrong password"); return performance.now() - t0; };
    const med = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1];
    const k: number[] = [], u: number[] = [];
    for (let i = 0; i < 4; i++) { // four each: under the five-failure limit
      k.push(await time(known.email));
      u.push(await time(`nobody-${randomUUID().slice(0, 8)}@tests.linkwright.test`));
    }
    // Median of each; an unknown address that skipped the hash would answer in a fraction of the time.
    expect(med(u) / med(k)).toBeGreaterThan(0.6);
  });

  it("an invitation link brings a new person into the build with the invited role, once", async () => {
    const owner = await makeUser("inviter");
    const ids = await makeBuild({ owner });
    const ownerClient = await signIn(owner.email);
    const email = `invitee-${randomUUID().slice(0, 6)}@tests.linkwright.test`;
    const inv = await ownerClient.request("POST", `/api/builds/${ids.buildId}/members`, { email, role: "reviewer" });
    expect(inv.status).toBe(201);
    expect(inv.body.link).toMatch(new RegExp(`^${APP_URL}/invite/[A-Za-z0-9_-]{20,}$`));
    const token = inv.body.link.split("/").pop();
    // the token itself is not stored, only its hash
    expect(await testDb("invitations").where({ token_hash: token }).first()).toBeUndefined();

    // Someone else with the link (forwarded, or read over a shoulder) cannot take the place; it stays open.
    const forwarded = await signIn((await makeUser("forwarded-to")).email);
    const refused = await forwarded.request("POST", `/api/invitations/${token}`);
    expect([refused.status, refused.body.error.code]).toEqual([403, "forbidden"]);
    expect(refused.body.error.message).toMatch(/sent to i…@tests\.linkwright\.test/);
    expect(await testDb("memberships").where({ build_id: ids.buildId })).toHaveLength(1);

    await signUp({ name: "Invited Reviewer", email, password: "reviewer password" });
    const invitee = await signIn(email, "reviewer password");
    expect((await invitee.request("GET", `/api/builds/${ids.buildId}`)).status).toBe(404);
    const accepted = await invitee.request("POST", `/api/invitations/${token}`);
    expect(accepted.status).toBe(200);
    expect(accepted.body).toEqual({ buildId: ids.buildId, role: "reviewer" });
    const build = await invitee.request("GET", `/api/builds/${ids.buildId}`);
    expect(build.status).toBe(200);
    expect(build.body.role).toBe("reviewer");

    const someoneElse = await signIn((await makeUser("latecomer")).email);
    const reused = await someoneElse.request("POST", `/api/invitations/${token}`);
    expect(reused.status).toBe(410);
    expect((await someoneElse.request("GET", `/api/builds/${ids.buildId}`)).status).toBe(404);
  });

  it("the last owner cannot be demoted or removed", async () => {
    const owner = await makeUser("sole-owner");
    const ids = await makeBuild({ owner });
    const c = await signIn(owner.email);
    expect((await c.request("PATCH", `/api/builds/${ids.buildId}/members/${owner.id}`, { role: "builder" })).status).toBe(409);
    expect((await c.request("DELETE", `/api/builds/${ids.buildId}/members/${owner.id}`)).status).toBe(409);
    const role = await testDb("memberships").where({ build_id: ids.buildId, user_id: owner.id }).first();
    expect(role.role).toBe("owner");
  });
});
