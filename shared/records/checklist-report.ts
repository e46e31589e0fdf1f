/** Which report a revision's checklist is made from (server side: it may run the engine). */
import { analyze } from "../analysis";
import type { AnalysisSettings, Report } from "../analysis/types";
import type { LinkageGraph } from "../linkage/schema";

/**
 * The report a revision's checklist is made from, the same everywhere it is made (the page, the index, the tick
 * route, the PDF): the current revision's stored report — kept up to date with the build's settings when they
 * change (db/linkages.ts refreshCurrentAnalyses) — read, not computed again on every look; an older revision's, or
 * one with no stored report, computed with the build's settings.
 */
export function checklistReport(rev: { graph: LinkageGraph; analysis?: Report | null }, isCurrent: boolean, settings: Partial<AnalysisSettings> | undefined): Report {
  return isCurrent && rev.analysis ? rev.analysis : analyze(rev.graph, settings);
}
