import "server-only";
import { parseBody, parseParams, json } from "./http";
import { csvRowsInvalid, duplicatePart, notFound } from "./errors";
import { createPart, deletePart, importParts, listParts, partNumbers, updatePart, type Library } from "@/db/parts";
import { partInput, partsImport } from "@/shared/schemas/parts";
import { uuidParam } from "@/shared/schemas/common";
import { parsePartsCsv, partsToCsv } from "@/shared/records/parts";
import { csvResponse } from "./records-http";

/** The same handlers serve a personal library (/api/parts) and a build's (/api/builds/[id]/parts). */
export const partsHandlers = {
  list: async (lib: Library) => json({ parts: await listParts(lib) }),

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
