/**
 * Engine benchmark: analyze() on generated linkages of 60, 1,000 and 10,000 parts. Reports the median time
 * per analysis and its ratio to JSON.parse of the same graph's JSON (what loading the file costs anyway).
 * Targets (issue 3): 60 parts < 1 ms; 10,000 parts < 2 × JSON.parse; growth linear.
 * `npm run bench` runs it under the server's Node flags (scripts/next-start.mjs: a 32 MB semi-space), as the
 * engine runs in the server; the figures with Node's defaults are in the README beside them.
 */
import { analyze, analyzeMotion, DEFAULT_SETTINGS, sweepGraph } from "../../shared/analysis";
import { buildContext } from "../../shared/analysis/context";
import { fanInLinkage, generateLinkage } from "../../shared/demo";
import { GRAPH_LIMITS } from "../../shared/linkage/schema";
import { chainGeometry } from "../../shared/demo-geometry";

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Median ms per call of fn, timing batches so that tiny calls are measured above timer resolution. */
function time(fn: () => unknown, targetMs = 400): number {
  let batch = 1;
  for (;;) {
    const t0 = performance.now();
    for (let i = 0; i < batch; i++) fn();
    const dt = performance.now() - t0;
    if (dt > 5) break;
    batch *= 2;
  }
  const samples: number[] = [];
  const end = performance.now() + targetMs;
  while (samples.length < 7 || (performance.now() < end && samples.length < 200)) {
    const t0 = performance.now();
    for (let i = 0; i < batch; i++) fn();
    samples.push((performance.now() - t0) / batch);
  }
  return median(samples);
}

export type EngineBenchRow = { graph: string; parts: number; joints: number; jsonKB: number; analyzeMs: number; parseMs: number; ratio: number; usPerPart: number };

export async function run(): Promise<{ ok: boolean; rows: EngineBenchRow[] }> {
  const rows: EngineBenchRow[] = [];
  const graphs: [string, ReturnType<typeof generateLinkage>][] = [60, 1000, 10000].map((n) => [`chain ${n}`, generateLinkage(n)]);
  // Fan-in (issue 16): as many sticks as a linkage may have, all on one pushrod, alone and at the head of
  // the longest chain a linkage may hold. Each input walks the run once, so these are the worst cases.
  graphs.push([`fan-in ${GRAPH_LIMITS.inputs}`, fanInLinkage(GRAPH_LIMITS.inputs)]);
  graphs.push([`fan-in ${GRAPH_LIMITS.inputs} + chain`, fanInLinkage(GRAPH_LIMITS.inputs, GRAPH_LIMITS.parts)]);
  for (const [name, g] of graphs) {
    const n = g.nodes.length;
    const json = JSON.stringify(g);
    for (let i = 0; i < 20; i++) analyze(g); // warm up
    const analyzeMs = time(() => analyze(g));
    const parseMs = time(() => JSON.parse(json));
    rows.push({ graph: name, parts: n, joints: g.joints.length, jsonKB: Math.round(json.length / 1024), analyzeMs, parseMs, ratio: analyzeMs / parseMs, usPerPart: (analyzeMs * 1000) / n });
  }
  console.log("engine: analyze() on generated linkages (median per call)");
  console.table(rows.map((r) => ({
    graph: r.graph, parts: r.parts, joints: r.joints, "JSON KB": r.jsonKB, "analyze ms": r.analyzeMs.toFixed(3), "JSON.parse ms": r.parseMs.toFixed(3),
    "analyze / parse": r.ratio.toFixed(2), "µs per part": r.usPerPart.toFixed(2),
  })));
  const small = rows[0], big = rows[2], mid = rows[1];
  // Linear growth: the engine is single-pass (adjacency maps, no quadratic loops), but on one machine the
  // time per part of anything that walks a large heap graph rises once it leaves the caches — JSON.parse of
  // the same data shows it too. So growth is judged against JSON.parse: the analyze/parse ratio may not
  // grow by 2 × or more from 1,000 to 10,000 parts. The raw per-part growth is printed as well.
  const rawGrowth = big.usPerPart / mid.usPerPart;
  const parseGrowth = big.parseMs / big.parts / (mid.parseMs / mid.parts);
  const growth = big.ratio / mid.ratio;
  // Motion (issue 14): a 60-part single-path run with geometry swept in 1,000 steps; and what the motion
  // check adds to a run without geometry (it returns at once), against that run's whole analysis.
  const g60 = generateLinkage(60);
  const geo60 = { ...g60, geometry: chainGeometry(g60) };
  for (let i = 0; i < 5; i++) sweepGraph(geo60, DEFAULT_SETTINGS, 1000);
  const sweepMs = time(() => sweepGraph(geo60, DEFAULT_SETTINGS, 1000));
  const stages = sweepGraph(geo60, DEFAULT_SETTINGS, 1000).sweeps[0]?.chain.stages.length ?? 0;
  const withGeoMs = time(() => analyze(geo60));
  const ctx60 = buildContext(g60);
  const noGeoMotionMs = time(() => analyzeMotion(ctx60, DEFAULT_SETTINGS));
  console.log(`motion: 60-part run, ${stages} four-bars: 1,000-step sweep ${sweepMs.toFixed(2)} ms; analyze() with geometry (default steps) ${withGeoMs.toFixed(2)} ms; ` +
    `without geometry the motion check costs ${(noGeoMotionMs * 1000).toFixed(3)} µs of the ${(small.analyzeMs * 1000).toFixed(1)} µs analysis`);
  const checks = [
    [`60 parts under 1 ms`, small.analyzeMs < 1, `${small.analyzeMs.toFixed(3)} ms`],
    [`1,000-step sweep of a 60-part run with geometry under 20 ms`, stages > 10 && sweepMs < 20, `${sweepMs.toFixed(2)} ms (${stages} four-bars)`],
    [`a run without geometry costs what it did (motion check under 1 % of its analysis)`, noGeoMotionMs < small.analyzeMs * 0.01, `${((noGeoMotionMs / small.analyzeMs) * 100).toFixed(3)} %`],
    [`10,000 parts under 2 × JSON.parse`, big.ratio < 2, `${big.ratio.toFixed(2)} ×`],
    [`fan-in of ${GRAPH_LIMITS.inputs} sticks under 5 × JSON.parse (each stick walks the run)`, rows[3].ratio < 5, `${rows[3].ratio.toFixed(2)} ×`],
    [`${GRAPH_LIMITS.inputs} sticks on a ${rows[4].parts}-part chain under 8 × JSON.parse`, rows[4].ratio < 8, `${rows[4].ratio.toFixed(2)} ×`],
    [`linear growth (analyze/parse ratio 1,000 → 10,000 parts grows < 2 ×)`, growth < 2,
      `${growth.toFixed(2)} × (raw µs per part ${rawGrowth.toFixed(2)} ×, JSON.parse per part ${parseGrowth.toFixed(2)} ×)`],
  ] as const;
  for (const [what, pass, fig] of checks) console.log(`${pass ? "PASS" : "MISS"}  ${what}: ${fig}`);
  return { ok: checks.every((c) => c[1]), rows };
}
