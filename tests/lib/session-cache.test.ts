import { describe, expect, it } from "vitest";
import { claimsCache, CLOCK_TOLERANCE_S } from "@/lib/session-cache";

describe("the cache of opened session cookies", () => {
  const now = Date.UTC(2026, 11, 5, 12);
  const exp = now / 1000 + 3600;
  it("gives back the claims of the same cookie text, and nothing for any other text", () => {
    const c = claimsCache();
    c.set("cookie-a", { sub: "u1", sv: 2, exp });
    expect(c.get("cookie-a", now)).toEqual({ sub: "u1", sv: 2, exp });
    expect(c.get("cookie-a ", now)).toBeUndefined();
    expect(c.get("cookie-b", now)).toBeUndefined();
  });
  it("checks the expiry on every hit, with the decoder's tolerance, and forgets an expired cookie", () => {
    const c = claimsCache();
    c.set("t", { sub: "u1", exp });
    expect(c.get("t", exp * 1000 + (CLOCK_TOLERANCE_S - 1) * 1000)).toBeDefined();
    expect(c.get("t", exp * 1000 + CLOCK_TOLERANCE_S * 1000)).toBeUndefined();
    expect(c.size).toBe(0);
    expect(c.get("t", now)).toBeUndefined(); // gone, not merely hidden: the next use decrypts again
  });
  it("never keeps a cookie without an expiry", () => {
    const c = claimsCache();
    c.set("t", { sub: "u1" });
    expect(c.get("t", now)).toBeUndefined();
  });
  it("stays within its bound: the least recently used cookie goes first", () => {
    const c = claimsCache(3);
    for (const t of ["a", "b", "c"]) c.set(t, { sub: t, exp });
    expect(c.get("a", now)).toBeDefined(); // a is now the most recent
    c.set("d", { sub: "d", exp });
    expect(c.size).toBe(3);
    expect(c.get("b", now)).toBeUndefined();
    expect(["a", "c", "d"].every((t) => c.get(t, now))).toBe(true);
  });
});
