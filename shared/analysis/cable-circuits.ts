/**
 * Cable runs as the check sees them (domain.md §6). Tension members (cables, turnbuckles) joined end to end
 * form a chain; each chain ends on two other parts (a pedal, a sector, a horn). Two chains between the same
 * two parts are one closed circuit — one cable pulls each way — and are not a loop. A chain with no other
 * chain at either of its end parts has nothing to pull the other way: it would have to push.
 * Built once per analysis in one pass over the tension parts and their joints (linear).
 */
import type { Ctx } from "./context";
import { jointsAt, otherNode } from "./context";

export type Chain = {
  /** Tension parts of the chain, in the order found. */
  nodes: number[];
  /** The joints where the chain meets other parts (node index of that part, and the joint). */
  ends: { node: number; joint: number }[];
  /** Index of the circuit it belongs to, -1 when it has no partner. */
  circuit: number;
  /** The second chain of a circuit (the return): left out of the loop check. */
  isReturn: boolean;
  /** Another chain ends on one of its end parts, so something pulls the other way. */
  returned: boolean;
};

export type CableCtx = {
  chains: Chain[];
  /** Per node: its chain, -1 for parts that are not tension members. */
  chainOf: Int32Array;
  /** Per circuit: its chains. */
  circuits: number[][];
  /** Per node: the rigging tension of its circuit (the highest recorded on it), NaN when none is recorded. */
  pretension: Float64Array;
  /** Per joint: 1 when it is part of a cable system (touches a cable, turnbuckle, pulley or fairlead). */
  cableJoint: Uint8Array;
  /** Per joint: 1 when the loop check leaves it out (cable-system joints: their chains are checked as wholes). */
  skipLoop: Uint8Array;
  /** Chains as edges between their end parts for the loop check: [part, part, joint that closes it]. */
  loopEdges: [number, number, number][];
};

const isTension = (ctx: Ctx, n: number) => n >= 0 && ctx.nodeRole[n] === "tension";

export function cableContext(ctx: Ctx): CableCtx {
  const N = ctx.nodes.length, J = ctx.joints.length;
  const chainOf = new Int32Array(N).fill(-1);
  const pretension = new Float64Array(N).fill(Number.NaN);
  const cableJoint = new Uint8Array(J);
  const skipLoop = new Uint8Array(J);
  const chains: Chain[] = [];

  for (let j = 0; j < J; j++) {
    const f = ctx.jFrom[j], t = ctx.jTo[j];
    const r = (n: number) => n >= 0 && (ctx.nodeRole[n] === "tension" || ctx.nodeRole[n] === "guide");
    if (r(f) || r(t)) cableJoint[j] = skipLoop[j] = 1;
  }

  const stack: number[] = [];
  for (let s = 0; s < N; s++) {
    if (!isTension(ctx, s) || chainOf[s] >= 0) continue;
    const chain: Chain = { nodes: [], ends: [], circuit: -1, isReturn: false, returned: false };
    const id = chains.length;
    chains.push(chain);
    chainOf[s] = id;
    stack.push(s);
    while (stack.length) {
      const n = stack.pop()!;
      chain.nodes.push(n);
      for (const port of ["a", "b"]) {
        for (const k of jointsAt(ctx, n, port)) {
          const m = otherNode(ctx, k, n);
          if (m < 0) continue;
          if (isTension(ctx, m)) {
            if (chainOf[m] < 0) { chainOf[m] = id; stack.push(m); }
          } else if (ctx.nodeRole[m] !== "guide") chain.ends.push({ node: m, joint: k });
        }
      }
    }
  }

  // Circuits: chains grouped by the pair of parts they run between.
  const byPair = new Map<string, number>();
  const chainsAtPart = new Map<number, number>();
  const circuits: number[][] = [];
  const loopEdges: [number, number, number][] = [];
  for (let c = 0; c < chains.length; c++) {
    const ch = chains[c];
    const parts = [...new Set(ch.ends.map((e) => e.node))];
    for (const p of parts) chainsAtPart.set(p, (chainsAtPart.get(p) ?? 0) + 1);
    if (parts.length !== 2) continue;
    const [x, y] = parts[0] < parts[1] ? parts : [parts[1], parts[0]];
    const key = `${x}:${y}`;
    const first = byPair.get(key);
    const closing = ch.ends[ch.ends.length - 1].joint;
    if (first === undefined) {
      byPair.set(key, c);
      if (ctx.nodeRole[x] !== "mount" && ctx.nodeRole[y] !== "mount") loopEdges.push([x, y, closing]);
    } else if (chains[first].circuit < 0 || circuits[chains[first].circuit].length < 2) {
      // The return of a closed circuit: one cable pulls each way. Not a loop.
      let ci = chains[first].circuit;
      if (ci < 0) { ci = circuits.length; circuits.push([first]); chains[first].circuit = ci; }
      circuits[ci].push(c);
      ch.circuit = ci;
      ch.isReturn = true;
    } else if (ctx.nodeRole[x] !== "mount" && ctx.nodeRole[y] !== "mount") loopEdges.push([x, y, closing]); // a third path: a real loop
  }
  for (const ch of chains) {
    ch.returned = ch.circuit >= 0 || ch.ends.some((e) => (chainsAtPart.get(e.node) ?? 0) > 1);
  }

  // Rigging tension: the highest recorded on any cable of the circuit (or of the chain, outside a circuit).
  const groupOf = (c: number) => (chains[c].circuit >= 0 ? circuits[chains[c].circuit] : [c]);
  for (let c = 0; c < chains.length; c++) {
    let p = Number.NaN;
    for (const cc of groupOf(c)) {
      for (const n of chains[cc].nodes) {
        const node = ctx.nodes[n];
        const v = node.kind === "cable" ? node.props.riggingTension : undefined;
        if (v !== undefined && !(v <= p)) p = v;
      }
    }
    for (const n of chains[c].nodes) pretension[n] = p;
  }
  return { chains, chainOf, circuits, pretension, cableJoint, skipLoop, loopEdges };
}
