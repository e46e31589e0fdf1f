import "server-only";
import { readFile } from "node:fs/promises";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import { PDFDocument, rgb, type PDFFont, type PDFPage, type PDFImage } from "pdf-lib";
import { fileKeys, getRevisionPictureRow } from "@/db/files";
import { getRevision } from "@/db/linkages";
import type { LogEntry, LogFilter } from "@/db/log";
import type { Tick } from "@/db/checklist";
import type { Build } from "@/db/builds";
import type { Linkage } from "@/db/linkages";
import type { ChecklistItem } from "@/shared/records/checklist";
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

class Doc {
  pdf!: PDFDocument;
  font!: PDFFont;
  bold!: PDFFont;
  page!: PDFPage;
  y = 0;
  pages: PDFPage[] = [];
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
    this.page = this.pdf.addPage([PAGE.w, PAGE.h]);
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
      const sized = row.map((r, k) => ({ ...r, ...this.image(r.img, cellW, cellH, M + k * (cellW + gap)) }));
      const h = Math.max(...sized.map((s) => s.h)) + 14;
      this.ensure(h);
      sized.forEach((s, k) => {
        s.draw(this.y);
        this.page.drawText(this.wrap(printable(s.caption, this.font), 7, this.font, cellW)[0] ?? "", { x: M + k * (cellW + gap), y: this.y - s.h - 9, size: 7, font: this.font, color: SOFT });
      });
      this.y -= h + 4;
    }
  }
  async finish() {
    const n = this.pages.length;
    const lines = this.wrap(`Caution. ${CAUTION_TEXT}`, 7, this.font, PAGE.w - 2 * M);
    this.pages.forEach((p, i) => {
      lines.forEach((l, k) => p.drawText(l, { x: M, y: M + 30 - k * 9, size: 7, font: this.font, color: CAUTION }));
      p.drawText(`${printable(this.title, this.font)} · page ${i + 1} of ${n}`, { x: M, y: M - 14, size: 7, font: this.font, color: SOFT });
    });
    return this.pdf.save();
  }
}

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

  const photoCache = new Map<string, Promise<PDFImage | null>>();
  const photo = (k: { key: string; thumbKey: string | null }) => {
    const id = k.thumbKey ?? k.key;
    let p = photoCache.get(id);
    if (!p) {
      p = (async () => {
        if (k.thumbKey) {
          const thumb = await getObject(k.thumbKey);
          // Stored thumbnails are JPEG (lib/uploads.ts), embedded as they are; anything else is re-encoded.
          // A copy: pdf-lib reads the bytes' whole ArrayBuffer, and a small Buffer is a slice of a shared pool.
          if (thumb && thumb[0] === 0xff && thumb[1] === 0xd8) return doc.pdf.embedJpg(new Uint8Array(thumb));
          if (thumb) return doc.pdf.embedJpg(await reencoded(thumb, 320));
        }
        return embedStored(doc, k.key, 320);
      })();
      photoCache.set(id, p);
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
  for await (const entries of pages) {
    const keys = await fileKeys(build.id, entries.flatMap((e) => e.files.map((x) => x.id)));
    // Read this page's photos and revisions from storage a few at a time, ahead of laying them out.
    await pool([...keys.values()].filter((k) => k.kind !== "pdf"), 8, photo);
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
        const img = await photo(k);
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

export async function checklistPdf(build: Build, linkage: Linkage, revision: number, items: ChecklistItem[], ticks: Tick[]) {
  const doc = await new Doc(`${build.name} — ${linkage.name} checklist`).init();
  doc.text(`Inspection checklist — ${linkage.name}`, { size: 18, bold: true, gap: 4 });
  doc.text(`${build.name}${build.registration ? ` (${build.registration})` : ""} · revision ${revision}${revision !== linkage.revision ? ` (current is ${linkage.revision})` : ""} · printed ${new Date().toISOString().slice(0, 10)}`, { color: SOFT, gap: 6 });
  const byKey = new Map(ticks.map((t) => [`${t.jointId}|${t.code}`, t]));
  const done = items.filter((i) => byKey.get(`${i.jointId}|${i.code}`)?.tickedAt).length;
  doc.text(`${done} of ${items.length} items ticked.`, { size: 10, bold: true, gap: 6 });
  doc.rule();
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
  return doc.finish();
}
