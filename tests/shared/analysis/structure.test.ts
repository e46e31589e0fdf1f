/** Structure findings (domain.md §2): each with a graph that trips it and one that does not; never a throw. */
import { describe, expect, it } from "vitest";
import { analyze } from "@/shared/analysis";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { GOOD_HINGE_LOAD, goodBallPivot, goodRodEndJoint, goodRun, hardware, j, mount, pushrod, valid } from "./fixtures";

const codes = (g: LinkageGraph) => analyze(valid(g)).findings.map((f) => `${f.code}@${f.subject.id}`);

it("the base run has no structure findings", () => {
  expect(codes(goodRun())).toEqual([]);
});

describe("input that reaches no surface", () => {
  it("trips when the horn–surface joint is removed (the surface, still hinged, is then not driven)", () => {
    const g = goodRun();
    g.joints = g.joints.filter((x) => x.id !== "horn");
    const c = codes(g);
    expect(c).toContain("input-reaches-no-surface@stick");
    expect(c).toContain("part-not-driven@elev");
  });
});

describe("parts nothing drives: not checked, never a margin from a zero load", () => {
  it("with the stick's rod end removed, the pushrod and the joints past it read 'not checked' with what to do", () => {
    const g = goodRun();
    g.joints = g.joints.filter((x) => x.id !== "rodA");
    const r = analyze(valid(g));
    const rod = r.pushrods.find((p) => p.nodeId === "rod")!;
    expect(rod.driven).toBe(false);
    expect(rod.marginCompression).toBeNull();
    expect(rod.marginTension).toBeNull();
    expect(rod.todo).toMatch(/no stick, pedal or wheel drives it/);
    const rodB = r.joints.find((x) => x.jointId === "rodB")!;
    expect(rodB.checks.length).toBeGreaterThan(0);
    expect(rodB.checks.every((c) => c.status === "notChecked" && c.margin === null)).toBe(true);
    // Said once per part (part-not-driven), not once more per joint.
    expect(codes(g)).toContain("part-not-driven@rod");
    expect(codes(g).filter((c) => c.startsWith("joint-checks-not-made"))).toEqual([]);
  });
  it("in the whole run every pushrod and joint has its margins", () => {
    const r = analyze(valid(goodRun()));
    expect(r.pushrods.every((p) => p.driven && p.marginCompression !== null && p.todo === null)).toBe(true);
    expect(r.joints.every((x) => x.checks.every((c) => c.status === "computed"))).toBe(true);
  });
});

describe("pushrod without two ends", () => {
  it("trips when one end is not joined", () => {
    const g = goodRun();
    g.joints = g.joints.filter((x) => x.id !== "rodB");
    expect(codes(g)).toContain("pushrod-end-open@rod");
  });
  it("does not trip when both ends are joined", () => expect(codes(goodRun()).filter((c) => c.startsWith("pushrod-end-open"))).toEqual([]));
});

describe("a joint from a part to itself", () => {
  // The schema refuses it (shared/linkage/schema.ts); the engine still meets it in a graph that skipped the schema.
  it("trips for a pushrod joined end to end to itself, left out of the check, and the run is still checked", () => {
    const g = goodRun();
    g.joints.push(j("self", ["rod", "a"], ["rod", "b"], goodRodEndJoint({}, { hand: "RH" })));
    const r = analyze(g);
    expect(r.findings.map((f) => `${f.code}@${f.subject.id}`)).toContain("joint-to-itself@self");
    expect(r.findings.find((f) => f.code === "joint-to-itself")!.severity).toBe("caution");
    expect(r.pushrods.find((p) => p.nodeId === "rod")!.limitAxial).toBeCloseTo(668, 9); // 167 lbf (14 CFR 23.397(b)) × 20/5
  });
  it("does not trip for joints between two parts", () => expect(codes(goodRun()).filter((c) => c.startsWith("joint-to-itself"))).toEqual([]));
});

describe("crank or stick without a pivot to a structure mount", () => {
  it("trips with no pivot joint", () => {
    const g = goodRun();
    g.joints = g.joints.filter((x) => x.id !== "pivot");
    expect(codes(g)).toContain("pivot-unmounted@stick");
  });
  it("trips when the pivot goes to something other than a mount", () => {
    const g = goodRun();
    g.nodes.push(pushrod("stray", "4130N", 1, 0.049, 10)); // fixture tube, size irrelevant here
    g.joints = g.joints.map((x) => (x.id === "pivot" ? j("pivot", ["stick", "pivot"], ["stray", "a"], goodBallPivot()) : x));
    expect(codes(g)).toContain("pivot-unmounted@stick");
  });
});

describe("loops", () => {
  it("trips on a second pushrod closing a loop between stick and horn", () => {
    const g = goodRun();
    g.nodes.push(pushrod("rod2", "4130N", 1, 0.049, 24)); // same fixture tube as goodRun
    g.joints.push(j("r2a", ["stick", "attach"], ["rod2", "a"], goodRodEndJoint({}, { hand: "RH" })));
    g.joints.push(j("r2b", ["rod2", "b"], ["hornpart", "attach"], goodRodEndJoint({}, { hand: "LH" })));
    const c = codes(g);
    expect(c.filter((x) => x.startsWith("linkage-loop"))).toHaveLength(1);
    // The analysis still ends and still loads both pushrods: 167 × 20/5 = 668 lbf each (full force on each path)
    const r = analyze(valid(g));
    expect(r.pushrods.map((p) => Math.round(p.limitAxial))).toEqual([668, 668]); // 14 CFR 23.397(b) 167 lbf × 20/5
  });
  it("does not count several parts pivoting on one shared structure mount as a loop", () => {
    const g = goodRun();
    g.joints = g.joints.map((x) => (x.id === "hinge" ? j("hinge", ["elev", "hinge"], ["m1", "mount"], goodBallPivot({ hingeLoad: GOOD_HINGE_LOAD })) : x));
    g.nodes = g.nodes.filter((n) => n.id !== "m2");
    expect(codes(g)).toEqual([]);
  });
});

describe("joint without hardware; disconnected parts; no input", () => {
  it("trips on an empty joint card", () => {
    const g = goodRun();
    g.joints = g.joints.map((x) => (x.id === "horn" ? { ...x, hardware: hardware() } : x));
    expect(codes(g)).toEqual(["joint-hardware-missing@horn"]);
  });
  it("trips on a part joined to nothing", () => {
    const g = goodRun();
    g.nodes.push(mount("loose"));
    expect(codes(g)).toEqual(["part-unconnected@loose"]);
  });
  it("trips when the drawing has no input", () => {
    const g = goodRun();
    g.nodes = g.nodes.filter((n) => n.id !== "stick");
    g.joints = g.joints.filter((x) => x.from.node !== "stick" && x.to.node !== "stick");
    expect(codes(g)).toContain("no-input@fixture");
  });
  it("an empty drawing has no findings and no results", () => {
    const r = analyze(valid({ formatVersion: 1, name: "", system: "other", nodes: [], joints: [] }));
    expect(r.findings).toEqual([]);
    expect(r.summary.lowestMargin).toBeNull();
  });
});

describe("graphs that skipped the schema", () => {
  it("reports a joint to a missing node instead of throwing", () => {
    const g = goodRun();
    g.joints.push(j("ghost", ["rod", "a"], ["nobody", "x"], hardware()));
    const r = analyze(g);
    expect(r.findings.map((f) => f.code)).toContain("joint-end-missing");
  });
  it("reports an unknown port", () => {
    const g = goodRun();
    g.joints = g.joints.map((x) => (x.id === "horn" ? { ...x, to: { node: "elev", port: "tab" } } : x));
    expect(analyze(g).findings.map((f) => f.code)).toContain("joint-port-unknown");
  });
});
