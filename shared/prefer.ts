/**
 * The Prefer header (RFC 7240) that asks a save for the short answer (see shared/schemas/graph.ts graphSaved).
 * Its own module, without zod: the editor's first script imports it.
 */
export const PREFER_MINIMAL = "return=minimal";

/** Whether a Prefer header (comma-separated preferences, each maybe with parameters after `;`) asks for return=minimal. */
export function prefersMinimal(prefer: string | null): boolean {
  return !!prefer && prefer.split(",").some((p) => p.split(";")[0].replace(/\s+/g, "").toLowerCase() === PREFER_MINIMAL);
}
