/** The summary of a report: counts by severity and the lowest margin, with where it is. */
import type { CableResult, Finding, JointResult, PushrodResult, Summary } from "./types";
import { MARGIN_CAP } from "./allowables";

export function summarize(findings: Finding[], pushrods: PushrodResult[], joints: JointResult[], cables: CableResult[] = []): Summary {
  const s: Summary = { hazard: 0, caution: 0, advisory: 0, lowestMargin: null };
  for (const f of findings) s[f.severity]++;
  let low = MARGIN_CAP;
  let best: Summary["lowestMargin"] = null;
  const consider = (value: number | null, type: "node" | "joint", id: string, what: string) => {
    if (value === null || !(value < low)) return;
    low = value;
    best = { value, subject: { type, id }, what };
  };
  for (const p of pushrods) {
    if (p.limitAxial <= 0) continue;
    consider(p.marginCompression, "node", p.nodeId, `compression, ${p.columnMode === "euler" ? "Euler" : "Johnson"} column`);
    consider(p.marginTension, "node", p.nodeId, "tension, tube section (end fittings not checked)");
  }
  for (const j of joints) {
    if (j.radialLimit <= 0) continue;
    // Every computed check of the joint (its governing one is the lowest); a check not made has no margin.
    if (j.governing) consider(j.governing.margin, "joint", j.jointId, j.governing.label);
  }
  for (const c of cables) if (c.limitTension > 0) consider(c.margin, "node", c.nodeId, "cable breaking strength");
  s.lowestMargin = best;
  return s;
}

const ORDER = { hazard: 0, caution: 1, advisory: 2 } as const;
/** Worst first; stable within a severity (the order the checks found them). */
export function sortFindings(findings: Finding[]): Finding[] {
  return findings
    .map((f, i) => [f, i] as const)
    .sort((x, y) => ORDER[x[0].severity] - ORDER[y[0].severity] || x[1] - y[1])
    .map((x) => x[0]);
}
