/**
 * Several app instances on one database and one bucket: a second `next start` (port LW_TEST_PORT + 1)
 * beside the test server, same build, same database, same services. A session, a sign-in lockout, a
 * stale save, a comment notification and a sign-off behave the same whichever instance answers,
 * because every piece of shared state lives in PostgreSQL (or the bucket), none in a process.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { mkdirSync, openSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emptyGraph } from "@/shared/linkage/schema";
import { demoPitchLinkage } from "@/shared/demo";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { APP_URL, DIST_DIR, TEST_DB_URL, TEST_PORT, TEST_S3_ENDPOINT, TEST_SECRET, TEST_SMTP_URL } from "../support/env";
import { client, signIn, type Client } from "../support/http";
import { mailTo } from "../support/review";
import { nextStartArgs } from "../../scripts/next-start.mjs";

const ROOT = path.resolve(__dirname, "../..");
const A = APP_URL;
const B = `http://127.0.0.1:${TEST_PORT + 1}`;
let second: ChildProcess | null = null;

async function waitFor(url: string, ms: number) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).status < 500) return;
    } catch {}
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the second instance did not answer on ${url} within ${ms} ms (tests/artifacts/next-server-2.log)`);
}

beforeAll(async () => {
  mkdirSync(path.join(ROOT, "tests/artifacts"), { recursive: true });
  const log = openSync(path.join(ROOT, "tests/artifacts/next-server-2.log"), "w");
  second = spawn(process.execPath, nextStartArgs("127.0.0.1", TEST_PORT + 1), {
    cwd: ROOT,
    stdio: ["ignore", log, log],
    env: {
      ...process.env,
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      NEXT_DIST_DIR: DIST_DIR,
      DATABASE_URL: TEST_DB_URL,
      NEXTAUTH_SECRET: TEST_SECRET,
      NEXTAUTH_URL: A, // one public address in front of both instances
      SMTP_URL: TEST_SMTP_URL,
      S3_ENDPOINT: TEST_S3_ENDPOINT,
      S3_BUCKET: "linkwright",
      S3_REGION: "us-east-1",
      S3_ACCESS_KEY_ID: "S3RVER",
      S3_SECRET_ACCESS_KEY: "S3RVER",
    },
  });
  await waitFor(`${B}/api/auth/csrf`, 90_000);
}, 120_000);

afterAll(async () => {
  second?.kill("SIGTERM");
  await testDb.destroy();
});

const on = (url: string) => (url === A ? "A" : "B");
const attempt = (email: string, password: string, base: string) => signIn(email, password, base).then(() => "signed in", () => "refused");

describe("two app instances on one database", () => {
  it("a session made on one instance is honoured by the other", async () => {
    const u = await makeUser("two-session");
    for (const [from, to] of [[A, B], [B, A]]) {
      const mine = await signIn(u.email, TEST_PASSWORD, from);
      const me = await client(mine.cookie, to).request("GET", "/api/me");
      expect([on(from), on(to), me.status, me.body.user?.id]).toEqual([on(from), on(to), 200, u.id]);
    }
  });

  it("signing out through one instance ends the session on the other at its next request (build and linkage routes too)", async () => {
    const u = await makeUser("two-signout");
    const { buildId, linkageId } = await makeBuild({ owner: u });
    const graph = `/api/builds/${buildId}/linkages/${linkageId}/graph`;
    const onA = await signIn(u.email, TEST_PASSWORD, A);
    const sameOnB = client(onA.cookie, B); // the same cookie, answered by the other instance
    for (let i = 0; i < 3; i++) expect((await sameOnB.request("GET", graph)).status).toBe(200); // B has served it, more than once
    const csrf = await fetch(`${A}/api/auth/csrf`, { headers: { cookie: onA.cookie } });
    const csrfCookie = (csrf.headers.getSetCookie() ?? []).map((c) => c.split(";")[0]).join("; ");
    const out = await fetch(`${A}/api/auth/signout`, {
      method: "POST", redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie: `${onA.cookie}; ${csrfCookie}` },
      body: new URLSearchParams({ csrfToken: (await csrf.json()).csrfToken, json: "true" }),
    });
    expect(out.status).toBeLessThan(400);
    for (const path of [graph, `/api/builds/${buildId}`, "/api/me"]) expect([path, (await sameOnB.request("GET", path)).status]).toEqual([path, 401]);
  });

  it("failed sign-ins spread over both instances lock the e-mail on both", async () => {
    const victim = await makeUser("two-victim");
    const bystander = await makeUser("two-bystander");
    for (const base of [A, B, A, B, A]) expect(await attempt(victim.email, "wrong password", base)).toBe("refused");
    expect(await attempt(victim.email, TEST_PASSWORD, A)).toBe("refused");
    expect(await attempt(victim.email, TEST_PASSWORD, B)).toBe("refused");
    expect(await attempt(bystander.email, TEST_PASSWORD, B)).toBe("signed in");
  });

  it("a save on a revision another instance has replaced is refused with 409", async () => {
    const u = await makeUser("two-saver");
    const { buildId, linkageId } = await makeBuild({ owner: u });
    const url = `/api/builds/${buildId}/linkages/${linkageId}/graph`;
    const [a, b] = [await signIn(u.email, TEST_PASSWORD, A), await signIn(u.email, TEST_PASSWORD, B)];
    const base = (await a.request("GET", url)).body.revision;
    const first = await b.request("PUT", url, { baseRevision: base, graph: emptyGraph("saved on B", "pitch") });
    expect(first.status).toBe(200);
    const stale = await a.request("PUT", url, { baseRevision: base, graph: emptyGraph("saved on A", "pitch") });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatchObject({ code: "stale_revision", current: { revision: base + 1 } });
    for (const c of [a, b]) expect((await c.request("GET", url)).body.graph.name).toBe("saved on B");
  });

  it("a report computed again through one instance is what both send, though both had read the earlier one", async () => {
    // Each instance keeps revisions' text under a content id that changes with the row (db/revision-content.ts).
    const u = await makeUser("two-settings");
    const { buildId, linkageId } = await makeBuild({ owner: u });
    const url = `/api/builds/${buildId}/linkages/${linkageId}/graph`;
    const [a, b] = [await signIn(u.email, TEST_PASSWORD, A), await signIn(u.email, TEST_PASSWORD, B)];
    const saved = await a.request("PUT", url, { baseRevision: (await a.request("GET", url)).body.revision, graph: demoPitchLinkage() });
    expect(saved.status).toBe(200);
    for (const c of [a, b]) expect((await c.request("GET", url)).body.analysis.settings.pilotForce.pitchStick).toBe(167); // 14 CFR 23.397(b) default
    const patched = await a.request("PATCH", `/api/builds/${buildId}`, { analysisSettings: { pilotForce: { pitchStick: 300, rollStick: 67, yawPedal: 200, other: 100 } } });
    expect(patched.status).toBe(200);
    for (const c of [a, b]) {
      const got = (await c.request("GET", url)).body;
      expect(got.revision).toBe(saved.body.revision); // the same revision, its report computed again
      expect(got.analysis.settings.pilotForce.pitchStick).toBe(300);
    }
  });

  it("comments notify the same followers and sign-offs count the same, whichever instance answers", async () => {
    const [owner, builder, reviewer] = await Promise.all([makeUser("two-owner"), makeUser("two-builder"), makeUser("two-reviewer")]);
    const { buildId, linkageId } = await makeBuild({ owner, builder, reviewer });
    const L = `/api/builds/${buildId}/linkages/${linkageId}`;
    const at = async (u: { email: string }, base: string) => signIn(u.email, TEST_PASSWORD, base);
    const [bA, bB, rA, rB]: Client[] = [await at(builder, A), await at(builder, B), await at(reviewer, A), await at(reviewer, B)];
    const saved = await bB.request("PUT", `${L}/graph`, { baseRevision: 1, graph: emptyGraph("Pitch run", "pitch") });
    expect(saved.status).toBe(200);

    // A comment on B and a reply on A: the owner follows the linkage and hears of both; the builder, a commenter, hears of the reply.
    const c1 = await bB.request("POST", `${L}/comments`, { subject: { type: "linkage", id: linkageId }, body: "Posted through instance B." });
    expect([c1.status, c1.body.notified]).toEqual([201, 1]);
    const c2 = await rA.request("POST", `${L}/comments`, { subject: { type: "linkage", id: linkageId }, body: "Replied through instance A.", parentId: c1.body.comment.id });
    expect([c2.status, c2.body.notified]).toEqual([201, 2]);
    expect((await mailTo(owner.email, { min: 2 })).map((m) => m.text?.includes("instance B") || m.text?.includes("instance A"))).toEqual([true, true]);
    expect(await mailTo(builder.email)).toHaveLength(1);
    for (const c of [bA, rB]) expect((await c.request("GET", `${L}/comments`)).body.comments).toHaveLength(2);

    // Sign off on A; B sees it signed. A save on B makes it stale on A, and A refuses to sign the replaced revision.
    const rev = saved.body.revision;
    const s = await rA.request("POST", `${L}/signoffs`, { revision: rev, statement: "Checked through instance A." });
    expect(s.status, JSON.stringify(s.body)).toBe(201);
    expect((await rB.request("GET", `${L}/signoffs`)).body.status.state).toBe("signed");
    const signedMail = await mailTo(owner.email, { min: 3 });
    expect(signedMail.some((m) => m.subject?.startsWith("Signed off:"))).toBe(true);
    expect((await bB.request("PUT", `${L}/graph`, { baseRevision: rev, graph: emptyGraph("Pitch run, changed", "pitch") })).status).toBe(200);
    expect((await rA.request("GET", `${L}/signoffs`)).body.status.state).toBe("stale");
    const old = await rA.request("POST", `${L}/signoffs`, { revision: rev, statement: "Too late." });
    expect([old.status, old.body.error.code]).toEqual([409, "not_current"]);
  });
});
