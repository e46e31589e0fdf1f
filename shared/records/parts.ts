/**
 * Parts libraries: the spec of each part kind (US units: in, lbf — the engine's units), and the CSV
 * import/export format with a row-by-row error report. Pure: runs in the browser and on the server.
 */
import Papa from "papaparse";
import { z } from "zod";
import { AN_BOLTS, NUT_TYPES, THREADS, TUBE_MATERIALS } from "../linkage/schema";
import { boltMaterialOf } from "../hardware/bolts";
import { CAUTION_CSV_ROWS, isCautionRow } from "../caution";

export const PART_KINDS = ["rodEnd", "bolt", "nut", "washer", "tube", "bushing"] as const;
export type PartKind = (typeof PART_KINDS)[number];
export const PART_KIND_LABEL: Record<PartKind, string> = {
  rodEnd: "Rod end", bolt: "Bolt", nut: "Nut", washer: "Washer", tube: "Tube", bushing: "Bushing",
};

const inches = (what: string) =>
  z.number({ error: `${what} must be a number (in)` }).positive(`${what} must be greater than 0 in`).max(100, `${what} over 100 in is not a control part`);
const lbf = (what: string) =>
  z.number({ error: `${what} must be a number (lbf)` }).positive(`${what} must be greater than 0 lbf`).max(1_000_000, `${what} is out of range`);
const thread = z.enum(THREADS, { error: `thread must be one of ${THREADS.join(", ")}` });

export const rodEndSpec = z.object({
  thread,
  hand: z.enum(["RH", "LH"], { error: "hand must be RH or LH" }).default("RH"),
  shank: z.enum(["male", "female"], { error: "shank must be male or female" }).default("male"),
  ballBore: inches("ball bore"),
  ballDiameter: inches("ball diameter").optional(),
  housingBore: inches("housing bore").optional(),
  ratedUltimate: lbf("rated ultimate radial load"),
  ratedMisalignment: z.number({ error: "rated misalignment must be a number (°)" }).min(0).max(45).optional(),
  hasWitnessHole: z.boolean().default(true),
});
export const boltSpec = z.object({
  size: z.enum([...AN_BOLTS, "custom"], { error: `size must be one of ${AN_BOLTS.join(", ")} or custom` }),
  diameter: inches("diameter").optional(),
  grip: inches("grip").optional(),
  length: inches("length").optional(),
  // No default: unentered, an AN size is steel (AN bolts without DD are alloy steel, from memory) and a custom bolt is not rated.
  material: z.enum(["steel", "aluminium"], { error: "material must be steel or aluminium" }).optional(),
});
export const nutSpec = z.object({
  type: z.enum(NUT_TYPES.filter((t) => t !== "none") as [string, ...string[]], { error: `type must be one of ${NUT_TYPES.filter((t) => t !== "none").join(", ")}` }),
  thread,
  // No default: a nut recorded without its pattern would fill a joint with a pattern nobody chose.
  pattern: z.enum(["tension", "shear"], { error: "pattern must be tension or shear (a thin nut)" }),
});
export const washerSpec = z.object({
  insideDiameter: inches("inside diameter"),
  outsideDiameter: inches("outside diameter"),
  thickness: inches("thickness").optional(),
});
export const tubeSpec = z.object({
  material: z.enum(TUBE_MATERIALS, { error: `material must be one of ${TUBE_MATERIALS.join(", ")}` }),
  outsideDiameter: inches("outside diameter"),
  wall: inches("wall"),
});
export const bushingSpec = z.object({
  insideDiameter: inches("inside diameter"),
  outsideDiameter: inches("outside diameter"),
  length: inches("length").optional(),
  material: z.string().max(40).default(""),
});

export const SPEC_SCHEMAS = { rodEnd: rodEndSpec, bolt: boltSpec, nut: nutSpec, washer: washerSpec, tube: tubeSpec, bushing: bushingSpec } as const;
export type PartSpec<K extends PartKind = PartKind> = z.infer<(typeof SPEC_SCHEMAS)[K]>;

const partNumber = z.string({ error: "part number is required" }).trim().min(1, "part number is required").max(60, "part number is at most 60 characters")
  .regex(/^[A-Za-z0-9][A-Za-z0-9 ._\/#+-]*$/, "part number: letters, digits and . _ / # + - only");
const description = z.string().trim().max(200, "description is at most 200 characters").default("");

/** A part as the API takes it: kind, part number, description and the spec of that kind. */
export const partInput = z
  .object({
    kind: z.enum(PART_KINDS, { error: `kind must be one of ${PART_KINDS.join(", ")}` }),
    partNumber,
    description,
    spec: z.record(z.string(), z.unknown(), { error: "spec must be an object" }),
  })
  .transform((v, ctx) => {
    const r = SPEC_SCHEMAS[v.kind].safeParse(v.spec);
    if (!r.success) {
      for (const issue of r.error.issues) ctx.addIssue({ code: "custom", path: ["spec", ...issue.path.map(String)], message: issue.message });
      return z.NEVER;
    }
    return { ...v, spec: r.data } as PartInput;
  });
export type PartInput = { kind: PartKind; partNumber: string; description: string; spec: PartSpec };

export type Part = PartInput & { id: string; createdAt: string; updatedAt: string };

/** Which columns each kind reads, in the order they are written (spec field names = CSV headers). */
export const SPEC_COLUMNS: Record<PartKind, readonly string[]> = {
  rodEnd: ["thread", "hand", "shank", "ballBore", "ballDiameter", "housingBore", "ratedUltimate", "ratedMisalignment", "hasWitnessHole"],
  bolt: ["size", "diameter", "grip", "length", "material"],
  nut: ["type", "thread", "pattern"],
  washer: ["insideDiameter", "outsideDiameter", "thickness"],
  tube: ["material", "outsideDiameter", "wall"],
  bushing: ["insideDiameter", "outsideDiameter", "length", "material"],
};
const NUMERIC = new Set(["ballBore", "ballDiameter", "housingBore", "ratedUltimate", "ratedMisalignment", "diameter", "grip", "length", "insideDiameter", "outsideDiameter", "thickness", "wall"]);
const BOOLEAN = new Set(["hasWitnessHole"]);
export const CSV_COLUMNS: readonly string[] = ["kind", "partNumber", "description", ...new Set(Object.values(SPEC_COLUMNS).flat())];
/** Units of the numeric columns, for the header help. */
export const CSV_UNITS: Record<string, string> = {
  ballBore: "in", ballDiameter: "in", housingBore: "in", ratedUltimate: "lbf", ratedMisalignment: "°", diameter: "in", grip: "in",
  length: "in", insideDiameter: "in", outsideDiameter: "in", thickness: "in", wall: "in",
};

const norm = (h: string) => h.replace(/^\uFEFF/, "").trim().toLowerCase().replace(/[\s_\-]+/g, "");
const HEADER_BY_NORM = new Map(CSV_COLUMNS.map((c) => [norm(c), c]));
HEADER_BY_NORM.set("pn", "partNumber");
HEADER_BY_NORM.set("part", "partNumber");

export type RowError = { row: number; partNumber: string | null; errors: { column: string; message: string }[] };
export type CsvImport = { parts: (PartInput & { row: number })[]; errors: RowError[]; delimiter: string; rows: number };

const KIND_ALIASES: Record<string, PartKind> = {
  rodend: "rodEnd", rodends: "rodEnd", bolt: "bolt", nut: "nut", washer: "washer", tube: "tube", bushing: "bushing",
};

function parseNumber(raw: string, decimalComma: boolean): number | null {
  let s = raw.trim();
  if (decimalComma && /^-?\d+,\d+$/.test(s)) s = s.replace(",", ".");
  if (!/^-?(\d+\.?\d*|\.\d+)(e-?\d+)?$/i.test(s)) return null;
  const v = Number(s);
  return Number.isFinite(v) ? v : null;
}

/**
 * Reads a parts CSV: a header row naming columns (any case, spaces or underscores ignored), one part a row.
 * Accepts a UTF-8 byte-order mark, comma, semicolon or tab delimiters, quoted fields with delimiters
 * inside. `row` in the report is the row's line in the file (the header is row 1). `existing` holds part
 * numbers already in the library (lower case) so duplicates against it are reported too.
 */
/** A cell a spreadsheet would run as a formula, or one that already starts with the guard apostrophe before one. */
const FORMULA_OR_GUARDED = /^'*[=+\-@\t\r]/;

export function parsePartsCsv(text: string, existing: Iterable<string> = []): CsvImport {
  const clean = text.replace(/^\uFEFF/, "");
  const res = Papa.parse<string[]>(clean, {
    header: false,
    skipEmptyLines: false,
    delimitersToGuess: [",", ";", "\t", "|"],
    // Our export guards cells that a spreadsheet would run as a formula with one more leading apostrophe; take
    // that one off again. Any other apostrophe a builder typed ("'Tis the spare") is kept as it is.
    transform: (v) => (/^'+[=+\-@\t\r]/.test(v) ? v.slice(1) : v),
  });
  const delimiter = res.meta.delimiter || ",";
  const data = res.data as string[][];
  const errors: RowError[] = [];
  const parts: CsvImport["parts"] = [];
  if (data.length === 0 || data[0].every((c) => !c.trim())) {
    return { parts, errors: [{ row: 1, partNumber: null, errors: [{ column: "header", message: "the file is empty: the first row must name the columns (kind, partNumber, …)" }] }], delimiter, rows: 0 };
  }
  const header = data[0].map((h) => HEADER_BY_NORM.get(norm(h)) ?? null);
  const unknown = data[0].filter((h, i) => h.trim() && !header[i]);
  const headerErrors: RowError["errors"] = [];
  if (unknown.length) headerErrors.push({ column: "header", message: `unknown column${unknown.length > 1 ? "s" : ""}: ${unknown.map((u) => `"${u.trim()}"`).join(", ")}` });
  for (const need of ["kind", "partNumber"]) if (!header.includes(need)) headerErrors.push({ column: "header", message: `the header has no "${need}" column` });
  if (headerErrors.length) return { parts, errors: [{ row: 1, partNumber: null, errors: headerErrors }], delimiter, rows: 0 };

  const seen = new Map<string, number>();
  for (const pn of existing) seen.set(pn.toLowerCase(), 0);
  const decimalComma = delimiter === ";";
  let rows = 0;
  // Papa's row index is the record number; a record's line can differ only for quoted line breaks.
  for (let i = 1; i < data.length; i++) {
    const cells = data[i];
    if (cells.every((c) => !c.trim())) continue;
    if (isCautionRow(cells)) continue; // the caution our export ends with (shared/caution.ts)
    rows++;
    const rowNo = i + 1;
    const errs: RowError["errors"] = [];
    const rec: Record<string, string> = {};
    if (cells.length !== header.length) errs.push({ column: "row", message: `has ${cells.length} fields, the header has ${header.length} (a delimiter inside a value needs quotes)` });
    header.forEach((h, j) => { if (h && cells[j] !== undefined) rec[h] = cells[j].trim(); });
    const pnRaw = rec.partNumber ?? "";
    const kind = KIND_ALIASES[norm(rec.kind ?? "")];
    if (!kind) errs.push({ column: "kind", message: rec.kind ? `unknown kind "${rec.kind}" (use ${PART_KINDS.join(", ")})` : "kind is required" });
    const pnCheck = partNumber.safeParse(pnRaw);
    if (!pnCheck.success) errs.push({ column: "partNumber", message: pnCheck.error.issues[0].message });
    else {
      const prev = seen.get(pnCheck.data.toLowerCase());
      if (prev === 0) errs.push({ column: "partNumber", message: `"${pnCheck.data}" is already in this library` });
      else if (prev !== undefined) errs.push({ column: "partNumber", message: `"${pnCheck.data}" is a duplicate of row ${prev}` });
      else seen.set(pnCheck.data.toLowerCase(), rowNo);
    }
    if (kind) {
      const spec: Record<string, unknown> = {};
      for (const col of SPEC_COLUMNS[kind]) {
        const raw = rec[col];
        if (raw === undefined || raw === "") continue;
        if (NUMERIC.has(col)) {
          const v = parseNumber(raw, decimalComma);
          if (v === null) errs.push({ column: col, message: `"${raw}" is not a number${CSV_UNITS[col] ? ` (${CSV_UNITS[col]})` : ""}` });
          else spec[col] = v;
        } else if (BOOLEAN.has(col)) {
          const b = /^(y|yes|true|1)$/i.test(raw) ? true : /^(n|no|false|0)$/i.test(raw) ? false : null;
          if (b === null) errs.push({ column: col, message: `"${raw}" is not yes or no` });
          else spec[col] = b;
        } else spec[col] = raw;
      }
      const parsed = SPEC_SCHEMAS[kind].safeParse(spec);
      if (!parsed.success) {
        for (const issue of parsed.error.issues) {
          const col = String(issue.path[0] ?? "spec");
          if (errs.some((e) => e.column === col)) continue; // a bad number already said it
          const msg = spec[col] === undefined ? `${col} is required for a ${PART_KIND_LABEL[kind].toLowerCase()}`
            : col === "thread" ? `unknown thread "${rec.thread}" (use ${THREADS.join(", ")})`
            : issue.message;
          errs.push({ column: col, message: msg });
        }
      }
      if (!errs.length && parsed.success) parts.push({ row: rowNo, kind, partNumber: pnCheck.data!, description: (rec.description ?? "").slice(0, 200), spec: parsed.data as PartSpec });
    }
    if (errs.length) errors.push({ row: rowNo, partNumber: pnRaw || null, errors: errs });
  }
  return { parts, errors, delimiter, rows };
}

/** A library as CSV (comma-delimited, quoted where needed), ending with the caution line, which the import skips. */
export function partsToCsv(parts: PartInput[]): string {
  const rows = parts.map((p) => {
    const spec = p.spec as Record<string, unknown>;
    return CSV_COLUMNS.map((c) => {
      if (c === "kind") return p.kind;
      if (c === "partNumber") return p.partNumber;
      if (c === "description") return p.description;
      if (!SPEC_COLUMNS[p.kind].includes(c)) return "";
      const v = spec[c];
      return v === undefined || v === null ? "" : typeof v === "boolean" ? (v ? "yes" : "no") : String(v);
    });
  });
  // escapeFormulae: a description like "=HYPERLINK(…)" must not run when the file is opened in a spreadsheet, so a
  // leading apostrophe is added; a cell a builder began with an apostrophe before such a character ("'=5 turns")
  // gets one too, so the import (which takes one off) gives back exactly what was typed.
  return Papa.unparse({ fields: [...CSV_COLUMNS], data: rows }, { newline: "\r\n", escapeFormulae: FORMULA_OR_GUARDED }) + "\r\n" + CAUTION_CSV_ROWS;
}

/** One line a part, for tables and pickers. */
export function describeSpec(p: PartInput): string {
  const s = p.spec as Record<string, unknown>;
  switch (p.kind) {
    case "rodEnd": return `${s.thread} ${s.hand} ${s.shank}, bore ${s.ballBore} in, ${s.ratedUltimate} lbf ult.`;
    case "bolt": return `${s.size}${s.diameter ? ` Ø${s.diameter} in` : ""}${s.grip ? `, grip ${s.grip} in` : ""}, ${boltMaterialOf(s as { size: string; material?: "steel" | "aluminium" }) ?? "material not recorded"}`;
    case "nut": return `${s.type} ${s.thread} (${s.pattern})`;
    case "washer": return `ID ${s.insideDiameter} × OD ${s.outsideDiameter} in${s.thickness ? ` × ${s.thickness}` : ""}`;
    case "tube": return `${s.material} ${s.outsideDiameter} × ${s.wall} in`;
    case "bushing": return `ID ${s.insideDiameter} × OD ${s.outsideDiameter} in${s.material ? `, ${s.material}` : ""}`;
  }
}
