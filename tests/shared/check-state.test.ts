/** "Not checked" never reads as "passes": a linkage list's states and the overview's open-findings totals. Pure. */
import { describe, expect, it } from "vitest";
import { checkState, openFindingTotals, uncheckedText } from "@/shared/check-state";
import { analyze } from "@/shared/analysis";
import { demoPitchLinkage } from "@/shared/demo";
import { emptyGraph } from "@/shared/linkage/schema";

const zeros = { hazard: 0, caution: 0 };

describe("a linkage's check state", () => {
  it("an empty drawing is 'nothing drawn' even though its stored report counts no findings", () => {
    const report = analyze(emptyGraph("Empty", "pitch"));
    expect(report.summary.hazard + report.summary.caution).toBe(0); // why the summary alone cannot tell
    expect(checkState({ summary: report.summary, parts: 0 })).toBe("nothing-drawn");
    expect(checkState({ summary: null, parts: 0 })).toBe("nothing-drawn");
  });
  it("parts without a stored report are 'not checked'; with one, 'checked' whatever it counts", () => {
    expect(checkState({ summary: null, parts: 10 })).toBe("not-checked");
    expect(checkState({ summary: null, parts: null })).toBe("not-checked");
    expect(checkState({ summary: zeros, parts: 10 })).toBe("checked");
    expect(checkState({ summary: { hazard: 2, caution: 1 }, parts: 10 })).toBe("checked");
    const demo = demoPitchLinkage();
    expect(checkState({ summary: analyze(demo).summary, parts: demo.nodes.length })).toBe("checked");
  });
});

describe("the overview's open findings", () => {
  it("adds the checked linkages only and counts the others by reason", () => {
    const t = openFindingTotals([
      { summary: { hazard: 2, caution: 1 }, parts: 10 },
      { summary: { hazard: 1, caution: 0 }, parts: 13 },
      { summary: zeros, parts: 0 }, // an empty drawing: not a zero added to the count
      { summary: null, parts: 4 }, // saved without a report
      { summary: null, parts: 0 },
    ]);
    expect(t).toEqual({ hazard: 3, caution: 1, checked: 2, notChecked: 1, nothingDrawn: 2 });
    expect(uncheckedText(t)).toBe("1 linkage not checked yet and 2 with nothing drawn yet");
  });
  it("names what is left out in words, and nothing when every linkage was checked", () => {
    expect(uncheckedText({ notChecked: 0, nothingDrawn: 1 })).toBe("1 linkage with nothing drawn yet");
    expect(uncheckedText({ notChecked: 2, nothingDrawn: 0 })).toBe("2 linkages not checked yet");
    expect(uncheckedText(openFindingTotals([{ summary: zeros, parts: 3 }]))).toBe("");
    expect(openFindingTotals([])).toEqual({ hazard: 0, caution: 0, checked: 0, notChecked: 0, nothingDrawn: 0 });
  });
});
