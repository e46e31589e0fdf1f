import "server-only";
import type { Knex } from "knex";
import { db } from "./index";

export function audit(
  e: { buildId: string | null; userId: string | null; action: string; detail?: Record<string, unknown> },
  trx: Knex = db,
) {
  return trx("audit_events").insert({
    build_id: e.buildId,
    user_id: e.userId,
    action: e.action,
    detail: JSON.stringify(e.detail ?? {}),
  });
}
