/**
 * The Prefer header (RFC 7240) that asks a save for the short answer (see shared/schemas/graph.ts graphSaved).
 * Its own module, without zod: the editor's first script imports it.
 */
export const PREFER_MINIMAL = "return=minimal";

/**
 * Whether a Prefer header asks for return=minimal (RFC 7240 §2: comma-separated preferences, each a token with
 * an optional value, maybe quoted, then parameters after `;`; where a preference is given twice, the first counts).
 */
export function prefersMinimal(prefer: string | null): boolean {
  if (!prefer) return false;
  for (const p of prefer.split(",")) {
    const [name, ...value] = p.split(";")[0].split("=");
    if (name.trim().toLowerCase() !== "return") continue;
    return value.join("=").trim().replace(/^"(.*)"$/, "$1").toLowerCase() === "minimal";
  }
  return false;
}
