/** Parts CSV import: the row-by-row report on awkward files. Pure (shared/records/parts.ts). */
import { describe, expect, it } from "vitest";
import { parsePartsCsv, partsToCsv } from "@/shared/records/parts";
import { hardwareToCsv } from "@/shared/records/hardware-csv";
import { CAUTION_CSV_CELL, CAUTION_TEXT, isCautionRow } from "@/shared/caution";

// Ratings and sizes below are invented test values, not data of any real part. // common practice, no source
const HEADER = "kind,partNumber,description,thread,hand,ballBore,ratedUltimate";

describe("parts CSV import", () => {
  it("reads a clean file with a BOM, quoted commas and mixed-case headers", () => {
    const csv = "\uFEFFKind,Part Number,Description,Thread,Hand,Ball_Bore,Rated Ultimate\r\n" +
      'rodEnd,TST-1,"Rod end, male, 1/4-28",1/4-28,RH,0.25,4200\r\n' +
      'rodEnd,TST-2,"Rod end, ""LH"" thread",1/4-28,LH,0.25,4200\r\n\r\n';
    const r = parsePartsCsv(csv);
    expect(r.errors).toEqual([]);
    expect(r.delimiter).toBe(",");
    expect(r.parts.map((p) => [p.row, p.partNumber, p.description])).toEqual([
      [2, "TST-1", "Rod end, male, 1/4-28"],
      [3, "TST-2", 'Rod end, "LH" thread'],
    ]);
    expect(r.parts[0].spec).toMatchObject({ thread: "1/4-28", hand: "RH", ballBore: 0.25, ratedUltimate: 4200, shank: "male", hasWitnessHole: true });
  });

  it("reads semicolon files, with a decimal comma", () => {
    const csv = "kind;partNumber;thread;hand;ballBore;ratedUltimate\nrodEnd;TST-3;5/16-24;RH;0,3125;5800\nwasher;W-1;;;;\n";
    const r = parsePartsCsv(csv.replace("washer;W-1;;;;", "bolt;B-1;;;;"));
    expect(r.delimiter).toBe(";");
    expect(r.parts[0].spec).toMatchObject({ ballBore: 0.3125, ratedUltimate: 5800 });
    // a bolt without its size is reported, naming the column
    expect(r.errors).toEqual([{ row: 3, partNumber: "B-1", errors: [{ column: "size", message: "size is required for a bolt" }] }]);
  });

  it("reports bad numbers, unknown threads, unknown kinds and duplicates with their rows", () => {
    const csv = [
      HEADER,
      "rodEnd,A-1,,1/4-28,RH,0.25,4200",
      "rodEnd,A-2,,1/4-28,RH,quarter,42OO",
      "rodEnd,A-3,,M6x1,RH,0.25,4200",
      "rodEnd,A-1,,1/4-28,RH,0.25,4200",
      "sprocket,A-4,,,,,",
      "rodEnd,A-5,,1/4-28,RH,0.25,4200,extra",
      "rodEnd,OLD-9,,1/4-28,RH,0.25,4200",
    ].join("\n");
    const r = parsePartsCsv(csv, ["old-9"]);
    expect(r.parts.map((p) => p.partNumber)).toEqual(["A-1"]);
    expect(r.errors).toEqual([
      { row: 3, partNumber: "A-2", errors: [{ column: "ballBore", message: '"quarter" is not a number (in)' }, { column: "ratedUltimate", message: '"42OO" is not a number (lbf)' }] },
      { row: 4, partNumber: "A-3", errors: [{ column: "thread", message: 'unknown thread "M6x1" (use 10-32, 1/4-28, 5/16-24, 3/8-24, 7/16-20, 1/2-20)' }] },
      { row: 5, partNumber: "A-1", errors: [{ column: "partNumber", message: '"A-1" is a duplicate of row 2' }] },
      { row: 6, partNumber: "A-4", errors: [{ column: "kind", message: 'unknown kind "sprocket" (use rodEnd, bolt, nut, washer, tube, bushing)' }] },
      { row: 7, partNumber: "A-5", errors: [{ column: "row", message: "has 8 fields, the header has 7 (a delimiter inside a value needs quotes)" }] },
      { row: 8, partNumber: "OLD-9", errors: [{ column: "partNumber", message: '"OLD-9" is already in this library' }] },
    ]);
  });

  it("refuses a file without the needed columns", () => {
    expect(parsePartsCsv("name,colour\nx,1\n").errors).toEqual([
      { row: 1, partNumber: null, errors: [{ column: "header", message: 'unknown columns: "name", "colour"' }, { column: "header", message: 'the header has no "kind" column' }, { column: "header", message: 'the header has no "partNumber" column' }] },
    ]);
    // "size" is a real column (bolts): the unknown-column message only names the unknown one
    expect(parsePartsCsv("kind,partNumber,colour\n").errors[0].errors).toEqual([{ column: "header", message: 'unknown column: "colour"' }]);
  });

  it("exports what it imports", () => {
    const csv = [HEADER, 'rodEnd,R-1,"a, b",3/8-24,LH,0.375,8800'].join("\n");
    const a = parsePartsCsv(csv).parts;
    const b = parsePartsCsv(partsToCsv(a)).parts;
    expect(b.map(({ row, ...p }) => p)).toEqual(a.map(({ row, ...p }) => p));
  });

  it("guards cells a spreadsheet would run as formulas, and reads them back unchanged", () => {
    const csv = [HEADER, 'rodEnd,R-2,"=HYPERLINK(""http://x.invalid"",""open"")",3/8-24,RH,0.375,8800', "rodEnd,R-3,@SUM(A1),3/8-24,RH,0.375,8800"].join("\n");
    const a = parsePartsCsv(csv).parts;
    expect(a.map((p) => p.description)).toEqual(['=HYPERLINK("http://x.invalid","open")', "@SUM(A1)"]);
    const out = partsToCsv(a);
    expect(out).toContain(`"'=HYPERLINK(`);
    expect(out).toContain("'@SUM(A1)");
    expect(out.split("\r\n").some((line) => /(^|,)"?[=@]/.test(line))).toBe(false);
    expect(parsePartsCsv(out).parts.map((p) => p.description)).toEqual(a.map((p) => p.description));
  });

  it("keeps a leading apostrophe a builder typed, through export and import, and still guards formulas", () => {
    const typed = ["'Tis the spare from the kit", "'=5 turns of thread showing", "''@ both ends", "plain"];
    const csv = [HEADER, ...typed.map((d, i) => `rodEnd,A-${i},"${d}",3/8-24,RH,0.375,8800`)].join("\n");
    const a = parsePartsCsv(csv).parts;
    // Read from a file a person wrote, an apostrophe before "=" is the spreadsheet guard and comes off once;
    // any other stays.
    expect(a.map((p) => p.description)).toEqual(["'Tis the spare from the kit", "=5 turns of thread showing", "'@ both ends", "plain"]);
    const round = (descs: string[]) => {
      const parts = a.map((p, i) => ({ ...p, description: descs[i] }));
      const out = partsToCsv(parts);
      expect(out.split("\r\n").some((line) => /(^|,)"?[=+@-]/.test(line))).toBe(false); // nothing runs as a formula
      return parsePartsCsv(out).parts.map((p) => p.description);
    };
    expect(round(typed)).toEqual(typed); // what was typed comes back exactly, apostrophes and all
  });
});

describe("a library nut's pattern", () => {
  // A nut filled into a joint from the library carries its pattern to the torque check: none is assumed.
  it("is required: a nut without it is refused with what to enter, and accepted with it", async () => {
    const { partInput } = await import("@/shared/records/parts");
    const nut = (spec: Record<string, unknown>) => partInput.safeParse({ kind: "nut", partNumber: "N-1", description: "", spec: { type: "selfLockingMetal", thread: "1/4-28", ...spec } });
    const r = nut({});
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.message)).toContain("pattern must be tension or shear (a thin nut)");
    expect(nut({ pattern: "shear" }).success).toBe(true);
  });
});

describe("the caution in the CSV exports (shared/caution.ts: every PDF and CSV export carries it)", () => {
  // Invented test values, not data of any real part.
  const library = () => parsePartsCsv([HEADER, 'rodEnd,R-1,"a, b",3/8-24,LH,0.375,8800', "rodEnd,R-2,plain,1/4-28,RH,0.25,4200"].join("\n")).parts.map(({ row, ...p }) => p);

  it("the parts library CSV ends with the caution, after an empty row", () => {
    const out = partsToCsv(library());
    expect(out.endsWith(`\r\n\r\n"${CAUTION_CSV_CELL}"\r\n`)).toBe(true);
  });

  it("an exported library imports back unchanged: the caution line is skipped, not reported", () => {
    const a = library();
    const back = parsePartsCsv(partsToCsv(a));
    expect(back.errors).toEqual([]);
    expect(back.rows).toBe(a.length);
    expect(back.parts.map(({ row, ...p }) => p)).toEqual(a);
    // and again, through a spreadsheet that saved it with semicolons
    const semi = partsToCsv(a).replace(/,(?=(?:[^"]*"[^"]*")*[^"]*$)/gm, ";");
    expect(parsePartsCsv(semi).errors).toEqual([]);
  });

  it("a line that only starts like the caution, or has other cells, is still read as a part row", () => {
    expect(isCautionRow(["Caution. keep clear", "", ""])).toBe(true);
    expect(isCautionRow(["Caution. keep clear", "x"])).toBe(false);
    expect(isCautionRow(["rodEnd", "Caution. x"])).toBe(false);
  });

  it("the hardware list CSV ends with the caution, after an empty row", () => {
    const out = hardwareToCsv([{ kind: "bolt", description: "Bolt AN3-5A", partNumber: "AN3-5A", quantity: 2, state: "to_order", usedIn: [{ linkageId: "l", linkageName: "Pitch run", jointId: "j", where: "Stick ↔ Pushrod" }] }]);
    expect(out).toBe(`kind,description,partNumber,quantity,state,usedIn\r\nbolt,Bolt AN3-5A,AN3-5A,2,To order,Pitch run: Stick ↔ Pushrod\r\n\r\n"${CAUTION_CSV_CELL}"\r\n`);
    expect(CAUTION_CSV_CELL).toBe(`Caution. ${CAUTION_TEXT}`);
  });
});
