import "server-only";
import type { NextRequest } from "next/server";
import { fieldError, invalid } from "./errors";
import { logFilter } from "@/shared/schemas/log";

/** `?system=&from=&to=&q=` of the log routes; a bad value is a 400 naming it. */
export function readLogFilter(req: NextRequest) {
  const sp = req.nextUrl.searchParams;
  const raw: Record<string, string> = {};
  for (const k of ["system", "from", "to", "q"]) { const v = sp.get(k); if (v) raw[k] = v; }
  const r = logFilter.safeParse(raw);
  if (!r.success) throw invalid(r.error, "The filter is not valid.");
  return r.data;
}

/** The refusals of a log entry naming what is not this build's: files, a linkage or its revision. */
export const LOG_REF_ERRORS = {
  bad_files: fieldError("fileIds", "not files of this build", "Some attached files are not this build's uploads."),
  bad_linkage: fieldError("linkageId", "not a linkage of this build", "That linkage is not in this build."),
  bad_revision: fieldError("revision", "no such revision", "That linkage has no such revision."),
};
