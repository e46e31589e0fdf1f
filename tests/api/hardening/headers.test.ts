/**
 * Security headers on every kind of answer: a page, an API route (signed in and refused) and a static
 * asset. The Content-Security-Policy is checked directive by directive; tests/e2e/csp.test.ts shows the
 * editor, its picture export and the motion charts work under it in a real browser.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeUser, testDb } from "../../support/db";
import { APP_URL } from "../../support/env";
import { signIn, type Client } from "../../support/http";

let me: Client;
let staticUrl = "";
beforeAll(async () => {
  me = await signIn((await makeUser("headers")).email);
  // A script chunk the sign-in page loads: served from /_next/static, not by a route of ours.
  const html = await (await fetch(`${APP_URL}/sign-in`)).text();
  const src = html.match(/src="(\/_next\/static\/[^"]+\.js)"/)?.[1];
  if (!src) throw new Error("the sign-in page names no /_next/static script");
  staticUrl = `${APP_URL}${src}`;
});
afterAll(() => testDb.destroy());

/** Each directive of a policy: name → its sources, in order. */
function directives(policy: string) {
  const out: Record<string, string[]> = {};
  for (const part of policy.split(";").map((s) => s.trim()).filter(Boolean)) {
    const [name, ...values] = part.split(/\s+/);
    expect(out[name], `directive ${name} given twice`).toBeUndefined();
    out[name] = values;
  }
  return out;
}

const EXPECTED_CSP: Record<string, string[]> = {
  "default-src": ["'self'"],
  // Next inlines the page's data as <script> tags: 'unsafe-inline', but no 'unsafe-eval' and no other origin.
  "script-src": ["'self'", "'unsafe-inline'"],
  // React Flow positions parts with inline styles.
  "style-src": ["'self'", "'unsafe-inline'"],
  // The picture export draws the canvas through an SVG data: image and hands out a blob:.
  "img-src": ["'self'", "data:", "blob:"],
  "font-src": ["'self'", "data:"],
  "connect-src": ["'self'"],
  "object-src": ["'none'"],
  "base-uri": ["'self'"],
  "form-action": ["'self'"],
  "frame-ancestors": ["'none'"],
};

function checkHeaders(res: Response, what: string) {
  const h = res.headers;
  const csp = h.get("content-security-policy");
  expect(csp, `${what}: Content-Security-Policy`).toBeTruthy();
  expect(directives(csp!), what).toEqual(EXPECTED_CSP);
  expect(h.get("x-content-type-options"), what).toBe("nosniff");
  expect(h.get("referrer-policy"), what).toBe("strict-origin-when-cross-origin");
  expect(h.get("x-frame-options"), what).toBe("DENY");
  expect(h.get("cross-origin-opener-policy"), what).toBe("same-origin");
  const perms = Object.fromEntries((h.get("permissions-policy") ?? "").split(",").map((s) => s.trim().split("=")));
  // Builders photograph their joints with the phone's camera from the page; nothing else is asked for.
  expect(perms, what).toEqual({ camera: "(self)", microphone: "()", geolocation: "()", payment: "()", usb: "()" });
  // Served over plain http here: no Strict-Transport-Security (README: set it at the TLS proxy).
  expect(h.get("strict-transport-security"), what).toBeNull();
  expect(h.get("x-powered-by"), what).toBeNull();
}

describe("security headers", () => {
  it("are on a page", async () => {
    const res = await fetch(`${APP_URL}/sign-in`);
    expect(res.status).toBe(200);
    checkHeaders(res, "the sign-in page");
  });

  it("are on a signed-in page", async () => {
    const res = await fetch(`${APP_URL}/builds`, { headers: { cookie: me.cookie }, redirect: "manual" });
    expect(res.status).toBe(200);
    checkHeaders(res, "the builds page");
  });

  it("are on an API route, answered or refused", async () => {
    const ok = await fetch(`${APP_URL}/api/me`, { headers: { cookie: me.cookie } });
    expect(ok.status).toBe(200);
    checkHeaders(ok, "GET /api/me");
    const refused = await fetch(`${APP_URL}/api/me`);
    expect(refused.status).toBe(401);
    checkHeaders(refused, "GET /api/me signed out");
    const csrf = await fetch(`${APP_URL}/api/auth/csrf`);
    expect(csrf.status).toBe(200);
    checkHeaders(csrf, "next-auth's csrf route");
  });

  it("are on a static asset and the icon", async () => {
    const res = await fetch(staticUrl);
    expect(res.status).toBe(200);
    checkHeaders(res, staticUrl);
    const icon = await fetch(`${APP_URL}/icon.svg`);
    expect(icon.status).toBe(200);
    checkHeaders(icon, "/icon.svg");
  });

  it("include Strict-Transport-Security only when a proxy says the request came over https", async () => {
    const res = await fetch(`${APP_URL}/sign-in`, { headers: { "x-forwarded-proto": "https" } });
    expect(res.headers.get("strict-transport-security")).toBe("max-age=31536000; includeSubDomains");
    expect((await fetch(`${APP_URL}/sign-in`, { headers: { "x-forwarded-proto": "http" } })).headers.get("strict-transport-security")).toBeNull();
  });

  it("are on a page that does not exist", async () => {
    const res = await fetch(`${APP_URL}/no-such-page-here`);
    expect(res.status).toBe(404);
    checkHeaders(res, "a 404 page");
  });
});
