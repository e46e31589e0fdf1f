/** Import and export of a linkage file (the same JSON document stored with every revision). */
import { graphSchema, type LinkageGraph } from "./schema";

export { serializeLinkage } from "./format";

export type LinkageFileError = { path: string; message: string };
export type ParseResult = { ok: true; graph: LinkageGraph } | { ok: false; errors: LinkageFileError[] };

/** A zod issue path as a readable string: nodes[2].props.gripArm ("" for the whole document). */
export function formatPath(path: readonly PropertyKey[]): string {
  let s = "";
  for (const p of path) s += typeof p === "number" ? `[${p}]` : s ? `.${String(p)}` : String(p);
  return s;
}

export function parseLinkageFile(text: string): ParseResult {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (e) {
    return { ok: false, errors: [{ path: "", message: `the file is not valid JSON (${(e as Error).message})` }] };
  }
  const r = graphSchema.safeParse(raw);
  if (r.success) return { ok: true, graph: r.data };
  return { ok: false, errors: r.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message })) };
}
