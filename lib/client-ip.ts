/**
 * Whose address a request is, for the per-IP sign-in limit. Next passes on whatever X-Forwarded-For a
 * client sends (it only fills the header in when there is none), so the header alone proves nothing.
 * `instrumentation.ts` writes the address of the connection itself into PEER_HEADER on every request,
 * overwriting anything a client sent under that name (lib/peer-address.ts).
 *
 * LW_TRUSTED_PROXY_HOPS is how many proxies of our own stand in front of the app, each appending the
 * address it was reached from to X-Forwarded-For:
 *  - 0 (the default): no proxy; the client is the connection's address and X-Forwarded-For is ignored.
 *  - N > 0: the client is the Nth address from the right of X-Forwarded-For (what the outermost trusted
 *    proxy saw); anything further left was written by the client and is not believed. With fewer than N
 *    addresses, the left-most one; with none (a request that did not pass the proxy), the connection's.
 */
export const PEER_HEADER = "x-linkwright-peer";
export const MAX_TRUSTED_PROXY_HOPS = 10;

/** LW_TRUSTED_PROXY_HOPS as a whole number 0–10; anything else is a configuration mistake. */
export function trustedProxyHops(raw = process.env.LW_TRUSTED_PROXY_HOPS): number {
  if (raw === undefined || raw.trim() === "") return 0;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0 || n > MAX_TRUSTED_PROXY_HOPS) {
    throw new Error(`LW_TRUSTED_PROXY_HOPS must be a whole number from 0 to ${MAX_TRUSTED_PROXY_HOPS} (the proxies in front of the app), not "${raw}"`);
  }
  return n;
}

/** An IPv4 address reached over an IPv6 socket reads as ::ffff:a.b.c.d; count it as a.b.c.d. */
const plain = (ip: string) => ip.trim().replace(/^::ffff:(\d{1,3}(?:\.\d{1,3}){3})$/i, "$1");

function header(headers: Record<string, unknown> | undefined, name: string): string {
  const v = headers?.[name];
  return typeof v === "string" ? v : Array.isArray(v) ? v.join(",") : "";
}

/** The client's address by the rules above; "unknown" if the connection's address was not recorded. */
export function clientIp(headers: Record<string, unknown> | undefined, hops: number): string {
  const peer = plain(header(headers, PEER_HEADER)) || "unknown";
  if (hops === 0) return peer;
  const chain = header(headers, "x-forwarded-for").split(",").map(plain).filter(Boolean);
  if (chain.length === 0) return peer;
  return chain[Math.max(0, chain.length - hops)];
}
