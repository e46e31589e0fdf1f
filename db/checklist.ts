import "server-only";
import { db } from "./index";
import { audit } from "./audit";

import { personName } from "./people";
import type { Tick } from "@/shared/schemas/checklist";
export type { Tick };

export async function listTicks(linkageId: string, revision: number): Promise<Tick[]> {
  const rows = await db("checklist_items as c").leftJoin("users as u", "u.id", "c.ticked_by").where({ "c.linkage_id": linkageId, "c.revision": revision })
    .select("c.joint_id", "c.item_code", "c.ticked_at", "c.note", "u.name");
  return rows.map((r: { joint_id: string; item_code: string; ticked_at: Date | null; note: string; name: string | null }) => ({
    jointId: r.joint_id, code: r.item_code, tickedBy: r.ticked_at ? personName(r.name) : null, tickedAt: r.ticked_at ? r.ticked_at.toISOString() : null, note: r.note,
  }));
}

/** Ticks or unticks one item (with its note) and records it in the audit log, in one transaction. */
export async function setTick(buildId: string, linkageId: string, revision: number, jointId: string, code: string, ticked: boolean, note: string | undefined, userId: string) {
  const values = {
    ticked_by: ticked ? userId : null,
    ticked_at: ticked ? db.fn.now() : null,
    ...(note !== undefined ? { note } : {}),
    updated_at: db.fn.now(),
  };
  await db.transaction(async (trx) => {
    await trx("checklist_items")
      .insert({ linkage_id: linkageId, revision, joint_id: jointId, item_code: code, note: note ?? "", ...values })
      .onConflict(["linkage_id", "revision", "joint_id", "item_code"])
      .merge(values);
    await audit({ buildId, userId, action: "checklist.tick", detail: { linkageId, revision, jointId, code, ticked } }, trx);
  });
}
