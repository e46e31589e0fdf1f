/**
 * Words and numbers the editor shows in more than one place (editor/presentation.ts): the run list's findings
 * badge says each severity with its count ("2 hazards, 1 caution", not "3 · worst hazard", read as three
 * hazards), and a margin is signed alike in the summary strip and a joint's checks ("+0.10").
 */
import { beforeAll, describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { ReactFlowProvider } from "@xyflow/react";
import { analyze } from "@/shared/analysis";
import { DEFAULT_SETTINGS } from "@/shared/analysis/types";
import { DEMO_WRONG_JOINT, demoPitchLinkage } from "@/shared/demo";
import { findingsBadgeText, marginText } from "@/editor/presentation";
import { createEditorStore } from "@/editor/store";
import { EditorConfigContext, EditorStoreContext } from "@/editor/context";
import { loadSchema } from "@/editor/store/schema";
import { RunList } from "@/editor/panels/RunList";
import { SummaryStrip } from "@/editor/panels/Findings";
import { JointChecks } from "@/editor/panels/JointChecks";

beforeAll(() => loadSchema());

const f = (...s: ("hazard" | "caution" | "advisory")[]) => s.map((severity) => ({ severity }));

describe("findingsBadgeText", () => {
  it("names each severity with its own count, worst first", () => {
    expect(findingsBadgeText(f("caution", "hazard", "hazard"))).toBe("2 hazards, 1 caution");
    expect(findingsBadgeText(f("hazard"))).toBe("1 hazard");
    expect(findingsBadgeText(f("advisory", "advisory", "caution"))).toBe("1 caution, 2 advisories");
    expect(findingsBadgeText(f("caution", "caution", "caution"))).not.toMatch(/worst/);
  });
});

describe("marginText", () => {
  it("signs every margin", () => {
    expect(marginText(0.1)).toBe("+0.10");
    expect(marginText(0)).toBe("+0.00");
    expect(marginText(-0.25)).toBe("-0.25");
    expect(marginText(12.4)).toBe("+12");
    expect(marginText(-12.4)).toBe("-12");
  });
});

describe("where they are shown", () => {
  function store() {
    const g = demoPitchLinkage();
    const s = createEditorStore(g, { analyze, analysisDelay: 0, now: () => 0 });
    return { ...s, getInitialState: s.getState };
  }
  const wrap = (s: ReturnType<typeof store>, child: React.ReactElement) =>
    renderToStaticMarkup(
      createElement(EditorConfigContext.Provider, { value: { unitSystem: "US", readOnly: false } },
        createElement(EditorStoreContext.Provider, { value: s }, createElement(ReactFlowProvider, null, child))),
    );

  it("the run list's badge of a joint with hazards and a caution", () => {
    const s = store();
    const list = s.getState().findingsBySubject[`joint:${DEMO_WRONG_JOINT}`];
    const want = findingsBadgeText(list);
    expect(list.length).toBeGreaterThan(1);
    const html = wrap(s, createElement(RunList, { onOpen: () => {} }));
    const m = new RegExp(`data-run-item="joint:${DEMO_WRONG_JOINT}"[\\s\\S]*?data-findings-badge="true">([^<]*)<`).exec(html);
    expect(m?.[1]).toBe(want);
    expect(html).not.toMatch(/· worst/);
  });

  it("the summary strip's lowest margin is signed as the joint's checks show it", () => {
    const s = store();
    const lm = s.getState().report!.summary.lowestMargin!;
    expect(lm.value).toBeGreaterThanOrEqual(0);
    const strip = wrap(s, createElement(SummaryStrip, { system: "pitch", settings: DEFAULT_SETTINGS }));
    expect(strip).toContain(`>${marginText(lm.value)} at `);
    expect(lm.subject.type).toBe("joint"); // the demo's lowest margin is at a joint
    const checks = wrap(s, createElement(JointChecks, { jointId: lm.subject.id }));
    expect(checks).toContain(`>${marginText(lm.value)}<`);
  });
});
