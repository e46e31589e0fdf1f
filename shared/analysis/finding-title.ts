import type { Severity } from "./types";

/**
 * A finding's short name for people ("Jam nut missing"), from its code ("jam-nut-missing"). Codes are our own
 * kebab-case words chosen to read as a name, so the title is the code in words; the code itself stays in data
 * attributes and the machine fields of exports.
 */
export function findingTitle(code: string): string {
  const words = code.replace(/-/g, " ").trim();
  return words ? words.charAt(0).toUpperCase() + words.slice(1) : "Finding";
}

/** The lower-case word for one finding of a severity and for several. */
export const SEVERITY_WORDS: Record<Severity, readonly [one: string, many: string]> = { hazard: ["hazard", "hazards"], caution: ["caution", "cautions"], advisory: ["advisory", "advisories"] };
/** "1 hazard", "2 hazards", "0 advisories". */
/** "1 check", "3 checks": a count with its noun in the right number. */
export function counted(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

export function severityCount(n: number, s: Severity): string {
  return `${n} ${SEVERITY_WORDS[s][n === 1 ? 0 : 1]}`;
}
