/**
 * Sign-up by e-mail confirmation, over HTTP on the real server with the real mail sink: the answer is the
 * same for a new address and one that has an account (status, body, about the same time); the new address
 * is mailed a single-use link that makes the account, the known one a reminder to sign in; a link works
 * once, expires, and a wrong one is a clear 4xx; nothing signs in before its link is opened.
 */
import { randomUUID } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { anonymous, confirmToken, signIn, signUp } from "../support/http";
import { mailTo } from "../support/review";
import { APP_URL } from "../support/env";

afterAll(() => testDb.destroy());

const fresh = (label = "new") => `${label}-${randomUUID().slice(0, 8)}@tests.linkwright.test`;
const post = (body: unknown) => anonymous().request("POST", "/api/sign-up", body);
const confirm = (token: string) => anonymous().request("POST", "/api/sign-up/confirm", { token });
async function canSignIn(email: string, password: string) {
  try { await signIn(email, password); return true; } catch { return false; }
}
/** The whole answer a caller sees: status, every header but the date, and the body. */
async function rawSignUp(body: unknown) {
  const t0 = performance.now();
  const res = await fetch(`${APP_URL}/api/sign-up`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  const text = await res.text();
  const headers = Object.fromEntries([...res.headers].filter(([k]) => !["date", "content-length"].includes(k)));
  return { status: res.status, headers, text, ms: performance.now() - t0 };
}

describe("sign-up answers the same whether or not the address has an account", () => {
  it("same status, headers and body for a new address and a known one (in any letter case)", async () => {
    const known = await makeUser("known");
    const a = await rawSignUp({ name: "Someone New", email: fresh(), password: "a long enough password" });
    const b = await rawSignUp({ name: "Someone Else", email: known.email.toUpperCase(), password: "a long enough password" });
    expect(a.status).toBe(202);
    expect(JSON.parse(a.text)).toEqual({ message: "Check your e-mail to finish creating your account." });
    expect([b.status, b.headers, b.text]).toEqual([a.status, a.headers, a.text]);
    expect(a.headers["set-cookie"]).toBeUndefined();
  });

  it("takes about as long for either (a password hash, a row and one e-mail each way)", async () => {
    const med = (xs: number[]) => [...xs].sort((x, y) => x - y)[xs.length >> 1];
    const n: number[] = [], k: number[] = [];
    for (let i = 0; i < 5; i++) {
      const known = await makeUser("timing");
      n.push((await rawSignUp({ name: "Timing New", email: fresh("timing-new"), password: "a long enough password" })).ms);
      k.push((await rawSignUp({ name: "Timing Known", email: known.email, password: "a long enough password" })).ms);
    }
    // Medians; a path that skipped the hash or the mail would answer in a fraction of the other's time.
    expect(med(n) / med(k)).toBeGreaterThan(0.6);
    expect(med(k) / med(n)).toBeGreaterThan(0.6);
  });

  it("a bad request is still a 400 naming the field, and nothing is recorded or sent", async () => {
    const email = fresh("bad");
    const r = await post({ name: "Short Password", email, password: "short" });
    expect([r.status, Object.keys(r.body.error.fields)]).toEqual([400, ["password"]]);
    expect(await testDb("sign_up_requests").whereRaw("lower(email) = lower(?)", [email])).toHaveLength(0);
    expect(await mailTo(email, { min: 1, ms: 500 })).toHaveLength(0);
  });
});

describe("the e-mail tells each address what happens next", () => {
  it("a new address gets a single-use link to finish; no account exists and nothing signs in until it is opened", async () => {
    const email = fresh();
    expect((await post({ name: "Link Follower", email, password: "my chosen password" })).status).toBe(202);
    const [m] = await mailTo(email);
    expect(m.to).toEqual([email]);
    expect(m.subject).toBe("Finish creating your Linkwright account");
    const link = m.text!.match(/https?:\/\/\S+\/sign-up\/confirm\/[A-Za-z0-9_-]+/)?.[0];
    expect(link!.startsWith(`${APP_URL}/sign-up/confirm/`)).toBe(true);
    expect(m.html).toContain(`href="${link}"`);
    expect(m.text).not.toContain("Link Follower"); // nothing the requester typed goes to the address
    const token = link!.split("/sign-up/confirm/")[1];
    // Only the token's hash is kept, with an expiry a day out.
    const row = await testDb("sign_up_requests").whereRaw("lower(email) = lower(?)", [email]).first();
    expect(row.token_hash).not.toBe(token);
    expect(row.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(await testDb("sign_up_requests").where({ token_hash: token }).first()).toBeUndefined();
    const hours = (new Date(row.expires_at).getTime() - new Date(row.created_at).getTime()) / 3_600_000;
    expect(hours).toBeCloseTo(24, 1);
    expect(row.password_hash).toMatch(/^\$2[aby]\$/);

    expect(await testDb("users").whereRaw("lower(email) = lower(?)", [email]).first()).toBeUndefined();
    expect(await canSignIn(email, "my chosen password")).toBe(false);

    // Opening the page itself changes nothing (a mail program fetching the link to preview it cannot spend it).
    expect((await anonymous().request("GET", `/sign-up/confirm/${token}`)).status).toBe(200);
    expect(await testDb("users").whereRaw("lower(email) = lower(?)", [email]).first()).toBeUndefined();

    const ok = await confirm(token);
    expect([ok.status, ok.body]).toEqual([200, { email, next: "/builds" }]);
    const user = await testDb("users").whereRaw("lower(email) = lower(?)", [email]).first();
    expect(user.name).toBe("Link Follower");
    expect(await canSignIn(email, "my chosen password")).toBe(true);
    expect((await testDb("sign_up_requests").where({ id: row.id }).first()).password_hash).toBeNull(); // not kept twice
  });

  it("a known address is told it has an account, with the sign-in link; its account and password are untouched", async () => {
    const known = await makeUser("has-account");
    const before = await testDb("users").where({ id: known.id }).first();
    expect((await post({ name: "Impostor", email: known.email, password: "an attacker's password" })).status).toBe(202);
    const [m] = await mailTo(known.email);
    expect(m.subject).toBe("You already have a Linkwright account");
    expect(m.text).toContain(`${APP_URL}/sign-in`);
    expect(m.text).not.toMatch(/sign-up\/confirm/);
    expect(m.text).not.toContain("Impostor");
    expect(await testDb("users").where({ id: known.id }).first()).toEqual(before);
    expect(await testDb("users").whereRaw("lower(email) = lower(?)", [known.email])).toHaveLength(1);
    expect((await testDb("sign_up_requests").whereRaw("lower(email) = lower(?)", [known.email]).first()).token_hash).toBeNull();
    expect(await canSignIn(known.email, "an attacker's password")).toBe(false);
    expect(await canSignIn(known.email, TEST_PASSWORD)).toBe(true);
  });

  it("one address gets at most five sign-up e-mails an hour; the answer stays the same", async () => {
    const email = fresh("flood");
    const answers = [];
    for (let i = 0; i < 7; i++) answers.push(await post({ name: "Flood", email, password: "a long enough password" }));
    expect(new Set(answers.map((a) => `${a.status} ${JSON.stringify(a.body)}`)).size).toBe(1);
    await new Promise((r) => setTimeout(r, 1000));
    expect(await mailTo(email, { min: 5 })).toHaveLength(5);
    expect(await testDb("sign_up_requests").whereRaw("lower(email) = lower(?)", [email])).toHaveLength(5);
  });
});

describe("the confirmation link", () => {
  it("works once: a second use is a 410 that says to sign in", async () => {
    const email = fresh("once");
    await post({ name: "Once Only", email, password: "a long enough password" });
    const token = await confirmToken(email);
    expect((await confirm(token)).status).toBe(200);
    const again = await confirm(token);
    expect([again.status, again.body.error.code]).toEqual([410, "link_closed"]);
    expect(again.body.error.message).toMatch(/already been used.*Sign in/);
    expect(await testDb("users").whereRaw("lower(email) = lower(?)", [email])).toHaveLength(1);
  });

  it("expires: after its day it is a 410 that says to sign up again, and no account is made", async () => {
    const email = fresh("late");
    await post({ name: "Too Late", email, password: "a long enough password" });
    const token = await confirmToken(email);
    await testDb("sign_up_requests").whereRaw("lower(email) = lower(?)", [email]).update({ expires_at: testDb.raw("now() - interval '1 second'") });
    const r = await confirm(token);
    expect([r.status, r.body.error.code]).toEqual([410, "link_closed"]);
    expect(r.body.error.message).toMatch(/expired.*Sign up again/);
    expect(await testDb("users").whereRaw("lower(email) = lower(?)", [email]).first()).toBeUndefined();
    // Signing up again sends a new link that works.
    await post({ name: "Too Late", email, password: "a long enough password" });
    expect((await confirm(await confirmToken(email, 1))).status).toBe(200);
  });

  it("a wrong token is a 404 saying so, a malformed one a 400 naming it; neither makes anything", async () => {
    const count = async () => Number((await testDb("users").count("* as n"))[0].n);
    const before = await count();
    const unknown = await confirm("A".repeat(43));
    expect([unknown.status, unknown.body.error.code]).toEqual([404, "not_found"]);
    expect(unknown.body.error.message).toMatch(/not one we sent/);
    const malformed = await confirm("not a token!");
    expect([malformed.status, Object.keys(malformed.body.error.fields)]).toEqual([400, ["token"]]);
    expect(await count()).toBe(before);
  });

  it("of two sign-ups of one address, the first link opened makes the account; the other then says it exists", async () => {
    const email = fresh("twice");
    await post({ name: "First Try", email, password: "first password here" });
    const first = await confirmToken(email);
    await post({ name: "Second Try", email, password: "second password here" });
    const second = await confirmToken(email, 1);
    expect((await confirm(second)).status).toBe(200);
    const late = await confirm(first);
    expect([late.status, late.body.error.message]).toEqual([410, "This e-mail address already has an account. Sign in with it."]);
    expect(await canSignIn(email, "second password here")).toBe(true);
    expect(await canSignIn(email, "first password here")).toBe(false);
  });

  it("keeps where the person was going (a path on this site only)", async () => {
    const a = fresh("next");
    expect((await signUp({ name: "Going Somewhere", email: a, next: "/invite/abc?x=1" })).next).toBe("/invite/abc?x=1");
    const b = fresh("next-evil");
    expect((await signUp({ name: "Sent Elsewhere", email: b, next: "//elsewhere.example/x" })).next).toBe("/builds");
  });
});

describe("invitations need the invited inbox", () => {
  it("someone who signs up with an invited address they cannot read gets no account, so cannot accept; the invitee can", async () => {
    const owner = await makeUser("inv-owner");
    const { buildId } = await makeBuild({ owner });
    const email = fresh("invited");
    const inv = await (await signIn(owner.email)).request("POST", `/api/builds/${buildId}/members`, { email, role: "builder" });
    const token = inv.body.link.split("/invite/")[1];
    // An impostor signs up with the invited address: without the mailbox there is no account to sign in with.
    expect((await post({ name: "Impostor", email, password: "impostor password" })).status).toBe(202);
    expect(await canSignIn(email, "impostor password")).toBe(false);
    expect(await testDb("memberships").where({ build_id: buildId })).toHaveLength(1);
    // The invitee signs up from the invitation page, follows the link in the mail, signs in and accepts.
    const done = await signUp({ name: "Real Invitee", email, password: "invitee password", next: `/invite/${token}` });
    expect(done.next).toBe(`/invite/${token}`);
    const invitee = await signIn(email, "invitee password");
    const accepted = await invitee.request("POST", `/api/invitations/${token}`);
    expect([accepted.status, accepted.body]).toEqual([200, { buildId, role: "builder" }]);
  });
});
