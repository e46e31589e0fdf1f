import { DB_UNAVAILABLE_DIGEST } from "@/shared/unavailable";

/**
 * PostgreSQL's "cannot serve" states (SQLSTATE): 57P01 admin_shutdown, 57P02 crash_shutdown, 57P03
 * cannot_connect_now (starting up or shutting down), class 08 connection exceptions.
 */
const SQLSTATE = /^(57P0[123]|08\d{3})$/;
/** What the socket says when the server is not there (only counted for errors raised by the database's pool). */
const SOCKET = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EHOSTUNREACH", "ENETUNREACH", "ENOTFOUND", "EAI_AGAIN", "EPIPE"]);
/** node-postgres and Knex name a lost connection or a pool that cannot get one in words, without a code. */
const WORDS = /Connection terminated|Connection ended unexpectedly|Timeout acquiring a connection|Client has encountered a connection error/i;

type Err = { code?: unknown; name?: unknown; message?: unknown; digest?: unknown; errors?: unknown; cause?: unknown };

/** A connection failure of PostgreSQL or of the pool in front of it. */
function isConnectionFailure(e: unknown, depth = 0): boolean {
  if (!e || typeof e !== "object" || depth > 4) return false;
  const x = e as Err;
  if (typeof x.code === "string" && (SQLSTATE.test(x.code) || SOCKET.has(x.code))) return true;
  if (x.name === "KnexTimeoutError") return true;
  if (typeof x.message === "string" && WORDS.test(x.message)) return true;
  // A host name with two addresses (::1 and 127.0.0.1) fails with both in an AggregateError.
  if (Array.isArray(x.errors) && x.errors.some((y) => isConnectionFailure(y, depth + 1))) return true;
  return isConnectionFailure(x.cause, depth + 1);
}

/**
 * True for an error that means the database is not answering: one the db layer stamped (below), or one
 * that carries PostgreSQL's own shutdown or connection SQLSTATE. A refused socket elsewhere (storage,
 * mail) is not counted: only the database's pool stamps socket errors.
 */
export function isDatabaseUnavailable(e: unknown): boolean {
  if (!e || typeof e !== "object") return false;
  const x = e as Err;
  if (x.digest === DB_UNAVAILABLE_DIGEST) return true;
  return (typeof x.code === "string" && SQLSTATE.test(x.code)) || x.name === "KnexTimeoutError";
}

/** Stamps an error from the database's pool or a query when it is a connection failure; returns it. */
export function stampUnavailable<E>(e: E): E {
  if (isConnectionFailure(e)) {
    try {
      (e as Err).digest = DB_UNAVAILABLE_DIGEST;
    } catch {} // a frozen error keeps its own digest; the SQLSTATE test still finds most of them
  }
  return e;
}
