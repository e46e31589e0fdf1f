/** PDF line wrapping: every line fits, nothing is lost, and the work is linear in the text's length. */
import { readFileSync } from "node:fs";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import { PDFDocument, type PDFFont } from "pdf-lib";
import { beforeAll, describe, expect, it } from "vitest";
import { MAX_LINE_CHARS, printable, wrapText, type MeasuringFont } from "@/lib/pdf-wrap";

let font: PDFFont;
beforeAll(async () => {
  const pdf = await PDFDocument.create();
  pdf.registerFontkit(fontkit);
  font = await pdf.embedFont(readFileSync(path.join("node_modules", "dejavu-fonts-ttf", "ttf", "DejaVuSans.ttf")), { subset: true });
});

/** The real font, counting how many characters it is asked to measure in all. */
function counting(f: PDFFont) {
  const c = { chars: 0, font: null as unknown as MeasuringFont };
  c.font = { widthOfTextAtSize: (t: string, s: number) => ((c.chars += t.length), f.widthOfTextAtSize(t, s)) };
  return c;
}

describe("PDF wrap", () => {
  it("breaks one over-long word into lines that fit, measuring each character about once", () => {
    for (const n of [1_000, 20_000]) {
      const word = "x".repeat(n);
      const c = counting(font);
      const lines = wrapText(word, 10, c.font, 512);
      expect(lines.join("")).toBe(word);
      for (const l of lines) expect(font.widthOfTextAtSize(l, 10)).toBeLessThanOrEqual(512);
      expect(lines.length).toBeGreaterThan(1);
      // the quadratic/cubic wrapper measured millions of characters here
      expect(c.chars).toBeLessThan(10);
    }
  });

  it("wraps ordinary text at spaces and keeps paragraphs", () => {
    const text = "Safety wire the castellated nut and check the witness hole on both rod ends.\nSecond paragraph.";
    const lines = wrapText(text, 10, font, 150);
    for (const l of lines) expect(font.widthOfTextAtSize(l, 10)).toBeLessThanOrEqual(150);
    expect(lines.join(" ").replace(/ +/g, " ")).toBe(text.replace("\n", " "));
    expect(lines.at(-1)).toBe("Second paragraph.");
    expect(lines.every((l) => !l.startsWith(" ") && !l.endsWith(" "))).toBe(true);
  });

  it("measures a long text of many distinct words linearly", () => {
    const text = Array.from({ length: 5_000 }, (_, i) => `w${i}`).join(" ");
    const c = counting(font);
    const lines = wrapText(text, 9, c.font, 300);
    expect(lines.join(" ")).toBe(text);
    expect(c.chars).toBeLessThan(20); // one lookup per distinct character
  });

  it("bounds a line of zero-width marks and never splits a surrogate pair", () => {
    const marks = "\u0301".repeat(3 * MAX_LINE_CHARS);
    expect(wrapText(marks, 10, font, 500).every((l) => l.length <= MAX_LINE_CHARS)).toBe(true);
    const astral = "\u{1D400}".repeat(500); // a character outside the BMP
    const lines = wrapText(astral, 10, font, 100);
    expect(lines.join("")).toBe(astral);
    for (const l of lines) expect(l.length % 2).toBe(0);
  });

  it("printable replaces what the font cannot draw and keeps tabs as spaces", () => {
    expect(printable("a\tb\r\n↔ ±漢", font)).toBe("a b \n↔ ±?");
  });
});
