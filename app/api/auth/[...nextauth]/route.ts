import NextAuth from "next-auth";
import { NextRequest } from "next/server";
import { authOptions } from "@/lib/auth";
import { withErrors } from "@/lib/http";
import { readSmallBody } from "@/lib/body";

const handler = NextAuth(authOptions);
type P = { nextauth: string[] };

/** The sign-in and sign-out forms are a few hundred bytes; this leaves room and no more. */
const AUTH_MAX_BODY_BYTES = 16 * 1024; // common practice, no source

export const GET = (req: NextRequest, ctx: { params: Promise<P> }) => handler(req, ctx);

/**
 * next-auth reads the body whole (`req.text()` / `req.json()`): it is read here first (capped while it
 * streams in, JSON checked as on every route, the query by withErrors), and next-auth gets a copy.
 */
export const POST = withErrors<P>(async ({ req, params }) => {
  const bytes = await readSmallBody(req, AUTH_MAX_BODY_BYTES);
  const copy = new NextRequest(req.url, { method: req.method, headers: req.headers, body: bytes.length ? new Uint8Array(bytes) : undefined });
  return handler(copy, { params: Promise.resolve(params) });
});
