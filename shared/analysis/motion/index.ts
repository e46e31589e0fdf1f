/**
 * The motion check (domain.md §5): with the linkage's geometry, every input's run is swept through its
 * travel (sweep.ts), its stops found (travel stops joined to a part of the run, 14 CFR 23.675), and the rules
 * run over the travel the run really has (findings.ts); each member's load is taken at its worst step and
 * replaces the perpendicular-arm load; each pushrod's length is held against its rigging range (rigging.ts).
 * Without geometry nothing here runs and the report says motion was not checked.
 */
import type { LinkageGraph } from "../../linkage/schema";
import type { AnalysisSettings, Finding } from "../types";
import { finding, fmt, nodeSubject, num } from "../format";
import { SRC } from "../../hardware";
import { buildContext, type Ctx, jointsAt, nodeLabel, otherNode } from "../context";
import { designForce } from "../loads";
import { buildChains, type Chain } from "./chain";
import { type ChainSweep, mu as muDeg, sweepChain } from "./sweep";
import { chainFindings, controlSense, senseNotReadWhy, inputWordsFor, MOTION_SRC, atInput, type Ends } from "./findings";
import { riggingRange } from "./rigging";
import { enterTodo, unenteredOf } from "../unentered";

const LENGTH_KEY = ["length"] as const;
import type { MotionChainSummary, MotionReport, WorstLoad } from "./types";

export type { MotionReport, MotionChainSummary, WorstLoad } from "./types";
export { sweepChain, defaultSteps, mu, TOGGLE_SIN, type ChainSweep } from "./sweep";
export { buildChains, type Chain, type Stage } from "./chain";
export { riggingRange, minEngagement } from "./rigging";
export { atInput } from "./findings";

export const MOTION_NOT_CHECKED = "Motion was not checked: the linkage has no geometry. Enter the pivots and arm angles in the geometry view to sweep the run through its travel.";

/** Per member, the worst-step limit load that replaces the perpendicular-arm load. */
export type MotionLoads = { pushrod: Map<number, number>; joint: Map<number, number>; surface: Map<number, number> };

export type MotionResult = { report: MotionReport; findings: Finding[]; loads: MotionLoads; sweeps: ChainSweep[]; ends: Ends[] };

/** Sweep every run of a graph (for the geometry view): the same numbers the report is built from. */
export function sweepGraph(graph: LinkageGraph, settings: AnalysisSettings, steps?: number): MotionResult {
  return analyzeMotion(buildContext(graph), settings, steps);
}

export function analyzeMotion(ctx: Ctx, settings: AnalysisSettings, steps?: number): MotionResult {
  const loads: MotionLoads = { pushrod: new Map(), joint: new Map(), surface: new Map() };
  const geo = ctx.graph.geometry;
  if (!geo) return { report: { checked: false, notChecked: [MOTION_NOT_CHECKED], chains: [], worstLoads: [] }, findings: [], loads, sweeps: [], ends: [] };
  const { chains, notChecked } = buildChains(ctx, geo);
  const findings: Finding[] = [];
  const summaries: MotionChainSummary[] = [];
  const worstLoads: WorstLoad[] = [];
  const sweeps: ChainSweep[] = [];
  const allEnds: Ends[] = [];
  const combine = (m: Map<number, number>, key: number, v: number) => {
    const old = m.get(key);
    m.set(key, old === undefined ? v : settings.dualControls ? old + v : Math.max(old, v));
  };
  for (const ch of chains) {
    const input = ctx.nodes[ch.input];
    const sw = sweepChain(ch, designForce(input, ctx.graph, settings), steps);
    const ends = travelEnds(ctx, sw, findings);
    sweeps.push(sw);
    allEnds.push(ends);
    const reading = controlSense(ctx, sw, ends, geo);
    chainFindings(ctx, sw, ends, geo, reading, findings);
    const { eb, ef } = ends;
    // Worst step of every member within the travel the run has.
    const worst = (series: Float64Array) => {
      let v = -1, at = 0;
      for (let k = eb; k <= ef; k++) if (sw.ok[k] && series[k] > v) { v = series[k]; at = sw.theta[k]; }
      return { v: Math.max(v, 0), at };
    };
    const add = (subject: WorstLoad["subject"], what: string, unit: WorstLoad["unit"], w: { v: number; at: number }) =>
      worstLoads.push({ subject, what, unit, limit: w.v, at: w.at, inputId: input.id });
    const rods: MotionChainSummary["rods"] = [];
    let minT = { value: Infinity, at: 0, rodId: "" }, maxT = { value: -Infinity, at: 0, rodId: "" };
    ch.stages.forEach((st, s) => {
      const rodId = ctx.nodes[st.rod].id;
      const w = worst(sw.rodForce[s]);
      combine(loads.pushrod, st.rod, w.v);
      combine(loads.joint, st.jointA, w.v);
      combine(loads.joint, st.jointB, w.v);
      add(nodeSubject(rodId), "axial", "lbf", w);
      for (let k = eb; k <= ef; k++) {
        if (!sw.ok[k]) continue;
        for (let e = 0; e < 2; e++) {
          const m = -(e ? sw.cosB[s][k] : sw.cosA[s][k]); // −cos μ rises with μ
          if (m < minT.value) minT = { value: m, at: sw.theta[k], rodId };
          if (m > maxT.value) maxT = { value: m, at: sw.theta[k], rodId };
        }
      }
      const rodNode = ctx.nodes[st.rod];
      const card = (rodNode.props as { length: number }).length;
      // The length on the card is a starting value: nothing to compare the geometry's length with yet.
      const startLength = unenteredOf(rodNode, LENGTH_KEY).length > 0;
      const rig = startLength ? { ok: false as const, toEnter: [enterTodo(rodNode, LENGTH_KEY).replace(/^enter /, "")] } : riggingRange(ctx, st.rod, [st.jointA, st.jointB]);
      rods.push({ rodId, needed: st.length, card, shortest: rig.ok ? rig.shortest : null, longest: rig.ok ? rig.longest : null, misalignment: st.dzKnown ? (Math.asin(Math.min(1, Math.abs(st.dz) / st.length)) * 180) / Math.PI : null });
      if (!st.dzKnown && (ctx.joints[st.jointA].hardware?.rodEnd || ctx.joints[st.jointB].hardware?.rodEnd))
        notChecked.push(`Rod-end misalignment at ${nodeLabel(rodNode)}: enter the out-of-plane offset of each of its attach points in the geometry (0 where they are in line with the arms).`);
      if (!rig.ok) {
        notChecked.push(`Rigging of ${nodeLabel(rodNode)} (the geometry needs ${fmt(st.length, 3)} in centre to centre, the card says ${fmt(card, 3)} in): enter ${rig.toEnter.join("; ")}.`);
      } else if (st.length < rig.shortest - 1e-6 || st.length > rig.longest + 1e-6) {
        findings.push(finding("rigging-out-of-range", "hazard", nodeSubject(rodId),
          `The geometry needs ${nodeLabel(rodNode)} at ${fmt(st.length, 3)} in centre to centre, but with its rod ends it adjusts only from ${fmt(rig.shortest, 3)} to ${fmt(rig.longest, 3)} in (each end engaged at least ${rig.minEngagement.map((m) => fmt(m, 3)).join(" / ")} in, 1×D in steel or 2×D in aluminium, a rule of thumb — the witness hole decides; jam nut thickness not taken off). Cut the tube to a new length or move an attach point; do not rig it with the witness hole open.`,
          SRC.engagement, [num("length needed", st.length, "in"), num("shortest", rig.shortest, "in"), num("longest", rig.longest, "in")]));
      }
    });
    ch.parts.forEach((p, i) => {
      const w = worst(sw.pivotLoad[i]);
      const js = i === ch.parts.length - 1 ? [...ch.hornJoints, ...ch.hingeJoints] : ch.pivotJoints[i];
      for (const j of js) {
        combine(loads.joint, j, w.v);
        add({ type: "joint", id: ctx.joints[j].id }, "radial", "lbf", w);
      }
      void p;
    });
    if (ch.surface >= 0) {
      const w = worst(sw.hingeMoment);
      combine(loads.surface, ch.surface, w.v);
      add(nodeSubject(ctx.nodes[ch.surface].id), "hinge moment", "in·lbf", w);
    }
    minT.value = muDeg(-minT.value);
    maxT.value = muDeg(-maxT.value);
    summaries.push({
      inputId: input.id, hornId: ctx.nodes[ch.horn].id, surfaceId: ch.surface >= 0 ? ctx.nodes[ch.surface].id : null, steps: sw.theta.length - 1,
      travelBack: -sw.theta[eb], travelForward: sw.theta[ef], deflectionBack: sw.deflection[eb], deflectionForward: sw.deflection[ef],
      gearingNeutral: sw.gearing[sw.neutral], minTransmission: minT, maxTransmission: maxT, failBack: sw.failBack, failForward: sw.failForward,
      sense: reading?.sense ?? null, rods,
    });
    // Pitch, roll and yaw runs' sense is read from the geometry where it can be; every run's is a checklist item on the aircraft.
    if (summaries.at(-1)!.sense === null)
      notChecked.push(`Control sense of the run from ${nodeLabel(input)}: not read from the geometry (${senseNotReadWhy(ctx.graph.system, input.kind, geo)}). Move the control on the aircraft and watch the surface; it is on the checklist.`);
  }
  return { report: { checked: chains.length > 0, notChecked, chains: summaries, worstLoads }, findings, loads, sweeps, ends: allEnds };
}

/** The travel the run really has, each way: to the input's stop, a travel stop met first, or the last step that closed. */
function travelEnds(ctx: Ctx, sw: ChainSweep, out: Finding[]): Ends {
  const ch = sw.chain;
  let eb = sw.neutral, ef = sw.neutral;
  while (eb > 0 && sw.ok[eb - 1]) eb--;
  while (ef < sw.theta.length - 1 && sw.ok[ef + 1]) ef++;
  let stopBack = false, stopForward = false;
  const lastOkF = ef, lastOkB = eb;
  const targets = new Map<number, Float64Array>();
  ch.parts.forEach((p, i) => targets.set(p, i === 0 ? sw.theta : i === ch.parts.length - 1 ? sw.deflection : sw.rot[i]));
  if (ch.surface >= 0) targets.set(ch.surface, sw.deflection);
  for (let n = 0; n < ctx.nodes.length; n++) {
    if (ctx.nodeRole[n] !== "stop") continue;
    for (const j of jointsAt(ctx, n, "contact")) {
      const t = otherNode(ctx, j, n);
      const series = t >= 0 ? targets.get(t) : undefined;
      if (!series) continue;
      const stopAt = (ctx.nodes[n].props as { stopAt: number }).stopAt;
      if (stopAt === 0) continue;
      const hit = (k: number) => (stopAt > 0 ? series[k] >= stopAt : series[k] <= stopAt);
      let found = false;
      for (let k = sw.neutral; k <= lastOkF && !found; k++) if (hit(k)) { found = true; if (k < ef || !stopForward) { ef = Math.min(ef, k); stopForward = true; } }
      for (let k = sw.neutral; k >= lastOkB && !found; k--) if (hit(k)) { found = true; if (k > eb || !stopBack) { eb = Math.max(eb, k); stopBack = true; } }
      if (found) continue;
      const stop = ctx.nodes[n], part = ctx.nodes[t];
      const failed = sw.failForward !== null || sw.failBack !== null;
      const edge = Math.abs(series[lastOkF]) > Math.abs(series[lastOkB]) ? series[lastOkF] : series[lastOkB];
      const towards = failed && Math.sign(edge) === Math.sign(stopAt);
      out.push(towards
        ? finding("stop-after-runout", "hazard", nodeSubject(stop.id),
            `${nodeLabel(stop)} is set at ${fmt(stopAt, 1)}° of ${nodeLabel(part)}, but the run jams first (${nodeLabel(part)} gets only to ${fmt(edge, 1)}°, at ${atInput(sw.theta[Math.abs(series[lastOkF]) > Math.abs(series[lastOkB]) ? lastOkF : lastOkB], inputWordsFor(ctx.graph.system, ctx.graph.geometry))} of the input): another part runs out of travel before the stop is met and takes the pilot's load. Set the stop inside the travel the run has.`,
            MOTION_SRC.stops, [num("stop angle", stopAt, "°"), num("travel reached", edge, "°")])
        : finding("stop-never-reached", "caution", nodeSubject(stop.id),
            `${nodeLabel(stop)} is set at ${fmt(stopAt, 1)}° of ${nodeLabel(part)}, which the input's own travel never reaches (${nodeLabel(part)} moves from ${fmt(series[lastOkB], 1)}° to ${fmt(series[lastOkF], 1)}°): the stop does nothing, so whatever limits the input takes the loads. Move the stop inside the travel or check the stop angle.`,
            MOTION_SRC.stops, [num("stop angle", stopAt, "°")]));
    }
  }
  return { eb, ef, stopBack, stopForward };
}

export type { Chain as MotionChain };
