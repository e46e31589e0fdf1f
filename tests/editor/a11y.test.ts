/** What a screen reader hears on the canvas (editor/a11y.ts): names from the one naming function, never ids. */
import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import { DEMO_WRONG_JOINT, demoPitchLinkage } from "@/shared/demo";
import { findingsChange, jointAccessibleName, partAccessibleName } from "@/editor/a11y";

describe("accessible names", () => {
  it("a part is its kind, its label and its findings", () => {
    expect(partAccessibleName({ kind: "bellcrank", label: "Bellcrank under the seat" }, { worst: "hazard", count: 1 })).toBe("Bellcrank, Bellcrank under the seat, 1 hazard");
    expect(partAccessibleName({ kind: "bellcrank", label: "" }, undefined)).toBe("Bellcrank, no findings");
    expect(partAccessibleName({ kind: "pushrod", label: "Aft pushrod" }, { worst: "caution", count: 3 })).toBe("Pushrod, Aft pushrod, 3 findings, worst a caution");
  });

  it("a joint is its two ends, never an id", () => {
    const g = demoPitchLinkage();
    const j = g.joints.find((x) => x.id === DEMO_WRONG_JOINT)!;
    const name = jointAccessibleName(j, g.nodes, { worst: "hazard", count: 3 });
    expect(name).toBe("Joint Aft pushrod B ↔ Elevator horn, attach, 3 findings, worst a hazard");
    expect(name).not.toContain(j.id);
  });
});

describe("findingsChange", () => {
  const g = demoPitchLinkage();
  const before = analyze(g).findings;

  it("says nothing when the findings did not change", () => {
    expect(findingsChange(before, analyze(g).findings)).toBeNull();
  });

  it("gives the new totals and names what is new and how many cleared", () => {
    // Fit and tighten the jam nut at the faulty joint: the jam-nut hazard clears.
    const fixed = structuredClone(g);
    const j = fixed.joints.find((x) => x.id === DEMO_WRONG_JOINT)!;
    j.hardware.jamNut = { fitted: true, tightened: true };
    const after = analyze(fixed).findings;
    const msg = findingsChange(before, after)!;
    expect(msg).toMatch(/cleared: 1/);
    expect(msg).not.toMatch(/new:/);
    // and back: the hazard is new again, named by its joint
    const back = findingsChange(after, before)!;
    expect(back).toMatch(/^\d+ hazards?/);
    expect(back).toContain("new: The threaded rod end at joint Aft pushrod B ↔ Elevator horn, attach has no jam nut");
    expect(back).not.toContain(DEMO_WRONG_JOINT);
  });

  it("names at most three new findings and says how many more", () => {
    const many = Array.from({ length: 5 }, (_, i) => ({ ...before[0], code: `c${i}`, message: `Finding ${i}. More.` }));
    expect(findingsChange([], many)).toMatch(/new: Finding 0; Finding 1; Finding 2; and 2 more$/);
  });
});
