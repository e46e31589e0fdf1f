/** What the benches share: signing in to a bench's own server through next-auth's credentials provider. */

/** The session cookie (`name=value`) of `email` signed in on the server at `app`. */
export async function signInAt(app: string, email: string, password: string) {
  const csrf = await fetch(`${app}/api/auth/csrf`);
  const cookie = (csrf.headers.getSetCookie() ?? []).map((c) => c.split(";")[0]).join("; ");
  const { csrfToken } = await csrf.json();
  const res = await fetch(`${app}/api/auth/callback/credentials`, { method: "POST", redirect: "manual", headers: { "content-type": "application/x-www-form-urlencoded", cookie }, body: new URLSearchParams({ csrfToken, email, password, json: "true" }) });
  const session = (res.headers.getSetCookie() ?? []).map((c) => c.split(";")[0]).find((c) => c.startsWith("next-auth.session-token="));
  if (!session) throw new Error(`sign-in failed: ${res.status}`);
  return session;
}
