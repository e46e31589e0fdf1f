/**
 * Whose address the per-IP sign-in limit counts. Without a trusted proxy (LW_TRUSTED_PROXY_HOPS unset, the
 * test server) it is the address of the connection, whatever X-Forwarded-For says, so a client cannot
 * escape the limit by making up a new header each try. Behind one trusted proxy (a second instance with
 * LW_TRUSTED_PROXY_HOPS=1) it is the address that proxy appended: the right-most one.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import { mkdirSync, openSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testDb } from "../../support/db";
import { APP_URL, DIST_DIR, TEST_DB_URL, TEST_PORT, TEST_SECRET } from "../../support/env";
import { nextStartArgs } from "../../../scripts/next-start.mjs";

/** db/users.ts MAX_FAILS_PER_IP (db/ cannot be imported into a test: it opens the app's own pool). */
const MAX_FAILS_PER_IP = 30;
const ROOT = path.resolve(__dirname, "../../..");
const PROXIED = `http://127.0.0.1:${TEST_PORT + 1}`;
const IP_REFUSAL = "Too many failed sign-ins from this address. Wait 15 minutes and try again.";
const RUN = randomUUID().slice(0, 8);
const emailFor = (i: number | string) => `ip-${RUN}-${i}@tests.linkwright.test`;
let second: ChildProcess | null = null;

/** One wrong password through next-auth, with the given X-Forwarded-For; answers next-auth's error (the refusal's text when refused). */
async function wrongPassword(email: string, xff: string | null, base = APP_URL) {
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  const cookie = (csrfRes.headers.getSetCookie() ?? []).map((c) => c.split(";")[0]).join("; ");
  const { csrfToken } = await csrfRes.json();
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie, ...(xff === null ? {} : { "x-forwarded-for": xff }) },
    body: new URLSearchParams({ csrfToken, email, password: "wrong password", json: "true" }),
  });
  const { url } = await res.json();
  return new URL(url).searchParams.get("error");
}
const ipsOf = async (email: string) => (await testDb("sign_in_attempts").where({ email }).orderBy("id").select("ip")).map((r) => r.ip as string);
const inWindow = async (ip: string) =>
  Number((await testDb("sign_in_attempts").where({ ip }).where("created_at", ">", testDb.raw("now() - interval '15 minutes'")).count("* as n"))[0].n);

async function waitFor(url: string, ms: number) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).status < 500) return;
    } catch {}
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the proxied instance did not answer on ${url} within ${ms} ms (tests/artifacts/next-server-proxied.log)`);
}

beforeAll(async () => {
  mkdirSync(path.join(ROOT, "tests/artifacts"), { recursive: true });
  const log = openSync(path.join(ROOT, "tests/artifacts/next-server-proxied.log"), "w");
  second = spawn(process.execPath, nextStartArgs("127.0.0.1", TEST_PORT + 1), {
    cwd: ROOT,
    stdio: ["ignore", log, log],
    env: {
      ...process.env, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1", NEXT_DIST_DIR: DIST_DIR, DATABASE_URL: TEST_DB_URL,
      NEXTAUTH_SECRET: TEST_SECRET, NEXTAUTH_URL: PROXIED, LW_WORKER: "0", LW_TRUSTED_PROXY_HOPS: "1",
    },
  });
  await waitFor(`${PROXIED}/api/auth/csrf`, 90_000);
}, 120_000);

afterAll(async () => {
  second?.kill("SIGTERM");
  // Leave no failures behind: the other tests sign in from this same address.
  await testDb("sign_in_attempts").where("email", "like", `ip-${RUN}-%`).del();
  await testDb.destroy();
});

describe("the per-IP sign-in limit", () => {
  it("without a trusted proxy counts the connection's address, whatever X-Forwarded-For says", async () => {
    expect(await wrongPassword(emailFor("a"), "203.0.113.1")).toBe("CredentialsSignin");
    expect(await wrongPassword(emailFor("a"), "203.0.113.2, 198.51.100.2")).toBe("CredentialsSignin");
    expect(await wrongPassword(emailFor("a"), null)).toBe("CredentialsSignin");
    expect(await ipsOf(emailFor("a"))).toEqual(["127.0.0.1", "127.0.0.1", "127.0.0.1"]);
  });

  it("cannot be escaped by sending a new X-Forwarded-For with each guess", async () => {
    // Guess from this address up to the limit, each time claiming to be someone else, at another e-mail.
    const room = MAX_FAILS_PER_IP - (await inWindow("127.0.0.1"));
    for (let i = 0; i < room; i++) expect(await wrongPassword(emailFor(i), `198.51.100.${i + 1}`), `guess ${i + 1}`).toBe("CredentialsSignin");
    expect(await inWindow("127.0.0.1")).toBe(MAX_FAILS_PER_IP);
    // The next one is refused however it is dressed, and checks no password.
    expect(await wrongPassword(emailFor("next"), "192.0.2.200")).toBe(IP_REFUSAL);
    expect(await wrongPassword(emailFor("next"), "192.0.2.201, 192.0.2.202")).toBe(IP_REFUSAL);
    expect(await wrongPassword(emailFor("next"), null)).toBe(IP_REFUSAL);
    expect(await ipsOf(emailFor("next"))).toEqual([]);
  }, 60_000);

  it("behind one trusted proxy counts the address the proxy appended, not what the client claimed before it", async () => {
    expect(await wrongPassword(emailFor("p"), "10.9.9.9, 203.0.113.50", PROXIED)).toBe("CredentialsSignin");
    expect(await wrongPassword(emailFor("p"), "203.0.113.51", PROXIED)).toBe("CredentialsSignin");
    expect(await ipsOf(emailFor("p"))).toEqual(["203.0.113.50", "203.0.113.51"]);
    // That client at its limit is refused whatever it puts in front; the next client is not.
    await testDb("sign_in_attempts").insert(Array.from({ length: MAX_FAILS_PER_IP }, (_, i) => ({ email: emailFor(`f${i}`), ip: "203.0.113.60" })));
    expect(await wrongPassword(emailFor("q"), "203.0.113.60", PROXIED)).toBe(IP_REFUSAL);
    expect(await wrongPassword(emailFor("q"), "10.1.1.1, 203.0.113.60", PROXIED)).toBe(IP_REFUSAL);
    expect(await wrongPassword(emailFor("q"), "203.0.113.60, 203.0.113.61", PROXIED)).toBe("CredentialsSignin");
  }, 60_000);
});
