import { NextResponse } from "next/server";
import type { z } from "zod";
import { DB_RETRY_AFTER_S, DB_UNAVAILABLE_MESSAGE } from "@/shared/unavailable";

/**
 * Every error code the API answers with, and its HTTP status: a closed list. Routes never write a code
 * or a status; they throw one of the helpers below (or `apiError` with a code from this list).
 */
export const ERROR_STATUS = {
  invalid_input: 400,
  invalid_json: 400,
  invalid_upload: 400,
  invalid_name: 400,
  unauthorized: 401,
  forbidden: 403,
  edit_window_closed: 403,
  not_found: 404,
  stale_revision: 409,
  not_current: 409,
  unacknowledged_hazards: 409,
  duplicate_part: 409,
  already_member: 409,
  last_owner: 409,
  last_admin: 409,
  export_not_ready: 409,
  export_not_failed: 409,
  invitation_closed: 410,
  request_timeout: 408,
  link_closed: 410,
  too_large: 413,
  unsupported_type: 415,
  unreadable_image: 415,
  csv_rows_invalid: 422,
  headers_too_large: 431,
  server_error: 500,
  unavailable: 503,
} as const;
export type ErrorCode = keyof typeof ERROR_STATUS;
/** `{ "path.to.field": "what is wrong with it" }` */
export type Fields = Record<string, string>;

/** The one error type of the API: its code fixes its status; it renders `{error: {code, message, fields?}}`. */
export class ApiError extends Error {
  readonly status: number;
  constructor(
    public code: ErrorCode,
    message: string,
    public fields?: Fields,
    public extra?: Record<string, unknown>,
  ) {
    super(message);
    this.status = ERROR_STATUS[code];
  }
  toResponse() {
    return NextResponse.json(
      { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}), ...(this.extra ?? {}) } },
      // A 503 says when to come back.
      { status: this.status, headers: this.code === "unavailable" ? { "retry-after": String(DB_RETRY_AFTER_S) } : undefined },
    );
  }
}

/** An error with a code from the list; `extra` adds keys beside code and message (e.g. the current revision on a 409). */
export const apiError = (code: ErrorCode, message: string, o: { fields?: Fields; extra?: Record<string, unknown> } = {}) =>
  new ApiError(code, message, o.fields, o.extra);

export const unauthorized = () => new ApiError("unauthorized", "Sign in to continue.");
export const notFound = (what = "build") => new ApiError("not_found", `No such ${what}, or you are not a member of it.`);
export const forbidden = (message: string) => new ApiError("forbidden", message);
export const serverError = () => new ApiError("server_error", "Something went wrong on the server. Nothing was changed.");
/** The database is not answering (db/unavailable.ts): 503 with Retry-After. */
export const unavailable = () => new ApiError("unavailable", DB_UNAVAILABLE_MESSAGE);

/** 400 naming one field: `fieldError("subject.id", "No joint \"j9\" in revision 3")`. */
export const fieldError = (path: string, message: string, summary = "Some fields need attention.") =>
  new ApiError("invalid_input", summary, { [path]: message });

/** The domain's refusals, one helper per code; the message (with its numbers) is the caller's. */
export const staleRevision = (message: string, current: unknown) => apiError("stale_revision", message, { extra: { current } });
export const notCurrent = (message: string, currentRevision: number) => apiError("not_current", message, { extra: { currentRevision } });
export const unacknowledgedHazards = (message: string, hazards: unknown[]) => apiError("unacknowledged_hazards", message, { extra: { hazards } });
export const editWindowClosed = (message: string) => apiError("edit_window_closed", message);
export const duplicatePart = (message: string, fields?: Fields) => apiError("duplicate_part", message, { fields });
export const csvRowsInvalid = (message: string, report: unknown) => apiError("csv_rows_invalid", message, { extra: { report } });
export const alreadyMember = (message: string, fields?: Fields) => apiError("already_member", message, { fields });
export const lastOwner = (message: string) => apiError("last_owner", message);
export const lastAdmin = (message: string) => apiError("last_admin", message);
export const invitationClosed = (message: string) => apiError("invitation_closed", message);
/** A single-use link (sign-up confirmation) that was used or has expired. */
export const linkClosed = (message: string) => apiError("link_closed", message);
export const exportNotReady = (message: string) => apiError("export_not_ready", message);
export const exportNotFailed = (message: string) => apiError("export_not_failed", message);

/** zod issues → `{ "path.to.field": "message" }`. */
export function fieldsOf(error: z.ZodError): Fields {
  const fields: Fields = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    if (!fields[key]) fields[key] = issue.message;
  }
  return fields;
}

export function invalid(error: z.ZodError, message = "Some fields need attention.") {
  return new ApiError("invalid_input", message, fieldsOf(error));
}
