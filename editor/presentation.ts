/**
 * How the editor shows severities, sources and save states: one place for their words, colours and order.
 * (Part, port and joint names come from shared/linkage/names.ts.)
 */
import type { Severity, SourceTag } from "@/shared/analysis/types";
import { severityCount } from "@/shared/analysis/finding-title";

export const SEVERITY_NAMES: Record<Severity, string> = { hazard: "Hazard", caution: "Caution", advisory: "Advisory" };
export { SEVERITY_WORDS, severityCount } from "@/shared/analysis/finding-title";
const SEVERITY_RANK: Record<Severity, number> = { hazard: 3, caution: 2, advisory: 1 };
export const SEVERITY_BORDER: Record<Severity, string> = { hazard: "border-hazard", caution: "border-caution", advisory: "border-advisory" };
export const SEVERITY_BG: Record<Severity, string> = { hazard: "bg-hazard", caution: "bg-caution", advisory: "bg-advisory" };
export const SEVERITY_TEXT: Record<Severity, string> = { hazard: "text-hazard", caution: "text-caution", advisory: "text-advisory" };
/** For canvas drawing (joint lines, minimap, picture export), where a CSS class does not reach. */
export const SEVERITY_HEX: Record<Severity, string> = { hazard: "#b42318", caution: "#b54708", advisory: "#2e5aac" };
export const SOURCE_NAMES: Record<SourceTag["kind"], string> = { published: "published", commonPractice: "common practice", fromMemory: "recalled value, check it" };

/**
 * A run-list row's findings badge: each severity with its count, worst first ("2 hazards, 1 caution") — not
 * "3 · worst hazard", which read as three hazards.
 */
export function findingsBadgeText(findings: readonly { severity: Severity }[]): string {
  const order: Severity[] = ["hazard", "caution", "advisory"];
  return order
    .map((s) => [s, findings.filter((f) => f.severity === s).length] as const)
    .filter(([, n]) => n > 0)
    .map(([s, n]) => severityCount(n, s))
    .join(", ");
}

/**
 * A margin of safety as the editor shows it everywhere (the summary strip, a joint's checks): signed, so a
 * positive margin reads "+0.10" and a negative one "-0.25"; two decimals below 10, whole numbers above.
 */
export function marginText(ms: number): string {
  const digits = Math.abs(ms) >= 10 ? 0 : 2;
  const t = ms.toFixed(digits);
  return ms >= 0 ? `+${t}` : t;
}

/** The worse of two severities (hazard > caution > advisory). */
export function worse(a: Severity | undefined, b: Severity): Severity {
  return !a || SEVERITY_RANK[b] > SEVERITY_RANK[a] ? b : a;
}

export type SaveStatus = "saved" | "saving" | "unsaved" | "offline" | "conflict" | "error" | "readonly";
export const SAVE_STATUS_TEXT: Record<SaveStatus, string> = {
  saved: "All changes saved",
  saving: "Saving…",
  unsaved: "Unsaved changes",
  offline: "Offline — will retry",
  conflict: "Someone else saved",
  error: "Not saved",
  readonly: "Read-only",
};
export const SAVE_STATUS_TONE: Record<SaveStatus, string> = {
  saved: "bg-ok/10 text-ok",
  saving: "bg-advisory/10 text-advisory",
  unsaved: "bg-caution/10 text-caution",
  offline: "bg-caution/15 text-caution",
  conflict: "bg-hazard/10 text-hazard",
  error: "bg-hazard/10 text-hazard",
  readonly: "bg-ink/5 text-ink-soft",
};
