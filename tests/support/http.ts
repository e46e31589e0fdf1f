import { APP_URL } from "./env";
import { TEST_PASSWORD } from "./db";

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
