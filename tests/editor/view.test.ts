import { describe, expect, it } from "vitest";
import { fitZoom, focusZoom, OPEN_MARGIN, openingViewport, READABLE_ZOOM, readDeepLink } from "@/editor/view";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";

const graph = demoPitchLinkage();

describe("deep links", () => {
  it("?select= takes a joint id or a part id", () => {
    expect(readDeepLink("?select=j-stick-fwd", graph)).toEqual({ subject: { type: "joint", id: "j-stick-fwd" } });
    expect(readDeepLink("?select=bellcrank", graph)).toEqual({ subject: { type: "node", id: "bellcrank" } });
    expect(readDeepLink(`?select=${encodeURIComponent(DEMO_WRONG_JOINT)}&x=1`, graph)).toEqual({ subject: { type: "joint", id: DEMO_WRONG_JOINT } });
  });
  it("?focus=joint:<id> / node:<id> from review e-mail; focus wins over select", () => {
    expect(readDeepLink("?focus=joint:j-aft-horn", graph)).toEqual({ subject: { type: "joint", id: "j-aft-horn" } });
    expect(readDeepLink("?focus=node%3Ahorn", graph)).toEqual({ subject: { type: "node", id: "horn" } });
    expect(readDeepLink("?select=stick&focus=node:horn", graph)).toEqual({ subject: { type: "node", id: "horn" } });
    expect(readDeepLink("?focus=linkage:abc", graph)).toBeNull();
  });
  it("names what is missing, and ignores a URL without either", () => {
    expect(readDeepLink("?focus=joint:horn", graph)).toEqual({ missing: "joint horn" });
    expect(readDeepLink("?select=gone", graph)).toEqual({ missing: "gone" });
    expect(readDeepLink("", graph)).toBeNull();
    expect(readDeepLink("?tab=review", graph)).toBeNull();
  });
});

describe("the opening view", () => {
  // The demo run: nine 148 × ~50 px cards from x 0 to 1248, y 200 to ~430.
  const demo = { x: 0, y: 200, width: 1248, height: 232 };

  it("a run that fits readably is fitted with padding 0.15 and centred", () => {
    const v = openingViewport(demo, 1600, 800);
    expect(v.zoom).toBeCloseTo(fitZoom(demo, 1600, 800), 6);
    expect(v.zoom).toBeGreaterThanOrEqual(READABLE_ZOOM);
    expect(v.x + (demo.x + demo.width / 2) * v.zoom).toBeCloseTo(800, 6);
  });

  it("at 1440 × 900 (canvas ~890 px) labels stay readable: the run opens at its start, not shrunk", () => {
    expect(fitZoom(demo, 890, 780)).toBeLessThan(READABLE_ZOOM);
    const v = openingViewport(demo, 890, 780);
    expect(v.zoom).toBe(READABLE_ZOOM);
    expect(v.x + demo.x * v.zoom).toBeCloseTo(OPEN_MARGIN, 6); // the stick's edge at the left margin
    expect(v.y + (demo.y + demo.height / 2) * v.zoom).toBeCloseTo(390, 6); // centred vertically: it fits that way
  });

  it("a small linkage is not blown up past 1.25×; a deep link never zooms out", () => {
    expect(openingViewport({ x: 0, y: 0, width: 148, height: 50 }, 900, 700).zoom).toBe(1.25);
    expect(focusZoom(0.8)).toBe(1);
    expect(focusZoom(1.2)).toBe(1.2);
  });
});
