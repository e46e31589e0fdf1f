/**
 * Load propagation (domain.md §1–§2): from every input (stick, pedal) the design pilot force is carried
 * through the arm ratios to every pushrod (axial) and every joint (radial), limit loads in lbf.
 *
 * Model, and the assumptions a careful engineer would state (they are also listed in the report):
 * - Arms are taken perpendicular to their links: F_out = F_in · L_in / L_out [from memory; statics].
 *   A control horn's effective arm is hornArm · sin(linkAngle).
 * - A force arriving at a crank's "out" port leaves through "in" with the ratio reversed.
 * - Where a port carries more than one joint (a shared bolt, a branch), every joint on it is taken to
 *   carry the full force — conservative, since the split depends on the stiffness of each branch.
 * - A pivot (crank to structure) carries the vector sum of the two arm loads. For a bellcrank with its
 *   arms at armAngle α and the link forces perpendicular to the arms, |R|² = Fi² + Fo² − 2·Fi·Fo·cos α.
 *   Idler arms, torque tubes, sticks and pedals have no arm angle in the format: the arms are taken as
 *   opposite (R = Fi + Fo), the largest the resultant can be. Every pivot joint of a part carries the whole R.
 * - A surface's hinges and the horn's attachment are each taken to carry the full link force at the horn.
 * - Another input reached along the run is held by its pilot and reacts the load; the force also goes on
 *   through the other joints on the same port.
 * - Each input is propagated alone. Without dual controls the largest single-input load governs each part;
 *   with dual controls each pilot's force is 75 % of the design force and the contributions of all inputs
 *   are added (both pilots pushing the same way), which is conservative for the interconnect.
 * Each joint is traversed at most once per input, so loops end (and are reported by structure.ts).
 */
import type { LinkageGraph, LinkageNode } from "../linkage/schema";
import { ENGINE, roleOf, type EngineInfo } from "../linkage/kinds";
import { bellcrankPivotLoad } from "../linkage/kinds/bellcrank";
import { guideLoad, pullingTension } from "../hardware/cables";
import type { AnalysisSettings } from "./types";
import { type Ctx, jointsAt, otherNode, otherPort } from "./context";
import { unenteredLoadKeys } from "./unentered";

export type InputLoad = { node: number; gripForce: number; linkForce: number; reachesSurface: boolean };

export type Loads = {
  /** Limit axial load per node index: pushrods, and the tension of cables and turnbuckles; 0 elsewhere, lbf. */
  pushrodAxial: Float64Array;
  /** Limit radial load per joint index, lbf. */
  jointRadial: Float64Array;
  /** Limit hinge moment per node index (surfaces only), in·lbf. */
  surfaceMoment: Float64Array;
  /** 1 where some input's force reaches the node. */
  driven: Uint8Array;
  /**
   * Per joint, and per node for its axial load and hinge moment: 1 + the index of a part whose starting
   * values (shared/analysis/unentered.ts) the force was carried through, 0 when the load is the builder's own.
   */
  jointFrom: Int32Array;
  nodeFrom: Int32Array;
  inputs: InputLoad[];
  /** The per-node rigging tensions the loads were made with (see propagate), so a case at another force can make them again. */
  pretension?: Float64Array;
};

export const DUAL_CONTROL_SHARE = 0.75; // 14 CFR 23.399: each pilot at 75 % (the two acting together; from memory for the paragraph)

/** The design pilot force at an input's grip or pedal, limit, lbf (0 for a part that is not an input). */
export function designForce(node: LinkageNode, graph: LinkageGraph, settings: AnalysisSettings): number {
  const e = ENGINE[node.kind];
  if (!e || e.role !== "input") return 0;
  const f = e.pilotForce(node.props, graph.system, settings.pilotForce);
  return settings.dualControls ? f * DUAL_CONTROL_SHARE : f;
}

export function isInput(n: LinkageNode): boolean {
  return roleOf(n.kind) === "input";
}

function ratio(num: number, den: number): number {
  const r = num / den;
  return Number.isFinite(r) && r >= 0 ? r : 0;
}

export { bellcrankPivotLoad };

/** [grip, attach] arms of an input; [in, out] arms of a crank. */
function arms(n: LinkageNode): [number, number] {
  const e = ENGINE[n.kind];
  return e && (e.role === "input" || e.role === "crank") ? e.arms(n.props) : [0, 0];
}

/**
 * `pretension`, per node: the rigging tension of the cable circuit a tension member is in (NaN when unknown,
 * then the pulling cable is taken at the force alone). From shared/analysis/cable-circuits.ts.
 * `forceScale`: a factor on every input's design force (the hinge-moment case of 14 CFR 23.395, design-case.ts);
 * it is put on the pilot's force, so a cable's tension max(F, P + F/2) is made from the scaled force, not scaled after.
 */
export function propagate(ctx: Ctx, settings: AnalysisSettings, pretension?: Float64Array, forceScale = 1): Loads {
  const { nodes, joints } = ctx;
  const N = nodes.length;
  const J = joints.length;
  const pushrodAxial = new Float64Array(N);
  const surfaceMoment = new Float64Array(N);
  const jointRadial = new Float64Array(J);
  const driven = new Uint8Array(N);
  const jointFrom = new Int32Array(J);
  const nodeFrom = new Int32Array(N);
  const inputs: InputLoad[] = [];
  const sum = settings.dualControls;
  // 1 + n for a part whose load values are starting values (most graphs have none: one pass, no allocation).
  const own = new Int32Array(N);
  for (let n = 0; n < N; n++) if (unenteredLoadKeys(nodes[n]).length > 0) own[n] = n + 1;

  // Per-walk values, combined into the totals after each input (max or sum), through touched lists.
  const wJ = new Float64Array(J);
  const wA = new Float64Array(N);
  const wM = new Float64Array(N);
  // The walk's taint beside each value (see jointFrom): any tainted contribution taints the total.
  const wJT = new Int32Array(J);
  const wNT = new Int32Array(N);
  const touchedJ: number[] = [];
  const touchedN: number[] = [];
  const visited = new Int32Array(J);
  // Explicit stack (no recursion: a 10,000-part chain must not overflow): joint, node it leaves, force, moment.
  let sJ = new Int32Array(64), sN = new Int32Array(64), sF = new Float64Array(64), sM = new Float64Array(64), sT = new Int32Array(64);
  let sp = 0;
  const push = (j: number, from: number, f: number, m: number, t: number) => {
    if (sp === sJ.length) {
      const grow = <T extends Int32Array | Float64Array>(a: T): T => {
        const b = new (a.constructor as new (n: number) => T)(a.length * 2);
        b.set(a);
        return b;
      };
      sJ = grow(sJ); sN = grow(sN); sF = grow(sF); sM = grow(sM); sT = grow(sT);
    }
    sJ[sp] = j; sN[sp] = from; sF[sp] = f; sM[sp] = m; sT[sp] = t; sp++;
  };
  const recJ = (j: number, f: number, t: number) => {
    if (wJ[j] === 0 && f > 0) touchedJ.push(j);
    if (f > wJ[j]) wJ[j] = f;
    if (t && f > 0 && !wJT[j]) wJT[j] = t;
  };
  const recN = (n: number, f: number, t: number) => {
    if (wA[n] === 0 && f > 0) touchedN.push(n);
    if (f > wA[n]) wA[n] = f;
    if (t && f > 0 && !wNT[n]) wNT[n] = t;
  };
  // Each port's joint list is handled once per walk, so a walk is linear in parts + joints however many
  // joints share a port: lists whose joints all carry a load (pivots, hinges, a cable's ends, a guide's
  // mounting) keep the largest value and are applied at the end of the walk; lists the force goes on
  // through are pushed the first time the walk reaches them (in a tree that is the only time; around a
  // loop, which structure.ts reports, the first path reached wins).
  const listMax = new Map<number[], number>();
  const listTaint = new Map<number[], number>();
  const forwarded = new Set<number[]>();
  const recList = (list: number[], r: number, t: number) => {
    if (list.length === 0) return;
    const m = listMax.get(list);
    if (m === undefined || r > m) listMax.set(list, r);
    if (t && r > 0 && !listTaint.get(list)) listTaint.set(list, t);
  };
  const pushList = (list: number[], from: number, f: number, m: number, t: number, skip = -1) => {
    if (list.length === 0 || forwarded.has(list)) return;
    forwarded.add(list);
    for (const k of list) if (k !== skip) push(k, from, f, m, t);
  };
  const recPivot = (n: number, r: number, t: number) => recList(jointsAt(ctx, n, "pivot"), r, t);

  let stamp = 0;
  for (let i = 0; i < N; i++) {
    const inp = nodes[i];
    if (ctx.nodeRole[i] !== "input") continue;
    stamp++;
    const fg = designForce(inp, ctx.graph, settings) * forceScale;
    const [grip, attach] = arms(inp);
    const fp = fg * ratio(grip, attach);
    let reaches = false;
    driven[i] = 1;
    recPivot(i, fg + fp, own[i]);
    pushList(jointsAt(ctx, i, "attach"), i, fp, 0, own[i]);

    while (sp > 0) {
      sp--;
      const j = sJ[sp], from = sN[sp], f = sF[sp], moment = sM[sp], t = sT[sp];
      if (visited[j] === stamp) continue;
      visited[j] = stamp;
      recJ(j, f, t);
      const n = otherNode(ctx, j, from);
      if (n < 0) continue;
      const port = otherPort(ctx, j, from);
      const node = nodes[n];
      if (!driven[n]) driven[n] = 1;
      switch (ctx.nodeRole[n]) {
        case "link": {
          recN(n, f, t);
          forwardSamePort(j, n, port, f, t);
          const exit = port === "a" ? "b" : port === "b" ? "a" : null;
          if (exit) pushList(jointsAt(ctx, n, exit), n, f, 0, t);
          break;
        }
        case "tension": {
          // A cable or turnbuckle: tension only. The pulling cable of a preloaded circuit carries
          // T = max(F, P + F/2) (shared/hardware/cables.ts); its joints carry T, the force passed on is F.
          if (port !== "a" && port !== "b") break;
          const p = pretension ? pretension[n] : Number.NaN;
          const tt = Number.isNaN(p) ? f : pullingTension(f, p);
          recJ(j, tt, t);
          recN(n, tt, t);
          forwardSamePort(j, n, port, f, t);
          const ends = jointsAt(ctx, n, port === "a" ? "b" : "a");
          recList(ends, tt, t);
          pushList(ends, n, f, 0, t);
          // Pulleys and fairleads on the run carry the two legs' resultant, and so does their mounting.
          for (const k of jointsAt(ctx, n, "run")) {
            const g = otherNode(ctx, k, n);
            if (g < 0 || ctx.nodeRole[g] !== "guide") continue;
            const guide = ENGINE[nodes[g].kind] as Extract<EngineInfo<unknown>, { role: "guide" }>;
            const r = guideLoad(tt, guide.turn(nodes[g].props) ?? 0);
            const gt = t || own[g];
            recJ(k, r, gt);
            if (!driven[g]) driven[g] = 1;
            const gp = ctx.ports[g];
            if (gp) for (const q in gp) if (q !== "cable") recList(gp[q], r, gt);
          }
          break;
        }
        case "crank": {
          if (port !== "in" && port !== "out") break; // a link on the pivot port: reacted there
          forwardSamePort(j, n, port, f, t);
          const [inArm, outArm] = arms(node);
          const fo = port === "in" ? f * ratio(inArm, outArm) : f * ratio(outArm, inArm);
          const crank = ENGINE[node.kind] as Extract<EngineInfo<unknown>, { role: "crank" }>;
          const ct = t || own[n];
          recPivot(n, crank.pivotLoad(f, fo, node.props), ct);
          pushList(jointsAt(ctx, n, port === "in" ? "out" : "in"), n, fo, 0, ct);
          break;
        }
        case "input": {
          if (port !== "attach") break;
          // Held by its pilot: the grip reacts F·attach/grip; the pivot carries both.
          const [g, a] = arms(node);
          recPivot(n, f + f * ratio(a, g), t || own[n]);
          forwardSamePort(j, n, port, f, t);
          break;
        }
        case "horn": {
          if (port !== "attach") break;
          forwardSamePort(j, n, port, f, t);
          const horn = ENGINE[node.kind] as Extract<EngineInfo<unknown>, { role: "horn" }>;
          const m = f * horn.effectiveArm(node.props);
          // The link force goes on unchanged to the horn's bolts; the moment carries the horn's own arm.
          pushList(jointsAt(ctx, n, "surface"), n, f, m, t || own[n]);
          break;
        }
        case "surface": {
          reaches = true;
          if (wM[n] === 0 && moment > 0) touchedN.push(n);
          if (moment > wM[n]) wM[n] = moment;
          if (t && moment > 0 && !wNT[n]) wNT[n] = t;
          recList(jointsAt(ctx, n, "hinge"), f, t);
          break;
        }
        default:
          break; // mount, stop: the load is reacted here
      }
    }
    inputs.push({ node: i, gripForce: fg, linkForce: fp, reachesSurface: reaches });
    for (const [list, r] of listMax) { const t = listTaint.get(list) ?? 0; for (const k of list) recJ(k, r, t); }
    listMax.clear();
    listTaint.clear();
    forwarded.clear();

    // Combine this input's loads into the totals and clear the walk arrays.
    for (const j of touchedJ) {
      jointRadial[j] = sum ? jointRadial[j] + wJ[j] : Math.max(jointRadial[j], wJ[j]);
      if (wJT[j] && !jointFrom[j]) jointFrom[j] = wJT[j];
      wJ[j] = 0;
      wJT[j] = 0;
    }
    for (const n of touchedN) {
      if (wA[n] > 0) pushrodAxial[n] = sum ? pushrodAxial[n] + wA[n] : Math.max(pushrodAxial[n], wA[n]);
      if (wM[n] > 0) surfaceMoment[n] = sum ? surfaceMoment[n] + wM[n] : Math.max(surfaceMoment[n], wM[n]);
      if (wNT[n] && !nodeFrom[n]) nodeFrom[n] = wNT[n];
      wA[n] = 0;
      wM[n] = 0;
      wNT[n] = 0;
    }
    touchedJ.length = 0;
    touchedN.length = 0;
  }
  return { pushrodAxial, jointRadial, surfaceMoment, driven, inputs, jointFrom, nodeFrom, pretension };

  function forwardSamePort(via: number, n: number, port: string, f: number, t: number) {
    const list = jointsAt(ctx, n, port);
    if (list.length > 1) pushList(list, n, f, 0, t, via);
  }
}
