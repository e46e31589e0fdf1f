/**
 * What a screen reader hears on the canvas: a part's and a joint's accessible name, and the polite message
 * after an edit that says what changed in the findings. Names come from shared/linkage/names.ts only.
 */
import type { Finding, Severity } from "@/shared/analysis/types";
import type { Joint, LinkageNode } from "@/shared/linkage/schema";
import { KIND_NAMES } from "@/shared/linkage/kinds";
import { jointName, partName, type PartLookup } from "@/shared/linkage/names";
import { SEVERITY_WORDS, severityCount } from "./presentation";

export type BadgeLike = { worst: Severity; count: number } | undefined;
const SEV_WORD = SEVERITY_WORDS;
const ORDER: Severity[] = ["hazard", "caution", "advisory"];

const plural = severityCount;
/** "1 finding, worst a hazard" / "no findings". */
function findingsPhrase(b: BadgeLike): string {
  if (!b) return "no findings";
  return b.count === 1 ? `1 ${SEV_WORD[b.worst][0]}` : `${b.count} findings, worst a ${SEV_WORD[b.worst][0]}`;
}

/**
 * "Bellcrank, Bellcrank under the seat, 1 hazard" (the kind once when the part has no label of its own), and
 * ", 2 values to enter" when `toEnter` of its values are still the starting values it was placed with.
 * Without findings, `coverage` (nodes/coverage.ts, its `short`) says what that means, as for a joint:
 * "no findings, checked at its joints", "no findings, not checked".
 */
export function partAccessibleName(node: Pick<LinkageNode, "kind" | "label">, badge: BadgeLike, toEnter = 0, coverage?: string): string {
  const kind = (KIND_NAMES as Record<string, string>)[node.kind] ?? "Part";
  const name = partName(node);
  const enter = toEnter > 0 ? `, ${toEnter} ${toEnter === 1 ? "value" : "values"} to enter` : "";
  // "values to enter" is said by the count that follows.
  const what = !badge && coverage && coverage !== "no findings" && !(toEnter > 0 && coverage === "values to enter") ? `, ${coverage}` : "";
  return `${name === kind ? kind : `${kind}, ${name}`}, ${findingsPhrase(badge)}${what}${enter}`;
}

/**
 * "Joint Aft pushrod B ↔ Elevator horn, attach, 3 findings, worst a hazard". Without findings, `coverage`
 * (joints/coverage.ts, its `short`) says what that means: "no findings, not checked", "no findings, nothing to check".
 */
export function jointAccessibleName(joint: Pick<Joint, "from" | "to">, parts: PartLookup, badge: BadgeLike, coverage?: string): string {
  const what = !badge && coverage && coverage !== "no findings" ? `, ${coverage}` : "";
  return `Joint ${jointName(joint, parts)}, ${findingsPhrase(badge)}${what}`;
}

const key = (f: Finding) => `${f.code}|${f.subject.type}:${f.subject.id}`;
/** The first sentence of a finding's message: it names the part or joint and what is wrong. */
const firstSentence = (m: string) => {
  const i = m.search(/\.(\s|$)/);
  return i > 0 ? m.slice(0, i) : m;
};

/**
 * What changed between two runs of the live check, for a polite live region:
 * "2 hazards, 1 caution; new: The threaded rod end at joint … has no jam nut; cleared: 1". Null when nothing changed.
 */
export function findingsChange(before: readonly Finding[], after: readonly Finding[]): string | null {
  const was = new Set(before.map(key));
  const now = new Set(after.map(key));
  const added = after.filter((f) => !was.has(key(f)));
  const cleared = before.filter((f) => !now.has(key(f))).length;
  if (added.length === 0 && cleared === 0) return null;
  const counts = ORDER.map((s) => [s, after.filter((f) => f.severity === s).length] as const).filter(([, n]) => n > 0);
  const total = counts.length ? counts.map(([s, n]) => plural(n, s)).join(", ") : "no findings";
  const parts = [total];
  if (added.length) {
    const shown = added.slice(0, 3).map((f) => firstSentence(f.message));
    parts.push(`new: ${shown.join("; ")}${added.length > 3 ? `; and ${added.length - 3} more` : ""}`);
  }
  if (cleared) parts.push(`cleared: ${cleared}`);
  return parts.join("; ");
}
