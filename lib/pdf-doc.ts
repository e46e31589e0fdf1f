import "server-only";
/**
 * The PDFs' page writer: US Letter pages with the embedded DejaVu fonts, text wrapped in linear time, lines,
 * boxes and images written straight into each page's content stream, and the caution and page numbers on
 * every page (Doc.finish). What goes on the pages is in lib/records-pdf.ts.
 */
import { readFile } from "node:fs/promises";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import { deflateSync } from "node:zlib";
import { PDFDocument, PDFName, rgb, type PDFFont, type PDFPage, type PDFImage, type RGB } from "pdf-lib";
import { CAUTION_TEXT } from "@/shared/caution";
import { getObject } from "./storage";
import { printable, wrapText } from "./pdf-wrap";
export const PAGE = { w: 612, h: 792 }; // US Letter, points
export const M = 50;
export const INK = rgb(0.11, 0.13, 0.16);
export const SOFT = rgb(0.4, 0.43, 0.47);
export const CAUTION = rgb(0.62, 0.38, 0.02);
export const HAZARD = rgb(0.72, 0.12, 0.1);

/**
 * The PDFs embed DejaVu Sans (an open font shipped by the dejavu-fonts-ttf package), so names in any
 * Latin, Greek or Cyrillic script and signs such as ↔ ≥ ± ° × print as typed. A character the font has
 * no glyph for (an emoji, say) prints as "?".
 */
const FONT_DIR = path.join(process.cwd(), "node_modules", "dejavu-fonts-ttf", "ttf");
let fontFiles: Promise<[Buffer, Buffer]> | null = null;
const loadFonts = () => (fontFiles ??= Promise.all([readFile(path.join(FONT_DIR, "DejaVuSans.ttf")), readFile(path.join(FONT_DIR, "DejaVuSans-Bold.ttf"))]));


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

export class Doc {
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

export const isJpeg = (b: Buffer) => b.length > 2 && b[0] === 0xff && b[1] === 0xd8;
/**
 * A copy of the bytes for pdf-lib, which reads the whole ArrayBuffer under a Uint8Array: a small Buffer
 * from a pool or from the database driver is a slice of a larger one.
 */
export const own = (b: Buffer) => new Uint8Array(b);

/** A stored picture re-encoded small enough for a PDF page (pdf-lib embeds JPEG and PNG only). */
export async function reencoded(bytes: Buffer, maxPx: number) {
  const sharp = (await import("sharp")).default;
  return sharp(bytes).rotate().resize(maxPx, maxPx, { fit: "inside", withoutEnlargement: true }).flatten({ background: "#ffffff" }).jpeg({ quality: 80 }).toBuffer();
}

export async function embedStored(doc: Doc, key: string, maxPx: number): Promise<PDFImage | null> {
  const bytes = await getObject(key);
  return bytes ? doc.pdf.embedJpg(await reencoded(bytes, maxPx)) : null;
}

/** Runs `fn` over `items` with at most `n` at once (storage reads of a page's photos). */
export async function pool<T, R>(items: T[], n: number, fn: (t: T) => Promise<R>): Promise<R[]> {
  const out: R[] = new Array(items.length);
  let next = 0;
  await Promise.all(Array.from({ length: Math.min(n, items.length) }, async () => {
    while (next < items.length) { const i = next++; out[i] = await fn(items[i]); }
  }));
  return out;
}

