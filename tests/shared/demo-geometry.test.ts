// Geometry for generated runs (the engine bench sweeps it): every crank on the path is placed, whatever else shares its ports.
import { describe, expect, it } from "vitest";
import { generateLinkage } from "@/shared/demo";
import { chainGeometry } from "@/shared/demo-geometry";
import { DEFAULT_SETTINGS, sweepGraph } from "@/shared/analysis";

describe("geometry of a generated run", () => {
  it("places the stick, every bellcrank and the horn, though a travel stop shares the stick's attach port", () => {
    const g = generateLinkage(60);
    expect(g.joints.some((j) => j.to.node === "stick" && j.to.port === "attach" && j.from.node === "stop")).toBe(true);
    const geo = chainGeometry(g);
    const cranks = g.nodes.filter((n) => n.kind === "bellcrank" || n.kind === "idlerArm" || n.kind === "torqueTube");
    expect(cranks.length).toBeGreaterThan(10);
    for (const c of cranks) expect(geo.parts[c.id], c.id).toBeDefined();
    expect(geo.parts.stick).toBeDefined();
    const sweep = sweepGraph({ ...g, geometry: geo }, DEFAULT_SETTINGS, 50);
    expect(sweep.report.checked).toBe(true);
    expect(sweep.sweeps[0].chain.stages.length).toBe(cranks.length + 1);
  });
});
