import "server-only";
import { readFile } from "node:fs/promises";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import { deflateSync } from "node:zlib";
import { PDFDocument, PDFName, rgb, type PDFFont, type PDFPage, type PDFImage, type RGB } from "pdf-lib";
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
import { CAUTION_TEXT } from "@/shared/caution";
import { getObject } from "./storage";
import { printable, wrapText } from "./pdf-wrap";

const PAGE = { w: 612, h: 792 }; // US Letter, points
const M = 50;
const INK = rgb(0.11, 0.13, 0.16);
const SOFT = rgb(0.4, 0.43, 0.47);
const CAUTION = rgb(0.62, 0.38, 0.02);
const HAZARD = rgb(0.72, 0.12, 0.1);

/**
 * The PDFs embed DejaVu Sans (an open font shipped by the dejavu-fonts-ttf package), so names in any
 * Latin, Greek or Cyrillic script and signs such as ↔ ≥ ± ° × print as typed. A character the font has
 * no glyph for (an emoji, say) prints as "?".
 */
const FONT_DIR = path.join(process.cwd(), "node_modules", "dejavu-fonts-ttf", "ttf");
let fontFiles: Promise<[Buffer, Buffer]> | null = null;
const loadFonts = () => (fontFiles ??= Promise.all([readFile(path.join(FONT_DIR, "DejaVuSans.ttf")), readFile(path.join(FONT_DIR, "DejaVuSans-Bold.ttf"))]));

export { printable };

/**
 * The font engine without shaping. pdf-lib asks the font for a string's glyphs (to draw it and to measure it)
 * and uses only each glyph's id and advance width: kerning and mark positions are never applied. Shaping
 * (the substitution tables of DejaVu Sans) cost more than half of a long log PDF's time and changes nothing
 * but the rare ligature, so a string's glyphs come from the font's character map alone: linear in its length.
 */
const plainFontkit: typeof fontkit = {
  ...fontkit,
  create(buffer: Uint8Array, postscriptName?: string) {
    const font = fontkit.create(buffer as never, postscriptName) as ReturnType<typeof fontkit.create> & { glyphsForString(s: string): unknown[] };
    (font as unknown as { layout: (s: string) => { glyphs: unknown[] } }).layout = (s: string) => ({ glyphs: font.glyphsForString(s) });
    return font;
  },
} as typeof fontkit;

/** A number as a PDF operand: two decimals are a hundredth of a point, and never an exponent. */
const num = (v: number) => String(Math.round(v * 100) / 100);
const colour = (c: RGB, op: "rg" | "RG") => `${num(c.red)} ${num(c.green)} ${num(c.blue)} ${op}`;

/**
 * One page's drawing, written as the page's content stream text and compressed once when the document is
 * saved. pdf-lib's own drawing keeps every operator of every page as objects until the save, which was most of
 * a long log's time; this writes the same few operators (text, lines, boxes, images) as text straight away.
 * Text goes through the font's encoder, which also records the glyphs the embedded subset must hold.
 */
class Ink {
  private ops: string[] = [];
  private images = new Set<string>();
  constructor(private doc: Doc, readonly page: PDFPage) {
    page.node.setFontDictionary(PDFName.of("F0"), doc.font.ref);
    page.node.setFontDictionary(PDFName.of("F1"), doc.bold.ref);
  }
  drawText(text: string, o: { x: number; y: number; size: number; font: PDFFont; color: RGB }) {
    const key = o.font === this.doc.bold ? "F1" : "F0";
    this.ops.push(`BT ${colour(o.color, "rg")} /${key} ${num(o.size)} Tf 1 0 0 1 ${num(o.x)} ${num(o.y)} Tm <${this.doc.encode(o.font, text)}> Tj ET`);
  }
  drawLine(o: { start: { x: number; y: number }; end: { x: number; y: number }; thickness: number; color: RGB }) {
    this.ops.push(`q ${colour(o.color, "RG")} ${num(o.thickness)} w ${num(o.start.x)} ${num(o.start.y)} m ${num(o.end.x)} ${num(o.end.y)} l S Q`);
  }
  drawRectangle(o: { x: number; y: number; width: number; height: number; borderColor: RGB; borderWidth: number }) {
    this.ops.push(`q ${colour(o.borderColor, "RG")} ${num(o.borderWidth)} w ${num(o.x)} ${num(o.y)} ${num(o.width)} ${num(o.height)} re S Q`);
  }
  drawImage(img: PDFImage, o: { x: number; y: number; width: number; height: number }) {
    const key = this.doc.imageKey(img);
    if (!this.images.has(key)) {
      this.images.add(key);
      this.page.node.setXObject(PDFName.of(key), img.ref);
    }
    this.ops.push(`q ${num(o.width)} 0 0 ${num(o.height)} ${num(o.x)} ${num(o.y)} cm /${key} Do Q`);
  }
  /** Hands the page what was drawn since the last flush as a content stream of its own (Flate, by Node's zlib). */
  flush() {
    if (!this.ops.length) return;
    const ctx = this.doc.pdf.context;
    const stream = ctx.stream(deflateSync(Buffer.from(this.ops.join("\n"), "latin1")), { Filter: "FlateDecode" });
    this.page.node.addContentStream(ctx.register(stream));
    this.ops = [];
  }
}

class Doc {
  pdf!: PDFDocument;
  font!: PDFFont;
  bold!: PDFFont;
  page!: Ink;
  y = 0;
  pages: Ink[] = [];
  private imageKeys = new Map<PDFImage, string>();
  private codes = new Map<PDFFont, Map<string, string>>();
  /**
   * The text as the hex glyph codes of the font's subset. Without shaping a character is one glyph, so each
   * character is asked of the font once (which also puts its glyph in the subset) and remembered.
   */
  encode(font: PDFFont, text: string) {
    let m = this.codes.get(font);
    if (!m) this.codes.set(font, (m = new Map()));
    let hex = "";
    for (const ch of text) {
      let c = m.get(ch);
      if (c === undefined) m.set(ch, (c = font.encodeText(ch).toString().slice(1, -1)));
      hex += c;
    }
    return hex;
  }
  imageKey(img: PDFImage) {
    let k = this.imageKeys.get(img);
    if (!k) this.imageKeys.set(img, (k = `I${this.imageKeys.size}`));
    return k;
  }
  constructor(private title: string) {}
  async init() {
    this.pdf = await PDFDocument.create();
    this.pdf.setTitle(this.title);
    this.pdf.setProducer("Linkwright");
    this.pdf.setCreator("Linkwright");
    this.pdf.registerFontkit(plainFontkit);
    const [regular, bold] = await loadFonts();
    this.font = await this.pdf.embedFont(regular, { subset: true });
    this.bold = await this.pdf.embedFont(bold, { subset: true });
    this.newPage();
    return this;
  }
  newPage() {
    this.page?.flush();
    this.page = new Ink(this, this.pdf.addPage([PAGE.w, PAGE.h]));
    this.pages.push(this.page);
    this.y = PAGE.h - M;
  }
  /** Leaves room for the footer (the caution). */
  ensure(h: number) {
    if (this.y - h < M + 46) this.newPage();
  }
  /** Lines of `text` that fit `width` points, in time linear in the text (lib/pdf-wrap.ts). */
  wrap(text: string, size: number, font: PDFFont, width: number): string[] {
    return wrapText(printable(text, this.font), size, font, width);
  }
  text(t: string, o: { size?: number; bold?: boolean; color?: ReturnType<typeof rgb>; x?: number; width?: number; gap?: number } = {}) {
    const size = o.size ?? 10;
    const font = o.bold ? this.bold : this.font;
    const x = o.x ?? M;
    const lines = this.wrap(t, size, font, o.width ?? PAGE.w - x - M);
    for (const line of lines) {
      this.ensure(size * 1.35);
      this.page.drawText(line, { x, y: this.y - size, size, font, color: o.color ?? INK });
      this.y -= size * 1.35;
    }
    this.y -= o.gap ?? 2;
  }
  /** A section heading, kept with at least the start of what follows it. */
  heading(t: string) {
    this.ensure(70);
    this.text(t, { size: 12, bold: true, gap: 3 });
  }
  rule() {
    this.ensure(8);
    this.page.drawLine({ start: { x: M, y: this.y - 3 }, end: { x: PAGE.w - M, y: this.y - 3 }, thickness: 0.5, color: SOFT });
    this.y -= 10;
  }
  image(img: PDFImage, maxW: number, maxH: number, x = M) {
    const s = Math.min(maxW / img.width, maxH / img.height, 1);
    const w = img.width * s, h = img.height * s;
    return { w, h, draw: (y: number) => this.page.drawImage(img, { x, y: y - h, width: w, height: h }) };
  }
  /** Images in rows of `perRow`, each scaled to fit its cell. */
  images(imgs: { img: PDFImage; caption: string }[], perRow: number, cellH: number) {
    const gap = 10;
    const cellW = (PAGE.w - 2 * M - gap * (perRow - 1)) / perRow;
    for (let i = 0; i < imgs.length; i += perRow) {
      const row = imgs.slice(i, i + perRow);
      // A caption takes up to three lines; a longer one ends in "…" (it says it goes on).
      const sized = row.map((r, k) => {
        const all = this.wrap(printable(r.caption, this.font), 7, this.font, cellW);
        const lines = all.length > 3 ? [...all.slice(0, 2), `${all[2].replace(/.$/, "")}…`] : all;
        return { ...r, lines, ...this.image(r.img, cellW, cellH, M + k * (cellW + gap)) };
      });
      const h = Math.max(...sized.map((s) => s.h + 5 + 9 * Math.max(1, s.lines.length)));
      this.ensure(h);
      sized.forEach((s, k) => {
        s.draw(this.y);
        s.lines.forEach((l, i) => this.page.drawText(l, { x: M + k * (cellW + gap), y: this.y - s.h - 9 - 9 * i, size: 7, font: this.font, color: SOFT }));
      });
      this.y -= h + 4;
    }
  }
  async finish() {
    const n = this.pages.length;
    this.page.flush();
    const lines = this.wrap(`Caution. ${CAUTION_TEXT}`, 7, this.font, PAGE.w - 2 * M);
    const title = printable(this.title, this.font);
    // The footer (the caution and "page i of n") goes in after the last page is known, as each page's second stream.
    this.pages.forEach((p, i) => {
      lines.forEach((l, k) => p.drawText(l, { x: M, y: M + 30 - k * 9, size: 7, font: this.font, color: CAUTION }));
      p.drawText(`${title} · page ${i + 1} of ${n}`, { x: M, y: M - 14, size: 7, font: this.font, color: SOFT });
      p.flush();
    });
    // Object streams would compress the many small objects once more, at a cost the size does not repay here.
    return this.pdf.save({ useObjectStreams: false });
  }
}

const isJpeg = (b: Buffer) => b.length > 2 && b[0] === 0xff && b[1] === 0xd8;
/**
 * A copy of the bytes for pdf-lib, which reads the whole ArrayBuffer under a Uint8Array: a small Buffer
 * from a pool or from the database driver is a slice of a larger one.
 */
const own = (b: Buffer) => new Uint8Array(b);

/** A stored picture re-encoded small enough for a PDF page (pdf-lib embeds JPEG and PNG only). */
async function reencoded(bytes: Buffer, maxPx: number) {
  const sharp = (await import("sharp")).default;
  return sharp(bytes).rotate().resize(maxPx, maxPx, { fit: "inside", withoutEnlargement: true }).flatten({ background: "#ffffff" }).jpeg({ quality: 80 }).toBuffer();
}

async function embedStored(doc: Doc, key: string, maxPx: number): Promise<PDFImage | null> {
  const bytes = await getObject(key);
  return bytes ? doc.pdf.embedJpg(await reencoded(bytes, maxPx)) : null;
}

/** Runs `fn` over `items` with at most `n` at once (storage reads of a page's photos). */
async function pool<T, R>(items: T[], n: number, fn: (t: T) => Promise<R>): Promise<R[]> {
  const out: R[] = new Array(items.length);
  let next = 0;
  await Promise.all(Array.from({ length: Math.min(n, items.length) }, async () => {
    while (next < items.length) { const i = next++; out[i] = await fn(items[i]); }
  }));
  return out;
}

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

export async function checklistPdf(build: Build, linkage: Linkage, revision: number, items: ChecklistItem[], ticks: Tick[]) {
  const doc = await new Doc(`${build.name} — ${linkage.name} checklist`).init();
  doc.text(`Inspection checklist — ${linkage.name}`, { size: 18, bold: true, gap: 4 });
  doc.text(`${build.name}${build.registration ? ` (${build.registration})` : ""} · revision ${revision}${revision !== linkage.revision ? ` (current is ${linkage.revision})` : ""} · printed ${new Date().toISOString().slice(0, 10)}`, { color: SOFT, gap: 6 });
  doc.rule();
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
