/**
 * From a graph with geometry to the mechanism the sweep solves: each input's run, followed from its attach
 * arm through pushrods and cranks to a control horn, as a series of four-bars (stages). A stage is driver
 * pivot O2 with arm a → pushrod → follower arm c on pivot O4; the follower of one stage (a crank) drives
 * the next through its other arm, which turns with it. What the chain needs and does not have is listed
 * (the builder's to-do), never guessed.
 */
import { ENGINE } from "../../linkage/kinds";
import type { LinkageGeometry, PartGeometry } from "../../linkage/geometry";
import { type Ctx, jointsAt, nodeLabel, otherNode, otherPort } from "../context";
import { enterTodo, LOAD_KEYS, unenteredOf } from "../unentered";

const RAD = Math.PI / 180;

export type Stage = {
  /** Node index of the pushrod, and its joints at the driver and follower ends. */
  rod: number;
  jointA: number;
  jointB: number;
  /** Turning parts (index into Chain.parts) of the driver and the follower. */
  driver: number;
  follower: number;
  o2x: number; o2y: number; a: number; alpha0: number;
  o4x: number; o4y: number; c: number; beta0: number;
  /** Rod length in the plane and in space, and its out-of-plane rise (z at B − z at A), in. */
  b: number;
  length: number;
  dz: number;
  /** Both attach points' out-of-plane offsets were entered (an unentered one is taken as 0 for the length only). */
  dzKnown: boolean;
  /** The branch the chain is assembled in: the side of the line A→O4 that B lies on at neutral. */
  branch: 1 | -1;
  /** cos and sin of the angle from this follower's arm to its other arm (the next stage's driver arm). */
  nextCos: number;
  nextSin: number;
};

export type ChainPart = { node: number; port: "in" | "out" | "attach" | null };

export type Chain = {
  input: number;
  horn: number;
  /** The surface the horn moves, -1 when the horn is joined to none. */
  surface: number;
  /** Turning parts in order: the input, each crank, the horn. */
  parts: number[];
  stages: Stage[];
  /** Grip (or pedal) arm, in: the design force acts at its end, square to it. */
  gripArm: number;
  /** Input travel, ° from neutral: back (aft) and forward, both ≥ 0. */
  travelBack: number;
  travelForward: number;
  /** +1 when forward is counter-clockwise in the view. */
  inputSign: 1 | -1;
  /** +1 when up is counter-clockwise in the view. */
  upSign: 1 | -1;
  /** Pivot joints of each turning part (by index in parts), and the joints the horn passes its load through. */
  pivotJoints: number[][];
  hornJoints: number[];
  hingeJoints: number[];
};

export type ChainsResult = { chains: Chain[]; notChecked: string[] };

function linkJoints(ctx: Ctx, n: number, port: string): number[] {
  return jointsAt(ctx, n, port).filter((j) => {
    const o = otherNode(ctx, j, n);
    return o >= 0 && ctx.nodeRole[o] === "link";
  });
}

function armAngle(pg: PartGeometry | undefined, port: string): number | undefined {
  const v = pg?.arms[port as keyof PartGeometry["arms"]];
  return typeof v === "number" ? v : undefined;
}

function offsetKnown(pg: PartGeometry | undefined, port: string): boolean {
  return typeof pg?.offsets[port as keyof PartGeometry["offsets"]] === "number";
}

function offsetOf(pg: PartGeometry | undefined, port: string): number {
  return pg?.offsets[port as keyof PartGeometry["offsets"]] ?? 0;
}

/** Every input's chain. An input with no geometry entered at all is left out silently only when the run has none. */
export function buildChains(ctx: Ctx, geo: LinkageGeometry): ChainsResult {
  const chains: Chain[] = [];
  const notChecked: string[] = [];
  const parts = geo.parts;
  const nodes = ctx.nodes;
  for (let i = 0; i < nodes.length; i++) {
    if (ctx.nodeRole[i] !== "input") continue;
    const inp = nodes[i];
    const name = nodeLabel(inp);
    const e = ENGINE[inp.kind] as { role: "input"; arms: (p: unknown) => [number, number] };
    const [gripArm, attachArm] = e.arms(inp.props);
    const props = inp.props as { travelFwd?: number; travelAft?: number; travel?: number };
    const travelForward = Math.abs(props.travelFwd ?? props.travel ?? 0);
    const travelBack = Math.abs(props.travelAft ?? props.travel ?? 0);
    const missing: string[] = [];
    const need = (n: number, ports: string[]) => {
      const pg = parts[nodes[n].id];
      const lack = ports.filter((p) => armAngle(pg, p) === undefined);
      if (!pg) missing.push(`${nodeLabel(nodes[n])}: pivot position and arm angle${ports.length > 1 ? "s" : ""} (${ports.join(", ")})`);
      else if (lack.length) missing.push(`${nodeLabel(nodes[n])}: arm angle (${lack.join(", ")})`);
    };
    const chain: Chain = {
      input: i, horn: -1, surface: -1, parts: [i], stages: [], gripArm, travelBack, travelForward,
      inputSign: geo.inputForward === "cw" ? -1 : 1, upSign: geo.surfaceUp === "cw" ? -1 : 1,
      pivotJoints: [jointsAt(ctx, i, "pivot")], hornJoints: [], hingeJoints: [],
    };
    need(i, ["attach"]);
    let cur = i, exitPort = "attach", exitArm = attachArm;
    let broken: string | null = null;
    for (let guard = 0; guard <= nodes.length; guard++) {
      const out = linkJoints(ctx, cur, exitPort);
      if (out.length !== 1) {
        broken = out.length ? `${nodeLabel(nodes[cur])} drives ${out.length} pushrods from one arm: the motion check follows one path per input` : `${nodeLabel(nodes[cur])} has no pushrod on its ${exitPort} arm`;
        break;
      }
      const ja = out[0];
      const rod = otherNode(ctx, ja, cur);
      const rodPortA = otherPort(ctx, ja, cur);
      const rodPortB = rodPortA === "a" ? "b" : "a";
      const far = jointsAt(ctx, rod, rodPortB);
      if (far.length !== 1) { broken = `${nodeLabel(nodes[rod])} has ${far.length || "no"} joints at its far end`; break; }
      const jb = far[0];
      const next = otherNode(ctx, jb, rod);
      const nextPort = next >= 0 ? otherPort(ctx, jb, rod) : "";
      const role = next >= 0 ? ctx.nodeRole[next] : undefined;
      if (!(role === "crank" && (nextPort === "in" || nextPort === "out")) && !(role === "horn" && nextPort === "attach")) {
        broken = `${nodeLabel(nodes[rod])} does not end on a crank arm or a control horn`;
        break;
      }
      if (chain.parts.includes(next)) { broken = `the run from ${name} loops back to ${nodeLabel(nodes[next])}`; break; }
      let inArm: number, outArm = 0;
      if (role === "crank") {
        const [ai, ao] = (ENGINE[nodes[next].kind] as { arms: (p: unknown) => [number, number] }).arms(nodes[next].props);
        inArm = nextPort === "in" ? ai : ao;
        outArm = nextPort === "in" ? ao : ai;
        need(next, nextPort === "in" ? ["in", "out"] : ["out", "in"]);
      } else {
        inArm = (nodes[next].props as { hornArm: number }).hornArm;
        need(next, ["attach"]);
      }
      const d = chain.parts.length - 1;
      chain.parts.push(next);
      chain.pivotJoints.push(role === "crank" ? jointsAt(ctx, next, "pivot") : []);
      const gd = parts[nodes[cur].id], gf = parts[nodes[next].id];
      const al = armAngle(gd, exitPort), be = armAngle(gf, nextPort);
      if (gd && gf && al !== undefined && be !== undefined) {
        const alpha0 = al * RAD, beta0 = be * RAD;
        const ax = gd.pivot.x + exitArm * Math.cos(alpha0), ay = gd.pivot.y + exitArm * Math.sin(alpha0);
        const bx = gf.pivot.x + inArm * Math.cos(beta0), by = gf.pivot.y + inArm * Math.sin(beta0);
        const dz = offsetOf(gf, nextPort) - offsetOf(gd, exitPort);
        const b = Math.hypot(bx - ax, by - ay);
        const ex = gf.pivot.x - ax, ey = gf.pivot.y - ay;
        const side = ex * (by - ay) - ey * (bx - ax);
        chain.stages.push({
          rod, jointA: ja, jointB: jb, driver: d, follower: d + 1,
          o2x: gd.pivot.x, o2y: gd.pivot.y, a: exitArm, alpha0, o4x: gf.pivot.x, o4y: gf.pivot.y, c: inArm, beta0,
          b, length: Math.hypot(b, dz), dz, dzKnown: offsetKnown(gf, nextPort) && offsetKnown(gd, exitPort), branch: side < 0 ? -1 : 1, nextCos: 1, nextSin: 0,
        });
        if (!(b > 1e-9)) { broken = `the two ends of ${nodeLabel(nodes[rod])} are at the same point`; break; }
      }
      if (role === "horn") {
        chain.horn = next;
        chain.hornJoints = jointsAt(ctx, next, "surface");
        const sj = chain.hornJoints.find((j) => ctx.nodeRole[otherNode(ctx, j, next)] === "surface");
        if (sj !== undefined) {
          chain.surface = otherNode(ctx, sj, next);
          chain.hingeJoints = jointsAt(ctx, chain.surface, "hinge");
        }
        break;
      }
      cur = next;
      exitPort = nextPort === "in" ? "out" : "in";
      const last = chain.stages[chain.stages.length - 1], outAngle = armAngle(gf, exitPort);
      if (last && last.follower === d + 1 && outAngle !== undefined) {
        const delta = outAngle * RAD - last.beta0;
        last.nextCos = Math.cos(delta);
        last.nextSin = Math.sin(delta);
      }
      exitArm = outArm;
    }
    const starting = broken ? [] : startingValues(ctx, chain);
    if (broken) notChecked.push(`Motion of the run from ${name}: ${broken}.`);
    else if (missing.length || starting.length) notChecked.push(`Motion of the run from ${name}: ${[...missing.map((m) => `enter ${m}`), ...starting].join("; ")}.`);
    else if (travelBack + travelForward <= 0) notChecked.push(`Motion of the run from ${name}: enter its travel.`);
    else chains.push(chain);
  }
  return { chains, notChecked };
}

/** Values the sweep of a chain would take from starting values (shared/analysis/unentered.ts): what to enter, one line per part. */
const INPUT_TRAVEL = ["travelFwd", "travelAft", "travel"] as const;
function startingValues(ctx: Ctx, chain: Chain): string[] {
  const out: string[] = [];
  const add = (n: number, keys: readonly string[]) => {
    const u = unenteredOf(ctx.nodes[n], keys);
    if (u.length) out.push(enterTodo(ctx.nodes[n], u));
  };
  chain.parts.forEach((n, i) => add(n, i === 0 ? [...(LOAD_KEYS[ctx.nodes[n].kind] ?? []), ...INPUT_TRAVEL] : (LOAD_KEYS[ctx.nodes[n].kind] ?? [])));
  if (chain.surface >= 0) add(chain.surface, ["travelUp", "travelDown"]);
  // A travel stop on a part of the chain sets where its travel ends.
  const onChain = new Set([...chain.parts, chain.surface]);
  for (let n = 0; n < ctx.nodes.length; n++) {
    if (ctx.nodeRole[n] !== "stop") continue;
    if (jointsAt(ctx, n, "contact").some((j) => onChain.has(otherNode(ctx, j, n)))) add(n, ["stopAt"]);
  }
  return out;
}
