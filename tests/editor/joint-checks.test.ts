/**
 * The joint's Checks header names the factors its checks used (editor/panels/JointChecks.tsx, from
 * shared/analysis/joints/factors.ts): the fitting factor where no higher factor applies — never called a
 * "bearing factor 1.15" — and the higher bearing factor, on bearing, where a part turns on the bolt.
 */
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { analyze } from "@/shared/analysis";
import { demoPitchLinkage } from "@/shared/demo";
import { createEditorStore } from "@/editor/store";
import { EditorStoreContext } from "@/editor/context";
import { JointChecks, jointFactorText } from "@/editor/panels/JointChecks";

function header(jointId: string) {
  const g = demoPitchLinkage();
  const s = createEditorStore(g, { analyze, analysisDelay: 0, now: () => 0 });
  const html = renderToStaticMarkup(createElement(EditorStoreContext.Provider, { value: { ...s, getInitialState: s.getState } }, createElement(JointChecks, { jointId })));
  const r = s.getState().report!.joints.find((j) => j.jointId === jointId)!;
  return { text: /data-testid="joint-factor"[^>]*>([^<]*)</.exec(html)?.[1], r };
}

describe("the Checks header's factor", () => {
  it("a joint where the fitting factor is the highest: called the fitting factor, on every check", () => {
    const { text, r } = header("j-aft-horn");
    expect(r.factor.name).toBe("fitting factor");
    expect(r.checks.every((c) => c.factor === r.factor.value)).toBe(true);
    expect(text).toBe("fitting factor ×1.15 on every check (no bearing factor above it applies here)");
    expect(text).not.toMatch(/bearing factor 1\.15/);
  });

  it("a plain bushing turning on its bolt: the bearing factor on bearing, the fitting factor on the rest", () => {
    const { text, r } = header("j-stick-pivot");
    expect(r.checks.filter((c) => c.factor === 3.33).every((c) => c.id.startsWith("bearing"))).toBe(true);
    expect(text).toBe("bearing factor (plain bearing, angular motion) ×3.33 on bearing; fitting factor ×1.15 on the other checks");
  });

  it("takes the build's own fitting factor", () => {
    expect(jointFactorText({ name: "hinge bearing factor", value: 6.67 }, 1.25)).toBe("hinge bearing factor ×6.67 on bearing; fitting factor ×1.25 on the other checks");
  });
});
