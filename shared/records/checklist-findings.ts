/**
 * The findings a checklist shows beside its items: the open hazards and cautions of the current revision's stored
 * check (a finding is open until it is fixed or acknowledged for this exact hardware, shared/review/hazards.ts), by
 * the key its items use (a joint's id, a cable-system part's id, "" for the whole linkage), and whether a list
 * may be called complete. Pure: the page reads the stored report and the acknowledgements on the server.
 */
import type { Finding, Severity, Subject } from "../analysis/types";
import { findingTitle } from "../analysis/finding-title";

/** An open hazard or caution, in a person's words (its title, never its code) with where it is. */
export type OpenFinding = { severity: Extract<Severity, "hazard" | "caution">; title: string; message: string; subject: Subject; where: string };

/**
 * What a checklist page knows of the current revision's check. `drawn` false: the revision has no parts, so there is
 * nothing to check; `checked` false: it was saved without a stored report.
 */
export type ChecklistFindings = { revision: number; drawn: boolean; checked: boolean; open: OpenFinding[]; acknowledged: number };

/** The open hazards and cautions of a revision's findings, hazards first (each finding as `findingStates` gives it). */
export function checklistFindings(
  revision: number,
  parts: number,
  findings: (Finding & { subjectName: string; acknowledgement: unknown })[] | null,
): ChecklistFindings {
  const drawn = parts > 0;
  if (!drawn || !findings) return { revision, drawn, checked: drawn && !!findings, open: [], acknowledged: 0 };
  const open: OpenFinding[] = [];
  let acknowledged = 0;
  for (const f of findings) {
    if (f.severity !== "hazard" && f.severity !== "caution") continue;
    if (f.acknowledgement) { acknowledged++; continue; }
    open.push({ severity: f.severity, title: findingTitle(f.code), message: f.message, subject: f.subject, where: f.subjectName });
  }
  open.sort((a, b) => (a.severity === b.severity ? 0 : a.severity === "hazard" ? -1 : 1));
  return { revision, drawn, checked: true, open, acknowledged };
}

/** The key of the checklist items a finding stands beside: its joint's or part's id, "" for the whole linkage. */
export const itemKeyOf = (s: Subject) => (s.type === "linkage" ? "" : s.id);

/** Open hazards by item key, each by its title (a key's items show "Open hazard on this joint: …"). */
export function hazardsByItem(f: ChecklistFindings): Map<string, string[]> {
  const by = new Map<string, string[]>();
  for (const o of f.open) {
    if (o.severity !== "hazard") continue;
    const k = itemKeyOf(o.subject);
    const list = by.get(k) ?? [];
    if (!list.includes(o.title)) list.push(o.title);
    by.set(k, list);
  }
  return by;
}

export type ChecklistStatus =
  | { complete: true }
  | { complete: false; why: "unticked" | "hazards" | "not-checked" | "nothing-drawn"; hazards: number };

/**
 * A list is complete only when something is drawn, every item is ticked, its revision's check is stored and no hazard
 * of it is open: ticks record what was inspected, they do not clear a hazard.
 */
export function checklistStatus(ticked: number, items: number, f: ChecklistFindings | null): ChecklistStatus {
  const hazards = f ? f.open.filter((o) => o.severity === "hazard").length : 0;
  if (f && !f.drawn) return { complete: false, why: "nothing-drawn", hazards };
  if (!f || !f.checked) return { complete: false, why: "not-checked", hazards };
  if (hazards > 0) return { complete: false, why: "hazards", hazards };
  if (ticked < items || items === 0) return { complete: false, why: "unticked", hazards };
  return { complete: true };
}

/** How far a checklist is ticked, said the same on the index and on the linkage's own list: "3 of 46 ticked". */
export const tickedWords = (done: number, total: number) => `${done} of ${total} ticked`;
