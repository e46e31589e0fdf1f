/**
 * Claims of session cookies already decrypted in this process, keyed by the whole cookie. The cookie is
 * authenticated encryption: the same text always opens to the same claims, and any other text (a changed byte,
 * another user's cookie) is a miss that is decrypted and checked in full. A hit checks the expiry again, with the
 * same 15 s of tolerance as the first decode. The claims say who the cookie names; whether that session still
 * stands (signed out, password changed) is read from the database on every request, as before — nothing about
 * a session's standing is kept here, so instances cannot disagree.
 * Bounded: the oldest entry goes when the cache is full (a Map keeps insertion order; a hit moves its entry last).
 */
export type Claims = Record<string, unknown> & { exp?: number };

export const CLOCK_TOLERANCE_S = 15;

export function claimsCache(max = 5000) {
  const map = new Map<string, Claims>();
  return {
    get(token: string, nowMs = Date.now()): Claims | undefined {
      const c = map.get(token);
      if (!c) return undefined;
      if (typeof c.exp !== "number" || c.exp * 1000 + CLOCK_TOLERANCE_S * 1000 <= nowMs) {
        map.delete(token);
        return undefined;
      }
      map.delete(token);
      map.set(token, c);
      return c;
    },
    set(token: string, claims: Claims) {
      if (typeof claims.exp !== "number") return; // a cookie without an expiry is never kept
      if (map.size >= max) map.delete(map.keys().next().value!);
      map.set(token, claims);
    },
    get size() {
      return map.size;
    },
  };
}
