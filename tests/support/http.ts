import { APP_URL } from "./env";
import { TEST_PASSWORD } from "./db";
import { mailTo } from "./review";

export type Client = {
  cookie: string;
  request(method: string, path: string, body?: unknown, raw?: string): Promise<{ status: number; body: any }>;
};

/** Signs in through next-auth's credentials provider, the way the sign-in page does (on another app instance with `base`). */
export async function signIn(email: string, password = TEST_PASSWORD, base = APP_URL): Promise<Client> {
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  const csrfCookie = (csrfRes.headers.getSetCookie() ?? []).map((c) => c.split(";")[0]).join("; ");
  const { csrfToken } = await csrfRes.json();
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookie },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  const session = (res.headers.getSetCookie() ?? []).map((c) => c.split(";")[0]).find((c) => c.startsWith("next-auth.session-token="));
  if (!session) throw new Error(`sign-in failed for ${email}: HTTP ${res.status}`);
  return client(session, base);
}

export function client(cookie = "", base = APP_URL): Client {
  return {
    cookie,
    async request(method, path, body, raw) {
      const res = await fetch(`${base}${path}`, {
        method,
        redirect: "manual",
        headers: { ...(cookie ? { cookie } : {}), ...(body !== undefined || raw !== undefined ? { "content-type": "application/json" } : {}) },
        body: raw ?? (body === undefined ? undefined : JSON.stringify(body)),
      });
      const text = await res.text();
      let parsed: unknown = text;
      try { parsed = JSON.parse(text); } catch {}
      return { status: res.status, body: parsed };
    },
  };
}

export const anonymous = () => client("");

/** The token of the newest sign-up confirmation link mailed to the address (after `seen` such mails). */
export async function confirmToken(email: string, seen = 0): Promise<string> {
  const links = (await mailTo(email, { min: seen + 1, ms: 10_000 }))
    .map((m) => m.text?.match(/\/sign-up\/confirm\/([A-Za-z0-9_-]+)/)?.[1])
    .filter((t): t is string => !!t);
  if (links.length <= seen) throw new Error(`no sign-up confirmation mail to ${email}`);
  return links[links.length - 1];
}

/**
 * Signs up as the sign-up page does, then follows the link mailed to the address as its page does
 * (the confirmation route with the link's token): the account exists afterwards.
 */
export async function signUp(u: { name: string; email: string; password?: string; next?: string }, base = APP_URL) {
  const before = (await mailTo(u.email, { min: 0, ms: 0 })).filter((m) => m.text?.includes("/sign-up/confirm/")).length;
  const r = await client("", base).request("POST", "/api/sign-up", { name: u.name, email: u.email, password: u.password ?? TEST_PASSWORD, ...(u.next ? { next: u.next } : {}) });
  if (r.status !== 202) throw new Error(`sign-up of ${u.email} answered ${r.status}: ${JSON.stringify(r.body)}`);
  const token = await confirmToken(u.email, before);
  const c = await client("", base).request("POST", "/api/sign-up/confirm", { token });
  if (c.status !== 200) throw new Error(`confirming ${u.email} answered ${c.status}: ${JSON.stringify(c.body)}`);
  return c.body as { email: string; next: string };
}
