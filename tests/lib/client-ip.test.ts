import { describe, expect, it } from "vitest";
import { clientIp, PEER_HEADER, trustedProxyHops } from "@/lib/client-ip";

const h = (xff: string | undefined, peer = "127.0.0.1") => ({ [PEER_HEADER]: peer, ...(xff === undefined ? {} : { "x-forwarded-for": xff }) });

describe("the client's address for the sign-in limit", () => {
  it("without a trusted proxy is the connection's, whatever X-Forwarded-For says", () => {
    expect(clientIp(h("203.0.113.9"), 0)).toBe("127.0.0.1");
    expect(clientIp(h("203.0.113.9, 198.51.100.1"), 0)).toBe("127.0.0.1");
    expect(clientIp(h(undefined, "::ffff:192.0.2.4"), 0)).toBe("192.0.2.4");
    expect(clientIp(h(undefined, "2001:db8::1"), 0)).toBe("2001:db8::1");
    expect(clientIp({ "x-forwarded-for": "203.0.113.9" }, 0)).toBe("unknown"); // never the header instead
  });

  it("behind N trusted proxies is the Nth address from the right of X-Forwarded-For", () => {
    expect(clientIp(h("10.0.0.1, 203.0.113.9"), 1)).toBe("203.0.113.9");
    expect(clientIp(h("10.0.0.1,203.0.113.9 , 198.51.100.7"), 2)).toBe("203.0.113.9");
    expect(clientIp(h("spoofed, 203.0.113.9, 198.51.100.7"), 2)).toBe("203.0.113.9");
    expect(clientIp(h("203.0.113.9"), 3)).toBe("203.0.113.9"); // fewer than N: the left-most a proxy wrote
    expect(clientIp(h(undefined), 1)).toBe("127.0.0.1"); // did not come through the proxy
    expect(clientIp(h(" , "), 1)).toBe("127.0.0.1");
  });

  it("reads LW_TRUSTED_PROXY_HOPS as 0–10 and refuses anything else", () => {
    expect(trustedProxyHops(undefined)).toBe(0);
    expect(trustedProxyHops("")).toBe(0);
    expect(trustedProxyHops("2")).toBe(2);
    for (const bad of ["-1", "1.5", "eleven", "11"]) expect(() => trustedProxyHops(bad), bad).toThrow(/LW_TRUSTED_PROXY_HOPS/);
  });
});
