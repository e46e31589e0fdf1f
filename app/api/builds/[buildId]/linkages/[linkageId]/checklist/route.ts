import { withLinkage, parseBody, json } from "@/lib/http";
import { fieldError } from "@/lib/errors";
import { getRevision } from "@/db/linkages";
import { listTicks, setTick } from "@/db/checklist";
import { checklistFor } from "@/shared/records/checklist";
import { checklistReport } from "@/shared/records/checklist-report";
import { checklistTick } from "@/shared/schemas/checklist";

/** The checklist generated from a revision (current by default, `?revision=N`), with its ticks and notes. */
export const GET = withLinkage("read", { revision: "requested" }, async ({ build, linkage, revision: rev }) => {
  const ticks = await listTicks(linkage.id, rev.revision);
  const byKey = new Map(ticks.map((t) => [`${t.jointId}|${t.code}`, t]));
  const items = checklistFor(rev.graph, checklistReport(rev, rev.revision === linkage.revision, build.analysisSettings)).map((i) => {
    const t = byKey.get(`${i.jointId}|${i.code}`);
    return { ...i, tickedBy: t?.tickedBy ?? null, tickedAt: t?.tickedAt ?? null, note: t?.note ?? "" };
  });
  return json({ linkage, revision: rev.revision, currentRevision: linkage.revision, items });
});

/** Tick or untick one item, with an optional note. Owner, builders and reviewers tick. */
export const PUT = withLinkage("comment", async ({ req, user, build, linkage }) => {
  const t = await parseBody(req, checklistTick);
  const rev = await getRevision(linkage.id, t.revision);
  if (!rev) throw fieldError("revision", "no such revision", "No such revision of this linkage.");
  if (!checklistFor(rev.graph, checklistReport(rev, rev.revision === linkage.revision, build.analysisSettings)).some((i) => i.jointId === t.jointId && i.code === t.code)) {
    throw fieldError("code", "not on this checklist", "That item is not on this revision's checklist.");
  }
  await setTick(build.id, linkage.id, t.revision, t.jointId, t.code, t.ticked, t.note, user.id);
  const tick = (await listTicks(linkage.id, t.revision)).find((x) => x.jointId === t.jointId && x.code === t.code);
  return json({ item: tick });
});
