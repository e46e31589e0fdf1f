/**
 * How every Linkwright server process is started (npm start, the tests' servers, the benches): `next start`
 * under Node with a larger young generation. The engine's report of a large run (13 MB for 10,000 parts) is
 * short-lived but outgrows V8's default 16 MB semi-space, so with the default each analysis of one copies and
 * promotes most of it and full collections follow: the 10,000-part chain took 1.76 × JSON.parse of its file
 * with the default and 0.73 × with 32 MB (npm run bench, 2026-12-04). The young generation of each process may
 * then grow to a few tens of MB more than by default, as it is used.
 */
export const SERVER_NODE_FLAGS = ["--max-semi-space-size=32"];

/** The arguments to `node` for `next start` on `host`:`port` (extra Node flags first, e.g. a CPU profile). */
export function nextStartArgs(host, port, extraNodeFlags = []) {
  return [...SERVER_NODE_FLAGS, ...extraNodeFlags, "node_modules/next/dist/bin/next", "start", "-H", host, "-p", String(port)];
}
