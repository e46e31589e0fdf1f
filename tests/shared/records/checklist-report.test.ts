/** The report a checklist is made from (shared/records/checklist-report.ts): stored for the current revision, computed otherwise. */
import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import { demoPitchLinkage } from "@/shared/demo";
import { checklistReport } from "@/shared/records/checklist-report";
import { checklistFor } from "@/shared/records/checklist";

describe("checklistReport", () => {
  const graph = demoPitchLinkage();
  const stored = analyze(graph);
  it("the current revision's stored report is read, not computed again", () => {
    expect(checklistReport({ graph, analysis: stored }, true, undefined)).toBe(stored);
  });
  it("an older revision, or one with nothing stored, is computed with the build's settings", () => {
    const older = checklistReport({ graph, analysis: stored }, false, { fittingFactor: 1.5 });
    expect(older).not.toBe(stored);
    expect(older.settings.fittingFactor).toBe(1.5);
    expect(checklistReport({ graph, analysis: null }, true, undefined)).not.toBe(stored);
  });
  it("the stored and the computed report of the same revision and settings give the same items", () => {
    expect(checklistFor(graph, checklistReport({ graph, analysis: stored }, true, undefined))).toEqual(checklistFor(graph, analyze(graph)));
  });
});
