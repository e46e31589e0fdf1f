import "server-only";
import { parseBody, parseParams, json } from "./http";
import type { NextRequest } from "next/server";
import { z } from "zod";
import { csvRowsInvalid, duplicatePart, invalid, notFound } from "./errors";
import { pageBody, readPage } from "./paging";
import { createPart, deletePart, importParts, listParts, pageParts, partNumbers, PART_KEYS, updatePart, type Library } from "@/db/parts";
import { partInput, partsImport } from "@/shared/schemas/parts";
import { uuidParam } from "@/shared/schemas/common";
import { PART_KINDS, parsePartsCsv, partsToCsv } from "@/shared/records/parts";
import { csvResponse } from "./records-http";

const partFilter = z.object({
  q: z.string().max(200).refine((s) => !s.includes("\u0000"), "must not contain NUL characters").optional(),
  kind: z.enum(PART_KINDS, { error: `kind is one of ${PART_KINDS.join(", ")}` }).optional(),
});

/** The same handlers serve a personal library (/api/parts) and a build's (/api/builds/[id]/parts). */
export const partsHandlers = {
  /** A page of the library, newest first (`?q=&kind=&cursor=&limit=`), and how many parts match. */
  list: async (lib: Library, req: NextRequest) => {
    const sp = req.nextUrl.searchParams;
    const f = partFilter.safeParse({ q: sp.get("q") || undefined, kind: sp.get("kind") || undefined });
    if (!f.success) throw invalid(f.error, "The filter is not valid.");
    const p = await pageParts(lib, f.data, readPage(req, PART_KEYS));
    return json(pageBody("parts", p, p.total));
  },

  create: async (lib: Library, req: Request) => {
    const p = await parseBody(req, partInput);
    const part = await createPart(lib, p);
    if (part === "duplicate") throw duplicatePart(`Part number ${p.partNumber} is already in this library.`, { partNumber: "already in this library" });
    return json({ part }, 201);
  },

  update: async (lib: Library, req: Request, rawId: string) => {
    const id = parseParams(rawId, uuidParam);
    const p = await parseBody(req, partInput);
    const part = await updatePart(lib, id, p);
    if (part === "duplicate") throw duplicatePart(`Part number ${p.partNumber} is already in this library.`, { partNumber: "already in this library" });
    if (!part) throw notFound("part");
    return json({ part });
  },

  remove: async (lib: Library, rawId: string) => {
    const id = parseParams(rawId, uuidParam);
    if (!(await deletePart(lib, id))) throw notFound("part");
    return json({ deleted: true });
  },

  /**
   * CSV import: every row checked, a row-by-row report. Nothing is imported while any row fails,
   * unless `skipBadRows` (then the good rows are); `dryRun` only reports.
   */
  importCsv: async (lib: Library, req: Request) => {
    const { csv, skipBadRows, dryRun } = await parseBody(req, partsImport);
    const report = parsePartsCsv(csv, await partNumbers(lib));
    const base = { rows: report.rows, delimiter: report.delimiter, errors: report.errors, valid: report.parts.length };
    if (dryRun) return json({ ...base, imported: 0, dryRun: true });
    if (report.errors.length && !skipBadRows) {
      throw csvRowsInvalid(`${report.errors.length} row${report.errors.length > 1 ? "s have" : " has"} errors; nothing was imported. Fix them, or choose to skip bad rows.`, { ...base, imported: 0 });
    }
    const n = await importParts(lib, report.parts);
    if (n === "duplicate") throw duplicatePart("Another import added some of these part numbers just now; nothing was imported.");
    return json({ ...base, imported: n, skipped: report.errors.length }, 201);
  },

  exportCsv: async (lib: Library, filename: string) => csvResponse(partsToCsv(await listParts(lib)), filename),
};
