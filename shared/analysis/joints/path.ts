/**
 * Loads the propagation does not give by itself (domain.md §1):
 * - A stop reacts the moment of the part it stops over its own arm from that part's pivot:
 *   stop load = moment / arm (14 CFR 23.675). A stop close to the pivot takes a large load.
 * - A horn bolted to its surface: each bolt carries its share of the link force plus the couple of the hinge
 *   moment. With n bolts in a row at spacing s, the outermost bolt of the couple M takes
 *   M · r_max / Σr² = 6M / (s · n · (n + 1)) [published: bolt-group statics, any machine-design text]; the
 *   share and the couple are added as if in line (conservative, the row's direction is not drawn).
 * - A surface's hinge carries the surface's own air load, which only the designer's figures give: the designer's
 *   limit hinge load entered on the joint's card, plus the control system's load there, added as if in line
 *   (conservative: the directions are not drawn). Without it the hinge is not checked.
 * A joint whose load cannot be found gets a to-do instead of a number.
 */
import { ENGINE, type EngineInfo } from "../../linkage/kinds";
import type { Finding } from "../types";
import { type Ctx, jointsAt, nodeLabel } from "../context";
import type { Loads } from "../loads";
import { finding, fmt, jointSubject, linkageSubject, nodeSubject, num } from "../format";

const STOP_KEY = ["stopAt"] as const, TRAVEL_KEYS = ["travelUp", "travelDown"] as const;
import { unenteredLoadKeys, unenteredOf } from "../unentered";

const STOP_SRC = { kind: "published", text: "14 CFR 23.675: stops positively limit travel and take the system loads" } as const;
const HORN_SRC = { kind: "published", text: "bolt-group statics: share F/n plus the couple 6M/(s·n·(n+1)) on the outer bolt" } as const;

export type PathInfo = {
  /** Per joint: what to enter before its load is known (null when known). */
  loadTodo: (string | null)[];
};

/**
 * 1 + the part whose starting values a load computed from node n's arms and the loads at its ports would rest
 * on (loads.ts `jointFrom`): n itself, or a part upstream of one of its joints; 0 when none.
 */
function taintAt(ctx: Ctx, loads: Loads, n: number): number {
  if (unenteredLoadKeys(ctx.nodes[n]).length) return n + 1;
  const m = ctx.ports[n];
  if (m) for (const port in m) for (const k of m[port]) if (ctx.roles[k] !== "stop" && loads.jointFrom[k]) return loads.jointFrom[k];
  return 0;
}

/** Largest radial load on the joints at a port of node n, stops left out. */
function portForce(ctx: Ctx, loads: Loads, n: number, port: string): number {
  let f = 0;
  for (const k of jointsAt(ctx, n, port)) if (ctx.roles[k] !== "stop" && loads.jointRadial[k] > f) f = loads.jointRadial[k];
  return f;
}

/** The limit moment about its pivot (or hinge) that node n must hold at the design force, in·lbf; null if it has no pivot. */
export function partMoment(ctx: Ctx, loads: Loads, n: number): number | null {
  const node = ctx.nodes[n];
  const e = ENGINE[node.kind] as EngineInfo<unknown> | undefined;
  if (!e) return null;
  switch (e.role) {
    case "input": {
      const [, attach] = e.arms(node.props);
      return portForce(ctx, loads, n, "attach") * attach;
    }
    case "crank": {
      const [a, b] = e.arms(node.props);
      return Math.max(portForce(ctx, loads, n, "in") * a, portForce(ctx, loads, n, "out") * b);
    }
    case "horn":
      return portForce(ctx, loads, n, "attach") * e.effectiveArm(node.props);
    case "surface":
      return loads.surfaceMoment[n];
    default:
      return null;
  }
}

export function pathLoads(ctx: Ctx, loads: Loads, out: Finding[]): PathInfo {
  const J = ctx.joints.length;
  const loadTodo: (string | null)[] = new Array(J).fill(null);
  let stops = 0, inputs = 0, surfaces = 0;
  for (let n = 0; n < ctx.nodes.length; n++) {
    const r = ctx.nodeRole[n];
    if (r === "stop") stops++;
    else if (r === "input") inputs++;
    else if (r === "surface") surfaces++;
  }
  for (let j = 0; j < J; j++) {
    const role = ctx.roles[j];
    if (role === "stop") stopLoad(ctx, loads, j, loadTodo, out);
    else if (role === "hornMount") hornBolts(ctx, loads, j, loadTodo, out);
    else if (role === "hinge") hingeLoad(ctx, loads, j, loadTodo);
  }
  if (stops === 0 && inputs > 0 && surfaces > 0)
    out.push(finding("no-stop", "caution", linkageSubject(ctx.graph.name || "linkage"),
      "The run has no travel stop drawn. Stops must positively limit the travel and take the loads of the system; without one the surface, its hinges or the horn do. Draw the stops and the part each one stops.", STOP_SRC));
  return { loadTodo };
}

function stopLoad(ctx: Ctx, loads: Loads, j: number, loadTodo: (string | null)[], out: Finding[]) {
  const f = ctx.jFrom[j], t = ctx.jTo[j];
  if (f < 0 || t < 0) return;
  const s = ctx.nodeRole[f] === "stop" ? f : t;
  const x = s === f ? t : f;
  const stop = ctx.nodes[s], part = ctx.nodes[x];
  if (stop.kind !== "travelStop") return;
  const role = ctx.nodeRole[x];
  if (role === "link" || role === "mount" || role === "stop") return; // stops the pushrod's axial load, or nothing
  const m = partMoment(ctx, loads, x);
  const arm = stop.props.arm;
  if (arm === undefined || m === null) {
    loadTodo[j] = `enter the arm of ${nodeLabel(stop)} from the pivot of ${nodeLabel(part)}`;
    return;
  }
  loads.jointRadial[j] = m / arm;
  loads.jointFrom[j] = taintAt(ctx, loads, x);
  // Where the stop or the surface's travel is a starting value, the comparison is left to the motion and unentered notes.
  if (part.kind === "controlSurface" && !unenteredOf(stop, STOP_KEY).length && !unenteredOf(part, TRAVEL_KEYS).length) {
    // The stop acts one way: a positive angle stops the surface going up, a negative one going down.
    const up = stop.props.stopAt >= 0;
    const travel = up ? part.props.travelUp : part.props.travelDown;
    if (Math.abs(stop.props.stopAt) > travel)
      out.push(finding("stop-beyond-travel", "caution", nodeSubject(stop.id),
        `${nodeLabel(stop)} contacts at ${fmt(Math.abs(stop.props.stopAt), 1)}° ${up ? "up" : "down"}, past the ${fmt(travel, 1)}° ${up ? "up" : "down"} travel of ${nodeLabel(part)}: the surface reaches its limit before the stop does. Set the stop to contact at or before the surface's travel.`,
        STOP_SRC, [num("stop angle", Math.abs(stop.props.stopAt), "°"), num("surface travel", travel, "°")]));
  }
}

/** What a hinge joint needs before it is checked: the designer's hinge load. */
export const HINGE_LOAD_TODO = "enter the designer's limit load on this hinge (the surface's air load) on the joint's card";

function hingeLoad(ctx: Ctx, loads: Loads, j: number, loadTodo: (string | null)[]) {
  const given = ctx.joints[j].hardware?.hingeLoad;
  if (given === undefined) {
    loadTodo[j] = HINGE_LOAD_TODO;
    return;
  }
  // common practice, no source: the air load's reaction and the control system's added in line (conservative).
  loads.jointRadial[j] += given;
}

function hornBolts(ctx: Ctx, loads: Loads, j: number, loadTodo: (string | null)[], out: Finding[]) {
  const f = ctx.jFrom[j], t = ctx.jTo[j];
  if (f < 0 || t < 0) return;
  const h = ctx.nodeRole[f] === "horn" ? f : t;
  const horn = ctx.nodes[h];
  if (horn.kind !== "controlHorn") return;
  const n = horn.props.boltCount, s = horn.props.boltSpacing;
  if (n === undefined || (n > 1 && s === undefined)) {
    loadTodo[j] = `enter the number of bolts holding ${nodeLabel(horn)} to its surface and their spacing`;
    return;
  }
  const force = portForce(ctx, loads, h, "attach");
  const e = ENGINE[horn.kind] as Extract<EngineInfo<typeof horn.props>, { role: "horn" }>;
  const m = force * e.effectiveArm(horn.props);
  if (n === 1) {
    loadTodo[j] = `a single bolt cannot hold ${nodeLabel(horn)} against the hinge moment's couple: add a second bolt, or key or clamp the horn and check it by hand`;
    if (m > 0)
      out.push(finding("horn-single-bolt", "caution", jointSubject(ctx.joints[j].id),
        `${nodeLabel(horn)} is held to its surface by one bolt. The hinge moment (${fmt(m)} in·lbf limit) turns a horn about a single bolt; only a second bolt, a key or a clamp holds it. This joint is not checked.`,
        HORN_SRC, [num("hinge moment, limit", m, "in·lbf")]));
    return;
  }
  const couple = (6 * m) / (s! * n * (n + 1));
  loads.jointRadial[j] = force / n + couple;
  loads.jointFrom[j] = taintAt(ctx, loads, h);
}
