import "server-only";
import type { NextRequest } from "next/server";
import { invalid } from "./errors";
import { logFilter } from "@/shared/records-api";

/** `?system=&from=&to=&q=` of the log routes; a bad value is a 400 naming it. */
export function readLogFilter(req: NextRequest) {
  const sp = req.nextUrl.searchParams;
  const raw: Record<string, string> = {};
  for (const k of ["system", "from", "to", "q"]) { const v = sp.get(k); if (v) raw[k] = v; }
  const r = logFilter.safeParse(raw);
  if (!r.success) throw invalid(r.error, "The filter is not valid.");
  return r.data;
}
