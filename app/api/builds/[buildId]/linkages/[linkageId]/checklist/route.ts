import { withBuild, parseBody, json, requestedRevision } from "@/lib/http";
import { ApiError } from "@/lib/errors";
import { getRevision } from "@/db/linkages";
import { listTicks, setTick } from "@/db/checklist";
import { audit } from "@/db/audit";
import { checklistFor } from "@/shared/records/checklist";
import { checklistTick } from "@/shared/records-api";
import { requireLinkage } from "@/lib/records-http";

type P = { buildId: string; linkageId: string };

/** The checklist generated from a revision (current by default, `?revision=N`), with its ticks and notes. */
export const GET = withBuild<P>("read", async ({ req, build, params }) => {
  const linkage = await requireLinkage(build.id, params.linkageId);
  const rev = await requestedRevision(req, linkage.id);
  const ticks = await listTicks(linkage.id, rev.revision);
  const byKey = new Map(ticks.map((t) => [`${t.jointId}|${t.code}`, t]));
  const items = checklistFor(rev.graph).map((i) => {
    const t = byKey.get(`${i.jointId}|${i.code}`);
    return { ...i, tickedBy: t?.tickedBy ?? null, tickedAt: t?.tickedAt ?? null, note: t?.note ?? "" };
  });
  return json({ linkage, revision: rev.revision, currentRevision: linkage.revision, items });
});

/** Tick or untick one item, with an optional note. Owner, builders and reviewers tick. */
export const PUT = withBuild<P>("comment", async ({ req, user, build, params }) => {
  const linkage = await requireLinkage(build.id, params.linkageId);
  const t = await parseBody(req, checklistTick);
  const rev = await getRevision(linkage.id, t.revision);
  if (!rev) throw new ApiError(400, "invalid_input", "No such revision of this linkage.", { revision: "no such revision" });
  if (!checklistFor(rev.graph).some((i) => i.jointId === t.jointId && i.code === t.code)) {
    throw new ApiError(400, "invalid_input", "That item is not on this revision's checklist.", { code: "not on this checklist" });
  }
  await setTick(linkage.id, t.revision, t.jointId, t.code, t.ticked, t.note, user.id);
  await audit({ buildId: build.id, userId: user.id, action: "checklist.tick", detail: { linkageId: linkage.id, revision: t.revision, jointId: t.jointId, code: t.code, ticked: t.ticked } });
  const tick = (await listTicks(linkage.id, t.revision)).find((x) => x.jointId === t.jointId && x.code === t.code);
  return json({ item: tick });
});
