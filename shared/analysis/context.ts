/**
 * The indexed view of a graph every check works from: node index by id, joints by node and port.
 * Built once per analysis in one pass over nodes and one over joints (no quadratic lookups).
 * Tolerant of graphs that did not pass the schema: a joint whose end names a missing node gets -1.
 */
import type { Joint, LinkageGraph, LinkageNode } from "../linkage/schema";
import { roleOf as kindRole, type Role } from "../linkage/kinds";
import { jointName, partName } from "../linkage/names";
import type { JointRole } from "./types";

export type PortMap = Record<string, number[]>;

export type Ctx = {
  graph: LinkageGraph;
  nodes: LinkageNode[];
  joints: Joint[];
  nodeIndex: Map<string, number>;
  /** Per node: joint indices by port name (undefined when the node has no joints). */
  ports: (PortMap | undefined)[];
  /** Node index of each joint's from/to end, -1 when the node is missing. */
  jFrom: Int32Array;
  jTo: Int32Array;
  roles: JointRole[];
  /** Per node: its kind's role in the run (shared/linkage/kinds); undefined for a kind the registry does not know. */
  nodeRole: (Role | undefined)[];
  /** Per node: number of joints touching it. */
  degree: Int32Array;
};

const EMPTY: number[] = [];

export function buildContext(graph: LinkageGraph): Ctx {
  const nodes = Array.isArray(graph.nodes) ? graph.nodes : [];
  const joints = Array.isArray(graph.joints) ? graph.joints : [];
  const nodeIndex = new Map<string, number>();
  for (let i = 0; i < nodes.length; i++) if (!nodeIndex.has(nodes[i].id)) nodeIndex.set(nodes[i].id, i);
  const ports: (PortMap | undefined)[] = new Array(nodes.length);
  const jFrom = new Int32Array(joints.length);
  const jTo = new Int32Array(joints.length);
  const degree = new Int32Array(nodes.length);
  const roles: JointRole[] = new Array(joints.length);
  const nodeRole: (Role | undefined)[] = new Array(nodes.length);
  for (let i = 0; i < nodes.length; i++) nodeRole[i] = kindRole(nodes[i].kind);
  for (let j = 0; j < joints.length; j++) {
    const jt = joints[j];
    const f = nodeIndex.get(jt.from?.node) ?? -1;
    const t = nodeIndex.get(jt.to?.node) ?? -1;
    jFrom[j] = f;
    jTo[j] = t;
    if (f >= 0) addPort(ports, degree, f, jt.from.port, j);
    if (t >= 0 && t !== f) addPort(ports, degree, t, jt.to.port, j);
    roles[j] = f >= 0 && t >= 0 ? jointRole(nodeRole[f], jt.from.port, nodeRole[t], jt.to.port) : "other";
  }
  return { graph, nodes, joints, nodeIndex, ports, jFrom, jTo, roles, nodeRole, degree };
}

function addPort(ports: (PortMap | undefined)[], degree: Int32Array, n: number, port: string, j: number) {
  let m = ports[n];
  if (!m) ports[n] = m = {};
  const list = m[port];
  if (list) list.push(j);
  else m[port] = [j];
  degree[n]++;
}

export function jointsAt(ctx: Ctx, n: number, port: string): number[] {
  const m = ctx.ports[n];
  return (m && m[port]) || EMPTY;
}

/** Node index at the far end of joint j seen from node n (-1 when it is missing). No allocation. */
export function otherNode(ctx: Ctx, j: number, n: number): number {
  return ctx.jFrom[j] === n ? ctx.jTo[j] : ctx.jFrom[j];
}

/** Port at the far end of joint j seen from node n. */
export function otherPort(ctx: Ctx, j: number, n: number): string {
  const jt = ctx.joints[j];
  return ctx.jFrom[j] === n ? jt.to.port : jt.from.port;
}

/** The node index of the link (a pushrod) on joint j, the from end first; -1 when neither end is one. No allocation. */
export function pushrodNodeOf(ctx: Ctx, j: number): number {
  const f = ctx.jFrom[j];
  const t = ctx.jTo[j];
  if (f >= 0 && ctx.nodeRole[f] === "link") return f;
  if (t >= 0 && ctx.nodeRole[t] === "link") return t;
  return -1;
}

function jointRole(a: Role | undefined, pa: string, b: Role | undefined, pb: string): JointRole {
  if (a === "stop" || b === "stop") return "stop";
  if (pa === "pivot" || pb === "pivot") return "pivot";
  if ((a === "surface" && pa === "hinge") || (b === "surface" && pb === "hinge")) return "hinge";
  if ((a === "horn" && pa === "surface") || (b === "horn" && pb === "surface")) return "hornMount";
  if (a === "mount" || b === "mount") return "other";
  return "link";
}

/** How a message names a part: its name (shared/linkage/names.ts) in quotes; the finding's subject carries the id. */
export function nodeLabel(n: LinkageNode): string {
  return `"${partName(n)}"`;
}

/** How a message names joint j: "Aft pushrod B ↔ Elevator horn, attach" (shared/linkage/names.ts). */
export function jointLabel(ctx: Ctx, j: number): string {
  return jointName(ctx.joints[j], ctx.nodes);
}
