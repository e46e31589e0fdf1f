import { describe, expect, it } from "vitest";
import { analyze } from "../../shared/analysis";
import { DEMO_WRONG_JOINT, demoPitchLinkage, generateLinkage } from "../../shared/demo";
import { graphSchema } from "../../shared/linkage/schema";

describe("demo: Larkspur LX-2 pitch run", () => {
  const g = demoPitchLinkage();
  const r = analyze(g);

  it("is a valid linkage file and the schema leaves it unchanged", () => {
    const p = graphSchema.safeParse(g);
    expect(p.success).toBe(true);
    expect(p.data).toEqual(g);
  });
  it("is stick → forward pushrod → bellcrank → aft pushrod → horn → elevator, laid out left to right", () => {
    const main = g.nodes.filter((n) => n.kind !== "structureMount" && n.kind !== "travelStop");
    expect(main.map((n) => n.kind)).toEqual(["stick", "pushrod", "bellcrank", "pushrod", "controlHorn", "controlSurface"]);
    expect(main.map((n) => n.position.x)).toEqual([0, 220, 440, 660, 880, 1100]);
  });
  it("shows exactly the deliberate mistakes on the one wrong joint: no jam nut, washer smaller than the housing", () => {
    const hazards = r.findings.filter((f) => f.severity === "hazard");
    expect(hazards.map((f) => f.code).sort()).toEqual(["jam-nut-missing", "retaining-washer-small"]);
    expect(new Set(r.findings.map((f) => f.subject.id))).toEqual(new Set([DEMO_WRONG_JOINT]));
    // The wrong joint is single shear (that is why its washer matters), which domain.md §3 always flags as a caution.
    expect(r.findings.filter((f) => f.severity !== "hazard").map((f) => f.code)).toEqual(["rod-end-single-shear"]);
  });
  it("has no structural findings", () => {
    const structural = ["input-reaches-no-surface", "pushrod-end-open", "pivot-unmounted", "linkage-loop", "joint-hardware-missing", "part-unconnected", "part-not-driven", "no-input"];
    expect(r.findings.filter((f) => structural.includes(f.code))).toEqual([]);
  });
  it("the washer finding carries its numbers: 0.438 in washer on a 0.500 in housing bore", () => {
    const f = r.findings.find((x) => x.code === "retaining-washer-small")!;
    expect(f.numbers).toEqual([
      { label: "washer outside diameter", value: 0.438, unit: "in" }, // invented demo washer (AN960-size), no source
      { label: "housing bore", value: 0.5, unit: "in" }, // invented demo rod end, no source
    ]);
    expect(f.source.kind).toBe("commonPractice");
  });
  it("every margin is positive (the mistakes are retention, not strength)", () => {
    // 167 lbf (14 CFR 23.397(b)) × 20/6 = 556.7 lbf forward; × 3/4 = 417.5 lbf aft
    expect(r.pushrods.map((p) => Math.round(p.limitAxial * 10) / 10)).toEqual([556.7, 417.5]); // 167·20/6 and ·3/4 (statics, from memory)
    expect(r.summary.lowestMargin!.value).toBeGreaterThan(0);
  });
});

describe("generateLinkage", () => {
  it.each([7, 8, 9, 60, 61, 62, 1000, 2503])("makes exactly %s valid parts with no findings", (n) => {
    const g = generateLinkage(n);
    expect(g.nodes).toHaveLength(n);
    expect(graphSchema.safeParse(g).success).toBe(true);
    const r = analyze(g);
    expect(r.findings).toEqual([]);
    expect(r.pushrods.every((p) => p.driven && p.limitAxial > 0)).toBe(true);
  });
  it("branches into a tree for larger counts (more than one surface)", () => {
    const g = generateLinkage(1000);
    expect(g.nodes.filter((n) => n.kind === "controlSurface").length).toBeGreaterThan(1);
  });
});

describe("demo: Larkspur LX-2 yaw cable run", async () => {
  const { demoRudderLinkage, DEMO_RUDDER_FAULT_PART } = await import("../../shared/demo-rudder");
  const g = demoRudderLinkage();
  const r = analyze(g);

  it("is a valid linkage file, pedals → cables over a pulley and through a fairlead → turnbuckles → rudder horn", () => {
    const p = graphSchema.safeParse(g);
    expect(p.success).toBe(true);
    expect(p.data).toEqual(g);
    const kinds = new Set(g.nodes.map((n) => n.kind));
    for (const k of ["cablePedal", "cable", "pulley", "fairlead", "turnbuckle", "controlHorn", "controlSurface", "travelStop"]) expect(kinds.has(k as never), k).toBe(true);
  });
  it("shows exactly the one fault a reviewer would catch: the right turnbuckle with five threads showing (AC 43.13-1B: at most three)", () => {
    expect(r.findings.map((f) => [f.severity, f.code, f.subject.id])).toEqual([["hazard", "turnbuckle-threads-showing", DEMO_RUDDER_FAULT_PART]]);
  });
  it("is one closed circuit, not a loop, with every cable checked against its breaking strength", () => {
    expect(r.cables.every((c) => c.inCircuit)).toBe(true);
    expect(r.summary.lowestMargin?.what).toBeDefined();
  });
});
