/** Parts libraries (a user's own, a build's): one part, a CSV import, and the parts as the API lists them. */
import { z } from "zod";
import { PART_KINDS, partInput, type Part } from "../records/parts";
import { isoTime, pageFields } from "./common";

export { partInput };
export const partPatch = partInput; // a part is replaced whole: its spec depends on its kind

export const partsImport = z.object({
  csv: z.string({ error: "csv is required (the file's text)" }).min(1, "the file is empty").max(2_000_000, "a parts file is at most 2 MB"),
  skipBadRows: z.boolean().default(false),
  /** Check only: report what would be imported, import nothing. */
  dryRun: z.boolean().default(false),
});

export const part = z.object({
  id: z.string(),
  kind: z.enum(PART_KINDS),
  partNumber: z.string(),
  description: z.string(),
  spec: z.custom<Part["spec"]>((v) => !!v && typeof v === "object"),
  createdAt: isoTime,
  updatedAt: isoTime,
});
export type { Part };
/** A page of a library, newest first. */
export const partsResponse = z.object({ parts: z.array(part), ...pageFields });
