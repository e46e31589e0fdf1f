import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { hkdfSync } from "node:crypto";
import { jwtDecrypt } from "jose";
import { getToken } from "next-auth/jwt";
import { cookies } from "next/headers";
import { cache } from "react";
import { z } from "zod";
import { beginAttempt, clearFailures, endSessions, findUserByEmail, findUserById, toPublicUser } from "@/db/users";
import { getAccess } from "@/db/access";
import { checkPassword, checkAgainstNothing } from "./passwords";
import { clientIp, trustedProxyHops } from "./client-ip";
import { isDatabaseUnavailable } from "@/db/unavailable";
import { claimsCache, CLOCK_TOLERANCE_S } from "./session-cache";
import { DB_UNAVAILABLE_MESSAGE } from "@/shared/unavailable";

const credentials = z.object({ email: z.string().trim().email().max(254), password: z.string().min(1).max(200) });

/** How many proxies of our own stand in front (README, "Behind a proxy"); read at start, a bad value stops the app. */
const PROXY_HOPS = trustedProxyHops();

/** Checks an e-mail and password, counting the attempt against the e-mail and the client's address first. */
async function authorize(raw: unknown, req: { headers?: unknown } | undefined) {
  const parsed = credentials.safeParse(raw);
  if (!parsed.success) return null;
  const { email, password } = parsed.data;
  const ip = clientIp(req?.headers as Record<string, unknown> | undefined, PROXY_HOPS);
  const attempt = await beginAttempt(email, ip);
  // The builder deserves to know why; the answer is the same whether or not the address has an account.
  if ("refused" in attempt) {
    throw new Error(attempt.refused === "ip"
      ? "Too many failed sign-ins from this address. Wait 15 minutes and try again."
      : `Too many failed sign-ins for this e-mail. Wait ${attempt.waitS} seconds and try again.`);
  }
  const user = await findUserByEmail(email);
  // An unknown address costs a password check too, so the time taken does not tell whether it has an account.
  const ok = user ? await checkPassword(password, user.password_hash) : await checkAgainstNothing(password);
  if (!user || !ok) return null; // the attempt stays counted as a failure
  await clearFailures(email);
  return { id: user.id, email: user.email, name: user.name, sv: user.session_version };
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 60 * 60 * 24 * 14 },
  pages: { signIn: "/sign-in" },
  secret: process.env.NEXTAUTH_SECRET,
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      // The sign-in page shows a thrown error's message: a lost database is said in words, not as a socket error.
      authorize: (raw, req) => authorize(raw, req).catch((e: unknown) => {
        throw isDatabaseUnavailable(e) ? new Error(DB_UNAVAILABLE_MESSAGE) : e;
      }),
    }),
  ],
  callbacks: {
    /** The cookie carries the user's session version from sign-in (see getSessionUser). */
    async jwt({ token, user }) {
      if (user) token.sv = (user as { sv?: number }).sv ?? 0;
      return token;
    },
    /**
     * A cookie whose session has ended (signed out, password changed, account gone) is no session here either:
     * next-auth's session endpoint would otherwise answer it with the account's name and e-mail and hand back a
     * renewed cookie. Throwing makes next-auth answer `{}` and clear the cookie. If the database cannot be asked,
     * this passes and getSessionUser (which reads the account on every request) answers 503.
     */
    async session({ session, token }) {
      const sv = typeof token.sv === "number" ? token.sv : 0;
      if (token.sub) {
        const row = await findUserById(token.sub).catch((e: unknown) => {
          if (isDatabaseUnavailable(e)) return "unknown" as const;
          throw e;
        });
        if (row !== "unknown" && (!row || row.session_version !== sv)) throw new Error("This session has ended.");
      }
      if (session.user && token.sub) Object.assign(session.user, { id: token.sub, sv });
      return session;
    },
  },
  events: {
    /** Signing out ends the session on the server too: a copy of the cookie is refused from now on. */
    async signOut({ token }) {
      if (token?.sub) await endSessions(token.sub);
    },
  },
};

/**
 * The key next-auth seals its session cookie with: HKDF-SHA-256 of the secret, no salt, with next-auth's own
 * label (next-auth/jwt `getDerivedEncryptionKey`). next-auth's `decode` derives it again on every call, which
 * cost more than the decryption itself; it depends on the secret alone (the same in every instance), so it is
 * derived once per secret here.
 */
let derived: { secret: string; key: Uint8Array } | undefined;
function sessionKey(secret: string) {
  if (derived?.secret !== secret) derived = { secret, key: new Uint8Array(hkdfSync("sha256", secret, "", "NextAuth.js Generated Encryption Key", 32)) };
  return derived.key;
}

/** next-auth's `decode` with the key derived once: decrypts the cookie and checks its expiry (15 s of clock tolerance, as next-auth does). */
async function decodeSession({ token, secret }: { token?: string; secret: string | Buffer }) {
  if (!token) return null;
  const key = sessionKey(String(secret));
  if (decoded.key !== key) decoded = { key, cache: claimsCache() }; // another secret: nothing opened with the old one counts
  const hit = decoded.cache.get(token);
  if (hit) return hit;
  const { payload } = await jwtDecrypt(token, key, { clockTolerance: CLOCK_TOLERANCE_S });
  decoded.cache.set(token, Object.freeze(payload));
  return payload;
}
/** Cookies this process has opened with the current key (lib/session-cache.ts): a signed-in person's every request after the first skips the decryption. */
let decoded: { key: Uint8Array | null; cache: ReturnType<typeof claimsCache> } = { key: null, cache: claimsCache() };

/**
 * The session cookie's claims: the user's id and the session version the cookie was issued with. Decoded once
 * per request (React's `cache`: a page's layout and body share it) with next-auth's own `getToken` (the cookie's
 * name and chunks) and decodeSession (decryption and expiry). next-auth's `getServerSession` would run its whole session action
 * on each call instead — a CSRF token, the jwt and session callbacks and a newly encrypted cookie that a route
 * or server component never sends. Only the cookie counts: the header is not passed, so a token sent as
 * `Authorization: Bearer` signs nobody in.
 */
const sessionClaims = cache(async (): Promise<{ id: string; sv: number } | null> => {
  const token = await getToken({
    req: { cookies: await cookies(), headers: {} } as unknown as Parameters<typeof getToken>[0]["req"],
    secret: authOptions.secret ?? process.env.AUTH_SECRET,
    decode: decodeSession,
  });
  if (typeof token?.sub !== "string") return null;
  return { id: token.sub, sv: typeof token.sv === "number" ? token.sv : 0 };
});

/**
 * The signed-in user, read fresh from the database on every request, with the build, linkage and revision the
 * request names (db/access.ts: one query for all of them). Null when signed out, for a deleted user, and for a cookie
 * from before the user signed out or changed the password (a copy of it): its session version is older.
 * Nothing is kept between requests, so a session ended on one instance is refused by every instance at once.
 */
export const getSessionAccess = cache(async (buildId?: string, linkageId?: string, revision?: number | "current") => {
  const claims = await sessionClaims();
  if (!claims) return null;
  const access = await getAccess(claims.id, buildId, linkageId, revision);
  if (!access || access.user.session_version !== claims.sv) return null;
  return { ...access, user: toPublicUser(access.user) };
});

/** The signed-in user (see getSessionAccess), or null. */
export const getSessionUser = cache(async () => (await getSessionAccess())?.user ?? null);
export type SessionUser = NonNullable<Awaited<ReturnType<typeof getSessionUser>>>;
