/**
 * The database not answering (stopped, restarting, unreachable): not a fault of the request, so the API
 * answers 503 `unavailable` with Retry-After and pages show this message (app/error.tsx). The digest is
 * how a page's error boundary, which sees no server message in production, tells this case apart: the
 * db layer stamps it on the errors it raises for a lost connection (db/unavailable.ts).
 */
export const DB_UNAVAILABLE_MESSAGE = "The database is not answering; try again in a moment.";
export const DB_UNAVAILABLE_DIGEST = "LW_DB_UNAVAILABLE";
/** Seconds a client is asked to wait before trying again (Retry-After). */
export const DB_RETRY_AFTER_S = 5;
