import "server-only";
/** Acknowledgements of findings, with the reason and the fingerprint of the subject when acknowledged. */
import { db } from "./index";
import { audit } from "./audit";
import { person } from "./people";
import type { Subject } from "@/shared/schemas/common";
import type { Acknowledgement } from "@/shared/schemas/acknowledgements";

type AckRow = {
  id: string;
  linkage_id: string;
  code: string;
  subject_type: Subject["type"];
  subject_id: string;
  reason: string;
  user_id: string | null;
  user_name: string | null;
  revision: number;
  fingerprint: string;
  created_at: Date;
};
const toAck = (r: AckRow): Acknowledgement => ({
  id: r.id,
  code: r.code,
  subject: { type: r.subject_type, id: r.subject_id },
  reason: r.reason,
  by: person(r.user_id, r.user_name),
  revision: r.revision,
  fingerprint: r.fingerprint,
  createdAt: r.created_at.toISOString(),
});

export async function listAcknowledgements(linkageId: string) {
  const rows = await db("finding_acknowledgements as f")
    .leftJoin("users as u", "u.id", "f.user_id")
    .where("f.linkage_id", linkageId)
    .orderBy("f.created_at", "desc")
    .select("f.*", "u.name as user_name");
  return rows.map(toAck);
}

export async function createAcknowledgement(a: {
  buildId: string;
  linkageId: string;
  code: string;
  subject: Subject;
  reason: string;
  userId: string;
  revision: number;
  fingerprint: string;
}) {
  const row = await db.transaction(async (trx) => {
    const [r] = await trx("finding_acknowledgements")
      .insert({
        linkage_id: a.linkageId,
        code: a.code,
        subject_type: a.subject.type,
        subject_id: a.subject.id,
        reason: a.reason,
        user_id: a.userId,
        revision: a.revision,
        fingerprint: a.fingerprint,
      })
      .returning("id");
    await audit({ buildId: a.buildId, userId: a.userId, action: "finding.acknowledge", detail: { linkageId: a.linkageId, code: a.code, subject: a.subject } }, trx);
    return r as { id: string };
  });
  return (await listAcknowledgements(a.linkageId)).find((x) => x.id === row.id)!;
}

export async function deleteAcknowledgement(buildId: string, linkageId: string, ackId: string, userId: string) {
  return db.transaction(async (trx) => {
    const n = await trx("finding_acknowledgements").where({ id: ackId, linkage_id: linkageId }).del();
    if (n) await audit({ buildId, userId, action: "finding.unacknowledge", detail: { linkageId, ackId } }, trx);
    return n > 0;
  });
}
