/**
 * The app process is up and answering: no session, no database, nothing read. A load balancer's liveness
 * check, and the bare route `npm run bench:load` measures the others against (the cost of Next's routing
 * and a JSON answer alone). Whether the database answers is what every other route says (503, README).
 */
export const dynamic = "force-dynamic";

export function GET() {
  return Response.json({ ok: true }, { headers: { "Cache-Control": "no-store" } });
}
