import "server-only";
/** What the PDFs say: the build log, a linkage's checklist, and a signed-off revision's record (pages by lib/pdf-doc.ts). */
import type { PDFImage } from "pdf-lib";
import { fileKeys, getRevisionPictureRow, keepThumbnail, thumbnailBytes } from "@/db/files";
import { getRevision } from "@/db/linkages";
import type { LogEntry, LogFilter } from "@/db/log";
import type { Tick } from "@/db/checklist";
import type { Build } from "@/db/builds";
import type { Linkage } from "@/db/linkages";
import type { ChecklistItem } from "@/shared/records/checklist";
import type { Joint, LinkageGraph } from "@/shared/linkage/schema";
import type { AckLike, FindingState } from "@/shared/review/hazards";
import { indexById, jointName } from "@/shared/linkage/names";
import { jointParts } from "@/shared/records/hardware";
import { findingTitle } from "@/shared/analysis/finding-title";
import { groupFingerprint } from "./record-fingerprint";
import { getObject } from "./storage";
import { printable } from "./pdf-wrap";
import type { ChecklistFindings } from "@/shared/records/checklist-findings";
import { Doc, embedStored, HAZARD, INK, isJpeg, M, own, PAGE, pool, reencoded, SOFT } from "./pdf-doc";

export { printable };
const SYSTEM_LABEL: Record<string, string> = { pitch: "Pitch", roll: "Roll", yaw: "Yaw", flap: "Flaps", trim: "Trim", other: "Other", unassigned: "No system" };
const h2 = (v: number) => (Math.round(v * 100) / 100).toFixed(2).replace(/\.00$/, "").replace(/(\.\d)0$/, "$1");

/** Reports how far a long export has got: entries done of the total. */
export type Progress = (done: number, total: number) => Promise<void> | void;

/**
 * The log as a PDF. Entries come a page at a time, oldest first (memory holds one page of rows), and
 * each photo is embedded once, from its stored thumbnail (a JPEG, embedded as it is); each tied
 * revision's findings and picture are read and embedded once however many entries name it.
 */
/** Findings of a revision printed under a log entry; a count names the rest. */
const LOG_FINDINGS_SHOWN = 6;

export async function logPdf(build: Build, pages: AsyncIterable<LogEntry[]>, count: number, totals: { total: number; bySystem: Record<string, number> }, f: LogFilter, progress?: Progress) {
  const doc = await new Doc(`${build.name} — build log`).init();
  doc.text(`${build.name} — build log`, { size: 18, bold: true, gap: 4 });
  doc.text([build.model, build.registration].filter(Boolean).join(" · ") || "Model not set", { color: SOFT });
  const range = f.from || f.to ? `${f.from ?? "the first entry"} to ${f.to ?? "the last entry"}` : "all entries";
  doc.text(`Covers ${range}${f.system ? `, ${SYSTEM_LABEL[f.system]} only` : ""}${f.q ? `, matching "${f.q}"` : ""}. ${count} entr${count === 1 ? "y" : "ies"}, ${h2(totals.total)} h. Printed ${new Date().toISOString().slice(0, 10)}.`, { color: SOFT, gap: 6 });
  const sys = Object.entries(totals.bySystem).sort((a, b) => b[1] - a[1]);
  if (sys.length) doc.text(`Hours by system: ${sys.map(([s, h]) => `${SYSTEM_LABEL[s] ?? s} ${h2(h)} h`).join(" · ")}`, { size: 9, gap: 8 });
  doc.rule();
  if (!count) doc.text("No entries in this range.", { color: SOFT });

  // Each photo is embedded once, from its thumbnail: the database's copy, read with its page of entries
  // (one query, not a storage request per photo), else storage's (then copied to the database for next time).
  const photoCache = new Map<string, Promise<PDFImage | null>>();
  const photo = (fileId: string, k: { key: string; thumbKey: string | null }, inDb: Map<string, Buffer>) => {
    let p = photoCache.get(fileId);
    if (!p) {
      p = (async () => {
        const copy = inDb.get(fileId);
        if (copy && isJpeg(copy)) return doc.pdf.embedJpg(own(copy));
        if (k.thumbKey) {
          const thumb = await getObject(k.thumbKey);
          // Stored thumbnails are JPEG (lib/uploads.ts), embedded as they are; anything else is re-encoded.
          if (thumb && isJpeg(thumb)) {
            await keepThumbnail(fileId, thumb).catch(() => {});
            return doc.pdf.embedJpg(own(thumb));
          }
          if (thumb) return doc.pdf.embedJpg(await reencoded(thumb, 320));
        }
        return embedStored(doc, k.key, 320);
      })();
      photoCache.set(fileId, p);
    }
    return p;
  };
  const revisionCache = new Map<string, Promise<{ rev: Awaited<ReturnType<typeof getRevision>>; img: PDFImage | null }>>();
  const revisionOf = (linkageId: string, revision: number) => {
    const id = `${linkageId}:${revision}`;
    let p = revisionCache.get(id);
    if (!p) {
      p = (async () => {
        const [rev, pic] = await Promise.all([getRevision(linkageId, revision), getRevisionPictureRow(build.id, linkageId, revision)]);
        return { rev, img: pic ? await embedStored(doc, pic.key, 1000) : null };
      })();
      revisionCache.set(id, p);
    }
    return p;
  };

  let done = 0;
  // The next page of entries and its thumbnails are read while this one is laid out.
  const it = pages[Symbol.asyncIterator]();
  const fetchPage = async () => {
    const r = await it.next();
    if (r.done) return null;
    const ids = r.value.flatMap((e) => e.files.map((x) => x.id));
    const [keys, inDb] = await Promise.all([fileKeys(build.id, ids), thumbnailBytes(build.id, ids)]);
    return { entries: r.value, keys, inDb };
  };
  for (let ahead = fetchPage(); ; ) {
    const got = await ahead;
    if (!got) break;
    ahead = fetchPage();
    ahead.catch(() => {}); // awaited on the next turn; if the layout fails first, its failure is the one reported
    const { entries, keys, inDb } = got;
    // Read this page's photos and revisions ahead of laying them out (storage a few at a time).
    await pool([...keys].filter(([, k]) => k.kind !== "pdf"), 8, ([id, k]) => photo(id, k, inDb));
    await pool(entries.filter((e) => e.linkageId && e.revision), 4, (e) => revisionOf(e.linkageId!, e.revision!));
    for (const e of entries) {
      doc.ensure(60);
      doc.text(`${e.date} · ${h2(e.hours)} h${e.systems.length ? ` · ${e.systems.map((s) => SYSTEM_LABEL[s] ?? s).join(", ")}` : ""}${e.author ? ` · ${e.author}` : ""}`, { size: 8, color: SOFT, gap: 0 });
      doc.text(e.title, { size: 12, bold: true });
      if (e.text.trim()) doc.text(e.text, { size: 10, gap: 4 });

      if (e.linkageId && e.revision) {
        const { rev, img } = await revisionOf(e.linkageId, e.revision);
        const s = rev?.analysis?.summary;
        doc.text(`Linkage: ${e.linkageName ?? "deleted linkage"}, revision ${e.revision}${s ? ` — ${s.hazard} hazard${s.hazard === 1 ? "" : "s"}, ${s.caution} caution${s.caution === 1 ? "" : "s"}, ${s.advisory} advisor${s.advisory === 1 ? "y" : "ies"}${s.lowestMargin ? `; lowest margin ${s.lowestMargin.value.toFixed(2)} (${s.lowestMargin.what})` : ""}` : ""}`, { size: 9, bold: true, color: s && s.hazard ? HAZARD : INK });
        // The log shows a revision's first findings; the rest are named as a count, never dropped silently.
        const serious = (rev?.analysis?.findings ?? []).filter((x) => x.severity !== "advisory");
        for (const fi of serious.slice(0, LOG_FINDINGS_SHOWN)) {
          doc.text(`• ${fi.severity === "hazard" ? "Hazard" : "Caution"}: ${fi.message}`, { size: 8, x: M + 8, gap: 1 });
        }
        if (serious.length > LOG_FINDINGS_SHOWN) doc.text(`…and ${serious.length - LOG_FINDINGS_SHOWN} more hazard or caution findings: see the linkage's checklist PDF for revision ${e.revision}.`, { size: 8, x: M + 8, gap: 1, color: SOFT });
        if (img) doc.images([{ img, caption: `${e.linkageName ?? "Linkage"} — revision ${e.revision} (picture from the editor)` }], 1, 300);
        else doc.text("(No picture stored for this revision.)", { size: 8, color: SOFT });
      }

      const photos: { img: PDFImage; caption: string }[] = [];
      const pdfs: string[] = [];
      for (const file of e.files) {
        const k = keys.get(file.id);
        if (!k) continue;
        if (k.kind === "pdf") { pdfs.push(file.name); continue; }
        const img = await photo(file.id, k, inDb);
        if (img) photos.push({ img, caption: file.name });
      }
      if (photos.length) doc.images(photos, photos.length === 1 ? 1 : Math.min(3, photos.length), photos.length === 1 ? 200 : 140);
      if (pdfs.length) doc.text(`Attached documents: ${pdfs.join(", ")}`, { size: 8, color: SOFT });
      doc.rule();
    }
    done += entries.length;
    await progress?.(done, count);
  }
  return doc.finish();
}

/** The checklist's items grouped by where they are, each with its box, who ticked it and when, and its source. */
function drawChecklist(doc: Doc, items: ChecklistItem[], ticks: Tick[]) {
  const byKey = new Map(ticks.map((t) => [`${t.jointId}|${t.code}`, t]));
  const done = items.filter((i) => byKey.get(`${i.jointId}|${i.code}`)?.tickedAt).length;
  doc.text(`${done} of ${items.length} items ticked.`, { size: 10, bold: true, gap: 6 });
  let where = "";
  for (const i of items) {
    if (i.where !== where) {
      where = i.where;
      doc.ensure(40);
      doc.text(i.where, { size: 10, bold: true, gap: 3 });
    }
    const t = byKey.get(`${i.jointId}|${i.code}`);
    doc.ensure(24);
    const boxY = doc.y - 10;
    doc.page.drawRectangle({ x: M + 4, y: boxY, width: 9, height: 9, borderColor: INK, borderWidth: 0.8 });
    if (t?.tickedAt) {
      doc.page.drawLine({ start: { x: M + 5.5, y: boxY + 4.5 }, end: { x: M + 8, y: boxY + 1.5 }, thickness: 1.2, color: INK });
      doc.page.drawLine({ start: { x: M + 8, y: boxY + 1.5 }, end: { x: M + 12, y: boxY + 8 }, thickness: 1.2, color: INK });
    }
    doc.text(i.text, { size: 9, x: M + 20, gap: 0 });
    doc.text(`${t?.tickedAt ? `Ticked by ${t.tickedBy} on ${t.tickedAt.slice(0, 16).replace("T", " ")} UTC` : "Not ticked — initials: ________  date: ________"} · source: ${i.source.text}`, { size: 7, x: M + 20, color: SOFT, gap: t?.note ? 0 : 5 });
    if (t?.note) doc.text(`Note: ${t.note}`, { size: 8, x: M + 20, gap: 5 });
  }
}

/**
 * `check`: the open hazards and cautions of the printed revision's stored check (shared/records/checklist-findings.ts):
 * printed first, every one of them, so a list with every box ticked is never read as complete while they stand.
 */
export async function checklistPdf(build: Build, linkage: Linkage, revision: number, items: ChecklistItem[], ticks: Tick[], check: ChecklistFindings) {
  const doc = await new Doc(`${build.name} — ${linkage.name} checklist`).init();
  doc.text(`Inspection checklist — ${linkage.name}`, { size: 18, bold: true, gap: 4 });
  doc.text(`${build.name}${build.registration ? ` (${build.registration})` : ""} · revision ${revision}${revision !== linkage.revision ? ` (current is ${linkage.revision})` : ""} · printed ${new Date().toISOString().slice(0, 10)}`, { color: SOFT, gap: 6 });
  doc.rule();
  const hazards = check.open.filter((f) => f.severity === "hazard").length, cautions = check.open.length - hazards;
  if (!check.drawn) doc.text("Not complete: nothing is drawn in this revision, so nothing was checked.", { size: 10, bold: true, color: HAZARD, gap: 4 });
  else if (!check.checked) doc.text("Not complete: this revision was saved without its check; open it in the editor and save to check it.", { size: 10, bold: true, color: HAZARD, gap: 4 });
  else if (check.open.length) {
    doc.text(`Not complete while these stand: ${hazards} open hazard${hazards === 1 ? "" : "s"} and ${cautions} open caution${cautions === 1 ? "" : "s"} in this revision's check${check.acknowledged ? ` (${check.acknowledged} acknowledged by a reviewer, not listed)` : ""}.`, { size: 10, bold: true, color: hazards ? HAZARD : INK, gap: 3 });
    for (const f of check.open) doc.text(`• ${f.severity === "hazard" ? "Hazard" : "Caution"} — ${f.title} — ${f.where}: ${f.message}`, { size: 8, x: M + 8, color: f.severity === "hazard" ? HAZARD : INK, gap: 1 });
  } else doc.text(`This revision's check has no open hazard or caution${check.acknowledged ? ` (${check.acknowledged} acknowledged by a reviewer)` : ""}.`, { size: 9, gap: 4 });
  drawChecklist(doc, items, ticks);
  return doc.finish();
}

const SOURCE_WORD: Record<string, string> = { published: "published", commonPractice: "common practice", fromMemory: "recalled value, check it" };
const SEVERITY_WORD: Record<string, string> = { hazard: "Hazard", caution: "Caution", advisory: "Advisory" };

/** What one signed-off revision's record holds (lib/jobs/kinds.ts "revision-record" gathers it). */
export type RevisionRecord = {
  build: Build;
  linkage: Linkage;
  revision: number;
  graph: LinkageGraph;
  findings: (FindingState & { acknowledgement: (AckLike & { by?: { name: string }; reason?: string }) | null })[];
  items: ChecklistItem[];
  ticks: Tick[];
  photos: { jointId: string; name: string; key: string; thumbKey: string | null }[];
  picture: { key: string } | null;
  signoff: { reviewerName: string; statement: string; signedAt: string };
  fingerprint: string;
  /** A later revision exists: the sign-off no longer covers the linkage as it is. */
  superseded: number | null;
  verifyUrl: string;
};

/** A joint's hardware in one line: the parts it calls for and the states a reviewer checks. */
function hardwareLine(j: Joint): string {
  const parts = jointParts(j).map(([, , text, pn]) => (pn ? `${text} (${pn})` : text));
  const h = j.hardware;
  const states: string[] = [];
  if (h.rodEnd) {
    states.push(h.jamNut?.fitted ? (h.jamNut.tightened ? "jam nut tightened" : "jam nut fitted, not confirmed tight") : "no jam nut recorded");
    states.push(h.engagement?.witnessHoleVerified ? "witness hole checked" : "witness hole not checked");
  }
  if (h.torque !== undefined) states.push(`torque ${h.torque} in·lbf`);
  if (h.torqueStripe) states.push("torque stripe applied");
  if (h.bearing) states.push(`turns on ${h.bearing === "rodEnd" ? "the rod end" : h.bearing === "ballBearing" ? "a ball bearing" : h.bearing === "plainBushing" ? "a plain bushing" : h.bearing === "clevisPin" ? "a clevis pin" : "nothing (fixed)"}`);
  const all = [...parts, ...states];
  return all.length ? all.join("; ") : "No hardware recorded.";
}

/**
 * The record an inspector keeps of one signed-off revision: its fingerprint, the picture, every joint's
 * hardware, every finding numbered with its source and acknowledgement, the checklist with who ticked what
 * and when, the joints' photos as thumbnails, the reviewer's statement and sign-off, and the caution on
 * every page. The fingerprint is also in the PDF's keywords, where the verification page reads it.
 */
export async function revisionRecordPdf(r: RevisionRecord) {
  const doc = await new Doc(`${r.build.name} — ${r.linkage.name}, revision ${r.revision} record`).init();
  doc.pdf.setSubject(`Record of a signed-off revision. Fingerprint ${r.fingerprint}`);
  doc.pdf.setKeywords([`linkwright-record-fingerprint:${r.fingerprint}`]);
  doc.text(`Revision record — ${r.linkage.name}, revision ${r.revision}`, { size: 18, bold: true, gap: 4 });
  doc.text(`${r.build.name}${r.build.registration ? ` (${r.build.registration})` : ""} · ${r.build.model || "model not set"} · printed ${new Date().toISOString().slice(0, 10)}`, { color: SOFT, gap: 6 });
  doc.text(`Signed off by ${r.signoff.reviewerName} on ${r.signoff.signedAt.slice(0, 16).replace("T", " ")} UTC.`, { size: 11, bold: true, gap: 2 });
  doc.text(r.superseded ? `Superseded: the linkage has since changed (revision ${r.superseded} is current); this sign-off covers revision ${r.revision} only.` : "This is the linkage's current revision.", { size: 9, color: r.superseded ? HAZARD : INK, gap: 4 });
  doc.text("Fingerprint of the signed revision", { size: 8, color: SOFT, gap: 0 });
  doc.text(groupFingerprint(r.fingerprint), { size: 10, bold: true, gap: 1 });
  doc.text(`Check this record: open ${r.verifyUrl} and upload this PDF or type the fingerprint.`, { size: 8, color: SOFT, gap: 6 });
  doc.rule();

  doc.heading("Picture");
  const pic = r.picture ? await embedStored(doc, r.picture.key, 1000) : null;
  if (pic) doc.images([{ img: pic, caption: `${r.linkage.name} — revision ${r.revision}, as kept from the editor` }], 1, 300);
  else doc.text("No picture was kept for this revision (the editor's \"Keep for the log\").", { size: 9, color: SOFT, gap: 4 });
  doc.rule();

  const nodes = indexById(r.graph.nodes);
  doc.heading(`Joints and their hardware (${r.graph.joints.length})`);
  if (!r.graph.joints.length) doc.text("This revision has no joints.", { size: 9, color: SOFT });
  for (const j of r.graph.joints) {
    doc.ensure(30);
    doc.text(jointName(j, nodes), { size: 9, bold: true, gap: 0 });
    doc.text(hardwareLine(j), { size: 8, x: M + 10, gap: 4 });
  }
  doc.rule();

  doc.heading(`Findings (${r.findings.length})`);
  if (!r.findings.length) doc.text("The load-path check found nothing in this revision.", { size: 9, color: SOFT });
  r.findings.forEach((f, i) => {
    doc.ensure(40);
    doc.text(`${i + 1}. ${SEVERITY_WORD[f.severity] ?? f.severity} — ${findingTitle(f.code)} — ${f.subjectName}`, { size: 9, bold: true, color: f.severity === "hazard" ? HAZARD : INK, gap: 0 });
    doc.text(f.message, { size: 8, x: M + 10, gap: 0 });
    doc.text(`Source: ${SOURCE_WORD[f.source.kind] ?? f.source.kind} — ${f.source.text}`, { size: 7, x: M + 10, color: SOFT, gap: 0 });
    const a = f.acknowledgement;
    doc.text(a ? `Acknowledged by ${a.by?.name ?? "a reviewer"} on ${a.createdAt.slice(0, 10)}: ${a.reason ?? ""}` : f.severity === "hazard" ? "Not acknowledged." : "No acknowledgement needed for a sign-off.", { size: 8, x: M + 10, gap: 5 });
  });
  doc.rule();

  doc.heading("Checklist");
  drawChecklist(doc, r.items, r.ticks);
  doc.rule();

  doc.heading(`Photos of the joints (${r.photos.length})`);
  const joints = indexById(r.graph.joints);
  const shots = await pool(r.photos, 6, async (p) => {
    const bytes = await getObject(p.thumbKey ?? p.key);
    if (!bytes) return null;
    const img = await doc.pdf.embedJpg(isJpeg(bytes) ? own(bytes) : await reencoded(bytes, 320));
    const j = joints.get(p.jointId);
    return { img, caption: `${j ? jointName(j, nodes) : "a joint no longer in the drawing"} — ${p.name}` };
  });
  const found = shots.filter((x): x is { img: PDFImage; caption: string } => !!x);
  if (found.length) doc.images(found, 3, 140);
  else doc.text("No photos attached to this linkage's joints.", { size: 9, color: SOFT });
  if (found.length < r.photos.length) doc.text(`${r.photos.length - found.length} photo(s) could not be read from storage.`, { size: 8, color: HAZARD });
  doc.rule();

  doc.heading("Reviewer's statement");
  doc.text(r.signoff.statement, { size: 10, gap: 4 });
  doc.text(`— ${r.signoff.reviewerName}, ${r.signoff.signedAt.slice(0, 10)} · revision ${r.revision} · fingerprint ${groupFingerprint(r.fingerprint)}`, { size: 8, color: SOFT });
  return doc.finish();
}
