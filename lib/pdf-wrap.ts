/**
 * Line wrapping for the PDFs, linear in the text's length: each character's width is looked up once per
 * font (then cached), a line's width is kept as a running sum, and a word wider than the line is broken
 * between characters. No line holds more than MAX_LINE_CHARS characters, so a run of zero-width marks
 * cannot make one unbounded line either.
 */
export interface MeasuringFont {
  widthOfTextAtSize(text: string, size: number): number;
}
interface GlyphFont extends MeasuringFont {
  getCharacterSet(): number[];
}

export const MAX_LINE_CHARS = 400;

const widths = new WeakMap<MeasuringFont, Map<string, number>>();
/** Width of one character at size 1. */
function charWidth(font: MeasuringFont, ch: string): number {
  let m = widths.get(font);
  if (!m) widths.set(font, (m = new Map()));
  let w = m.get(ch);
  if (w === undefined) {
    w = font.widthOfTextAtSize(ch, 1000) / 1000;
    m.set(ch, w);
  }
  return w;
}

const glyphSets = new WeakMap<GlyphFont, Set<number>>();
const PRINTABLE_ASCII = /^[\x20-\x7e\n]*$/;
const asciiFonts = new WeakMap<GlyphFont, boolean>();
function hasAscii(font: GlyphFont, glyphs: Set<number>) {
  let ok = asciiFonts.get(font);
  if (ok === undefined) {
    ok = true;
    for (let cp = 0x20; cp <= 0x7e; cp++) ok &&= glyphs.has(cp);
    asciiFonts.set(font, ok);
  }
  return ok;
}
/** The text with tabs and carriage returns as spaces and every character the font cannot draw as "?". */
export function printable(s: string, font: GlyphFont): string {
  let glyphs = glyphSets.get(font);
  if (!glyphs) glyphSets.set(font, (glyphs = new Set(font.getCharacterSet())));
  // Plain printable ASCII, the most of any log, is returned as it is when the font draws all of it.
  if (PRINTABLE_ASCII.test(s) && hasAscii(font, glyphs)) return s;
  const out: string[] = [];
  for (const ch of s) {
    const cp = ch.codePointAt(0)!;
    out.push(cp === 9 || cp === 13 ? " " : cp === 10 || glyphs.has(cp) ? ch : "?");
  }
  return out.join("");
}

/** Splits already printable text into lines no wider than `width` points at `size`. */
export function wrapText(text: string, size: number, font: MeasuringFont, width: number): string[] {
  const out: string[] = [];
  const space = charWidth(font, " ") * size;
  for (const para of text.split("\n")) {
    let line: string[] = []; // characters of the current line
    let lineW = 0;
    const flush = () => {
      out.push(line.join(""));
      line = [];
      lineW = 0;
    };
    for (const word of para.split(/ +/)) {
      const chars = Array.from(word); // code points: a surrogate pair is never split
      const ws = chars.map((c) => charWidth(font, c) * size);
      const wordW = ws.reduce((a, b) => a + b, 0);
      if (line.length) {
        if (lineW + space + wordW <= width && line.length + 1 + chars.length <= MAX_LINE_CHARS) {
          line.push(" ", ...chars);
          lineW += space + wordW;
          continue;
        }
        flush();
      }
      if (wordW <= width && chars.length <= MAX_LINE_CHARS) {
        line.push(...chars);
        lineW = wordW;
        continue;
      }
      // A word wider than the line: break it between characters, at least one character a line.
      for (let i = 0; i < chars.length; i++) {
        if (line.length && (lineW + ws[i] > width || line.length >= MAX_LINE_CHARS)) flush();
        line.push(chars[i]);
        lineW += ws[i];
      }
    }
    out.push(line.join(""));
  }
  return out;
}
