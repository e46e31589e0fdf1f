/**
 * Issue 16: the check's work stays linear in parts + joints. Each input walks the run once (so inputs are
 * capped by the schema), and a walk handles every port's joint list once however many joints share it.
 */
import { describe, expect, it } from "vitest";
import { analyze } from "../../../shared/analysis";
import { fanInLinkage, generateLinkage } from "../../../shared/demo";
import { GRAPH_LIMITS, graphSchema, type LinkageGraph } from "../../../shared/linkage/schema";

/**
 * CPU time of one call (this process's user + system time, not the wall clock: on a busy machine a long
 * call waits for the CPU more often than a short one, which would make any growth look worse than it is).
 * The call is repeated `reps` times per sample, so a small input is timed over as long as a big one; the
 * least of several samples is kept.
 */
function cpuMs(fn: () => unknown, reps = 1, samples = 5): number {
  for (let i = 0; i < 3; i++) fn(); // warm up (the JIT)
  let best = Infinity;
  for (let i = 0; i < samples; i++) {
    const t0 = process.cpuUsage();
    for (let r = 0; r < reps; r++) fn();
    const d = process.cpuUsage(t0);
    best = Math.min(best, (d.user + d.system) / 1000 / reps);
  }
  return best;
}

/** `k` parallel joints from one pushrod's `b` end to a bellcrank's `in` arm, after a 60-part chain. */
function parallelJoints(k: number): LinkageGraph {
  const g = generateLinkage(60);
  const first = g.joints.find((j) => j.to.node === "b0" && j.to.port === "in")!;
  for (let i = 0; i < k; i++) g.joints.push({ ...first, id: `par${i}` });
  return g;
}

describe("graph limits (schema)", () => {
  it(`accepts ${GRAPH_LIMITS.inputs} sticks and refuses one more, naming the limit`, () => {
    expect(graphSchema.safeParse(fanInLinkage(GRAPH_LIMITS.inputs)).success).toBe(true);
    const r = graphSchema.safeParse(fanInLinkage(GRAPH_LIMITS.inputs + 1));
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.message).join()).toContain(`at most ${GRAPH_LIMITS.inputs} sticks, pedals and wheels (this one has ${GRAPH_LIMITS.inputs + 1})`);
  });
  it("accepts 10,000 parts and refuses 10,001", () => {
    expect(graphSchema.safeParse(generateLinkage(GRAPH_LIMITS.parts)).success).toBe(true);
    const r = graphSchema.safeParse(generateLinkage(GRAPH_LIMITS.parts + 1));
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].message).toBe("a linkage holds at most 10,000 parts");
  });
  it("refuses more than 20,000 joints", () => {
    const r = graphSchema.safeParse(parallelJoints(GRAPH_LIMITS.joints));
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].message).toBe("a linkage holds at most 20,000 joints");
  });
});

describe("loads with fan-in", () => {
  it("sticks side by side on one pushrod load it as one stick does (each input alone governs)", () => {
    const one = analyze(fanInLinkage(1));
    const many = analyze(fanInLinkage(GRAPH_LIMITS.inputs));
    expect(many.pushrods.find((p) => p.nodeId === "p0")!.limitAxial).toBeCloseTo(one.pushrods.find((p) => p.nodeId === "p0")!.limitAxial, 9);
    // Every stick's attach joint carries its own link force; another stick's pivot reacts it too.
    const attach = many.joints.filter((j) => j.jointId.startsWith("fan-ja"));
    expect(attach).toHaveLength(GRAPH_LIMITS.inputs - 1);
    const g1 = fanInLinkage(1);
    const id = g1.joints.find((j) => j.from.node === "stick" && j.to.node === "p0")!.id;
    const first = one.joints.find((j) => j.jointId === id)!;
    for (const j of attach) expect(j.radialLimit).toBeCloseTo(first.radialLimit, 9);
  });
  it("parallel joints on one port are each loaded like the single one", () => {
    const g = parallelJoints(50);
    const r = analyze(g);
    const id = g.joints.find((j) => j.to.node === "b0" && j.to.port === "in")!.id;
    const base = r.joints.find((j) => j.jointId === id)!.radialLimit;
    expect(base).toBeGreaterThan(0);
    for (const j of r.joints.filter((x) => x.jointId.startsWith("par"))) expect(j.radialLimit).toBeCloseTo(base, 9);
  });
});

describe("work grows linearly (CPU time)", () => {
  // 16 × the input: linear work takes 16 × as long, quadratic 256 ×. The bound sits far from both, for a
  // busy machine and the garbage collector. (Before the fix 8,000 parallel joints took minutes.)
  it("16 × the parallel joints on one port takes under 64 × the time", () => {
    const small = parallelJoints(500), big = parallelJoints(8000);
    const ratio = cpuMs(() => analyze(big)) / cpuMs(() => analyze(small), 16);
    expect(ratio, `CPU time ratio ${ratio.toFixed(1)}`).toBeLessThan(64);
  }, 60_000);
  it(`${GRAPH_LIMITS.inputs} sticks on a 16 × longer chain take under 64 × the time`, () => {
    const small = fanInLinkage(GRAPH_LIMITS.inputs, 500), big = fanInLinkage(GRAPH_LIMITS.inputs, 8000);
    const ratio = cpuMs(() => analyze(big)) / cpuMs(() => analyze(small), 16);
    expect(ratio, `CPU time ratio ${ratio.toFixed(1)}`).toBeLessThan(64);
  }, 60_000);
});
