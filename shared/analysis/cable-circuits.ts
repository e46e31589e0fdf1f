/**
 * Cable runs as the check sees them (domain.md §6). Tension members (cables, turnbuckles) joined end to end
 * form a chain; each chain ends on two other parts (a pedal, a sector, a horn). Chains that meet at a part are
 * one closed circuit — one cable pulls each way (two cables between a sector and a horn, or a cable from each
 * pedal to the rudder horn) — and are not a loop. A chain in no circuit has nothing to pull the other way: it
 * would have to push.
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
  /** It is in a circuit with another chain, so something pulls the other way. */
  returned: boolean;
};

export type CableCtx = {
  chains: Chain[];
  /** Per node: its chain, -1 for parts that are not tension members. */
  chainOf: Int32Array;
  /** Per circuit (two or more chains meeting at parts): its chains. */
  circuits: number[][];
  /** Per node: the rigging tension of its circuit (the highest recorded on it), NaN when none is recorded. */
  pretension: Float64Array;
  /** Per joint: 1 when it is part of a cable system (touches a cable, turnbuckle, pulley or fairlead). */
  cableJoint: Uint8Array;
  /** Per joint: 1 when the loop check leaves it out (cable-system joints: their chains are checked as wholes). */
  skipLoop: Uint8Array;
  /**
   * Chains between two parts, for the loop check: [part, part, last joint]. A chain whose two parts are already
   * joined by pushrods and cranks closes a loop; chains among themselves never do (that is a circuit).
   */
  chainLinks: [number, number, number][];
};

const isTension = (ctx: Ctx, n: number) => n >= 0 && ctx.nodeRole[n] === "tension";

export function cableContext(ctx: Ctx): CableCtx {
  const N = ctx.nodes.length, J = ctx.joints.length;
  const chainOf = new Int32Array(N).fill(-1);
  const pretension = new Float64Array(N).fill(Number.NaN);
  const cableJoint = new Uint8Array(J);
  const skipLoop = new Uint8Array(J);
  const chains: Chain[] = [];

  const roles = ctx.nodeRole;
  let any = false;
  for (let n = 0; n < N; n++) if (roles[n] === "tension" || roles[n] === "guide") { any = true; break; }
  if (any) for (let j = 0; j < J; j++) {
    const f = ctx.jFrom[j], t = ctx.jTo[j];
    if ((f >= 0 && (roles[f] === "tension" || roles[f] === "guide")) || (t >= 0 && (roles[t] === "tension" || roles[t] === "guide"))) cableJoint[j] = skipLoop[j] = 1;
  }

  const stack: number[] = [];
  for (let s = 0; s < N; s++) {
    if (!isTension(ctx, s) || chainOf[s] >= 0) continue;
    const chain: Chain = { nodes: [], ends: [], circuit: -1, returned: false };
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

  // Circuits: chains that meet at a part (not the airframe) work together — one pulls while the other is
  // eased — so they form one closed circuit, whatever path they take. A closed circuit is not a loop.
  const parent = chains.map((_, i) => i);
  const find = (x: number): number => { while (parent[x] !== x) { parent[x] = parent[parent[x]]; x = parent[x]; } return x; };
  const chainAtPart = new Map<number, number>();
  const chainLinks: [number, number, number][] = [];
  for (let c = 0; c < chains.length; c++) {
    const parts = [...new Set(chains[c].ends.map((e) => e.node))].filter((p) => ctx.nodeRole[p] !== "mount");
    for (const p of parts) {
      const other = chainAtPart.get(p);
      if (other === undefined) chainAtPart.set(p, c);
      else parent[find(c)] = find(other);
    }
    if (parts.length === 2) chainLinks.push([parts[0], parts[1], chains[c].ends[chains[c].ends.length - 1].joint]);
  }
  const circuitOfRoot = new Map<number, number>();
  const members = new Map<number, number[]>();
  for (let c = 0; c < chains.length; c++) {
    const r = find(c);
    if (!members.has(r)) members.set(r, []);
    members.get(r)!.push(c);
  }
  const circuits: number[][] = [];
  for (const [r, list] of members) {
    if (list.length < 2) continue;
    circuitOfRoot.set(r, circuits.length);
    circuits.push(list);
  }
  for (let c = 0; c < chains.length; c++) {
    const ci = circuitOfRoot.get(find(c));
    chains[c].circuit = ci ?? -1;
    chains[c].returned = ci !== undefined;
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
  return { chains, chainOf, circuits, pretension, cableJoint, skipLoop, chainLinks };
}
