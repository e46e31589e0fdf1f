/**
 * The database stopped under a running app: API routes answer 503 `unavailable` with Retry-After at once
 * (no request hangs), pages show the same retry message (in a browser: app/error.tsx), and once PostgreSQL is back the same requests
 * succeed within 5 s without restarting the app. Stops and starts only the test cluster.
 */
import { afterAll, beforeAll, expect, it } from "vitest";
import { makeBuild, makeUser, testDb } from "../../support/db";
import { APP_URL } from "../../support/env";
import { signIn, type Client } from "../../support/http";
import { startTestCluster, stopTestCluster, testClusterRunning } from "../../support/cluster";
import { launchBrowser, shot } from "../../support/browser";
import { DB_UNAVAILABLE_DIGEST } from "@/shared/unavailable";
import type { Browser } from "playwright-core";

const MESSAGE = "The database is not answering; try again in a moment.";
let me: Client;
let buildId = "";
let browser: Browser;

beforeAll(async () => {
  const owner = await makeUser("db-down");
  ({ buildId } = await makeBuild({ owner }));
  me = await signIn(owner.email);
  browser = await launchBrowser();
});
afterAll(async () => {
  if (!testClusterRunning()) startTestCluster(); // never leave the other tests without their database
  await browser?.close();
  await testDb.destroy();
});

type Answer = { status: number; ms: number; retryAfter: string | null; type: string; text: string };
async function get(path: string, init: RequestInit = {}): Promise<Answer> {
  const t0 = performance.now();
  const res = await fetch(`${APP_URL}${path}`, { redirect: "manual", ...init, headers: { cookie: me.cookie, ...(init.headers ?? {}) } });
  const text = await res.text();
  return { status: res.status, ms: performance.now() - t0, retryAfter: res.headers.get("retry-after"), type: res.headers.get("content-type") ?? "", text };
}
const api = () => get(`/api/builds/${buildId}`);
const page = () => get(`/builds/${buildId}`);
const signUp = () => get("/api/sign-up", {
  method: "POST",
  headers: { "content-type": "application/json" },
  body: JSON.stringify({ name: "Down Builder", email: `down-${Date.now()}@tests.linkwright.test`, password: "a long password" }),
});

async function signInError() {
  const csrf = await fetch(`${APP_URL}/api/auth/csrf`);
  const cookie = (csrf.headers.getSetCookie() ?? []).map((c) => c.split(";")[0]).join("; ");
  const { csrfToken } = await csrf.json();
  const res = await fetch(`${APP_URL}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie },
    body: new URLSearchParams({ csrfToken, email: "someone@tests.linkwright.test", password: "any password", json: "true" }),
  });
  return new URL((await res.json()).url).searchParams.get("error");
}

it("answers 503 with a retry message while the database is down, and serves again within 5 s of its start", async () => {
  expect((await api()).status).toBe(200);
  expect((await page()).status).toBe(200);

  stopTestCluster();
  let back = 0;
  try {
    const down: number[] = [];
    for (const [what, answer] of [["a build route", await api()], ["sign-up (no session)", await signUp()]] as const) {
      down.push(answer.ms);
      expect(answer.status, `${what}: ${answer.text}`).toBe(503);
      expect(JSON.parse(answer.text), what).toEqual({ error: { code: "unavailable", message: MESSAGE } });
      expect(answer.retryAfter, what).toMatch(/^[1-9]\d*$/);
      expect(answer.ms, `${what} answered in ${answer.ms.toFixed(0)} ms`).toBeLessThan(5_000);
    }
    // Signing in says so too (next-auth hands the page the reason in the error parameter).
    expect(await signInError(), "sign-in").toBe(MESSAGE);
    // A page cannot set its status from an error boundary: it stays 500. Its HTML is Next's error shell
    // carrying the error's digest, from which app/error.tsx shows the message once the page's script runs.
    const p = await page();
    expect(p.status).toBe(500);
    expect(p.type).toMatch(/text\/html/);
    expect(p.text).toMatch(new RegExp(String.raw`digest\\?":\\?"${DB_UNAVAILABLE_DIGEST}\\?"`)); // in the page's inline data, JSON-escaped
    expect(p.ms).toBeLessThan(5_000);
    console.log(`while down: the build route answered 503 in ${down[0].toFixed(0)} ms, sign-up in ${down[1].toFixed(0)} ms, the page 500 in ${p.ms.toFixed(0)} ms`);
    const tab = await browser.newPage();
    await tab.context().addCookies([{ name: me.cookie.split("=")[0], value: me.cookie.slice(me.cookie.indexOf("=") + 1), url: APP_URL }]);
    await tab.goto(`${APP_URL}/builds/${buildId}`);
    await tab.getByTestId("page-error").waitFor({ timeout: 15_000 });
    expect(await tab.getByTestId("page-error").getAttribute("data-reason")).toBe("unavailable");
    expect(await tab.getByTestId("page-error").getByRole("alert").textContent()).toBe(MESSAGE);
    await shot(tab, "db-down-page");
    await tab.close();
  } finally {
    startTestCluster();
    back = performance.now();
  }

  // The pool finds the database again by itself: each request is tried until it succeeds, within 5 s.
  const until = back + 5_000;
  let a = await api(), p = await page();
  while ((a.status !== 200 || p.status !== 200) && performance.now() < until) {
    await new Promise((r) => setTimeout(r, 200));
    [a, p] = [await api(), await page()];
  }
  const took = performance.now() - back;
  expect([a.status, p.status], `after ${took.toFixed(0)} ms: ${a.text.slice(0, 200)}`).toEqual([200, 200]);
  expect(p.text).not.toContain(MESSAGE);
  console.log(`serving again ${took.toFixed(0)} ms after the cluster accepted connections`);
}, 60_000);
