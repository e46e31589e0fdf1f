/**
 * A run read in order along its load path: from each input (the stick, the pedals) through the joints and
 * parts it drives, each part followed by the joints that lead on from it. The list view of the editor, the
 * phone's view of a linkage and a screen reader read parts and joints in this order.
 * Linear in parts + joints (one adjacency pass, an explicit stack; no recursion on long runs).
 */
import { roleOf } from "./kinds";
import type { Joint, LinkageNode } from "./schema";

export type RunItem =
  | { type: "node"; id: string; depth: number }
  | { type: "joint"; id: string; depth: number };

/** Parts that end a branch (a mount, a stop): read right after the part they hold, before the run goes on. */
const terminal = (kind: string) => {
  const r = roleOf(kind);
  return r === "mount" || r === "stop";
};

export function runOrder(graph: { nodes: readonly Pick<LinkageNode, "id" | "kind">[]; joints: readonly Pick<Joint, "id" | "from" | "to">[] }): RunItem[] {
  const kindOf = new Map<string, string>();
  const adj = new Map<string, { joint: string; other: string }[]>();
  for (const n of graph.nodes) {
    adj.set(n.id, []);
    kindOf.set(n.id, n.kind);
  }
  for (const j of graph.joints) {
    adj.get(j.from.node)?.push({ joint: j.id, other: j.to.node });
    if (j.to.node !== j.from.node) adj.get(j.to.node)?.push({ joint: j.id, other: j.from.node });
  }
  const seenNode = new Set<string>();
  const seenJoint = new Set<string>();
  const out: RunItem[] = [];
  const emitJoint = (id: string, depth: number) => {
    if (seenJoint.has(id)) return;
    seenJoint.add(id);
    out.push({ type: "joint", id, depth });
  };
  // Inputs first (where the pilot's force comes in), then any part not reached from one, in drawing order.
  const starts = [...graph.nodes.filter((n) => roleOf(n.kind) === "input"), ...graph.nodes];
  for (const start of starts) {
    if (seenNode.has(start.id)) continue;
    // Depth-first along the path. Each part is read right after the joint that leads to it; a joint back to a
    // part already read (a loop, a cable circuit) is read where it is met.
    const stack: { id: string; depth: number; via?: string }[] = [{ id: start.id, depth: 0 }];
    while (stack.length) {
      const { id, depth, via } = stack.pop()!;
      if (seenNode.has(id)) {
        if (via) emitJoint(via, depth);
        continue;
      }
      if (via) emitJoint(via, depth);
      seenNode.add(id);
      out.push({ type: "node", id, depth });
      const next = (adj.get(id) ?? []).filter((e) => !seenJoint.has(e.joint));
      for (const e of next) if (seenNode.has(e.other)) emitJoint(e.joint, depth + 1);
      const ahead = next.filter((e) => !seenNode.has(e.other));
      // Pushed so that branch ends (mounts, stops) pop first, then the run goes on in drawing order.
      const go = ahead.filter((e) => !terminal(kindOf.get(e.other) ?? ""));
      const ends = ahead.filter((e) => terminal(kindOf.get(e.other) ?? ""));
      for (let i = go.length - 1; i >= 0; i--) stack.push({ id: go[i].other, depth: depth + 1, via: go[i].joint });
      for (let i = ends.length - 1; i >= 0; i--) stack.push({ id: ends[i].other, depth: depth + 1, via: ends[i].joint });
    }
  }
  // Joints whose ends are not parts of this graph (a file that skipped the schema) still get a line.
  for (const j of graph.joints) emitJoint(j.id, 0);
  return out;
}
