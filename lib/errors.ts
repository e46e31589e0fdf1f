import { NextResponse } from "next/server";
import type { z } from "zod";

/** The one error type of the API: it knows its status and renders `{error: {code, message, fields?}}`. */
export class ApiError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public fields?: Record<string, string>,
    public extra?: Record<string, unknown>,
  ) {
    super(message);
  }
  toResponse() {
    return NextResponse.json(
      { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}), ...(this.extra ?? {}) } },
      { status: this.status },
    );
  }
}

export const unauthorized = () => new ApiError(401, "unauthorized", "Sign in to continue.");
export const notFound = (what = "build") => new ApiError(404, "not_found", `No such ${what}, or you are not a member of it.`);
export const forbidden = (message: string) => new ApiError(403, "forbidden", message);

/** zod issues → `{ "path.to.field": "message" }`. */
export function fieldsOf(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    if (!fields[key]) fields[key] = issue.message;
  }
  return fields;
}

export function invalid(error: z.ZodError, message = "Some fields need attention.") {
  return new ApiError(400, "invalid_input", message, fieldsOf(error));
}
