/**
 * Whether a linkage's current revision has been checked, read from what a linkage list carries (its stored
 * findings summary and its part count). "Not checked" never reads as "passes": an empty drawing's report counts
 * no findings, and a revision saved without a report has no summary at all; neither is a linkage with nothing open.
 */
export type CheckState = "nothing-drawn" | "not-checked" | "checked";

type Counted = { summary: { hazard: number; caution: number } | null; parts: number | null };

export function checkState(l: Counted): CheckState {
  if (l.parts === 0) return "nothing-drawn";
  if (!l.summary) return "not-checked";
  return "checked";
}

/** The words of a state that is not a check's result (the lists show them in a neutral tone). */
export const CHECK_STATE_TEXT: Record<Exclude<CheckState, "checked">, string> = {
  "nothing-drawn": "nothing drawn yet",
  "not-checked": "not checked yet",
};

/** A build's open findings over its checked linkages, and how many linkages those counts leave out (and why). */
export function openFindingTotals(linkages: Counted[]) {
  const t = { hazard: 0, caution: 0, checked: 0, notChecked: 0, nothingDrawn: 0 };
  for (const l of linkages) {
    const s = checkState(l);
    if (s === "nothing-drawn") t.nothingDrawn++;
    else if (s === "not-checked") t.notChecked++;
    else {
      t.checked++;
      t.hazard += l.summary!.hazard;
      t.caution += l.summary!.caution;
    }
  }
  return t;
}

/** "1 linkage not checked yet and 2 with nothing drawn yet", or "" when every linkage was checked. */
export function uncheckedText(t: { notChecked: number; nothingDrawn: number }) {
  const parts: string[] = [];
  if (t.notChecked) parts.push(`${t.notChecked} linkage${t.notChecked === 1 ? "" : "s"} not checked yet`);
  if (t.nothingDrawn) parts.push(`${t.nothingDrawn}${t.notChecked ? "" : ` linkage${t.nothingDrawn === 1 ? "" : "s"}`} with nothing drawn yet`);
  return parts.join(" and ");
}

/** The words of a linkage whose counts are not a check's result, or null when they are (checked). */
export function notCheckedWords(l: Counted): string | null {
  const s = checkState(l);
  return s === "checked" ? null : CHECK_STATE_TEXT[s];
}
