/**
 * Geometry for the demo run and for generated runs (benchmarks, tests): side view, inches from the
 * firewall face (x aft) and the top longeron (y up). Every pushrod lies level at neutral and square to
 * both arms it joins, so the perpendicular-arm loads and the swept loads agree at neutral.
 */
import type { LinkageGeometry, PartGeometry } from "./linkage/geometry";
import type { LinkageGraph } from "./linkage/schema";
import { ENGINE } from "./linkage/kinds";
import { buildContext, jointsAt, otherNode, otherPort } from "./analysis/context";

const part = (x: number, y: number, arms: PartGeometry["arms"]): PartGeometry => ({ pivot: { x, y }, arms, offsets: {} });

/** The demo pitch run (shared/demo.ts) drawn to scale: stick at station 20, bellcrank at 50, elevator hinge at 122. */
export function demoPitchGeometry(): LinkageGeometry {
  return {
    plane: "side", datum: "firewall face, top longeron", inputForward: "ccw", surfaceUp: "ccw",
    parts: {
      stick: part(20, 0, { attach: -90, grip: 90 }),
      bellcrank: part(50, -3, { in: -90, out: 90 }),
      horn: part(122, 6, { attach: -90 }), // the 5 in arm down to y 1, level with the bellcrank's output arm
    },
  };
}

/**
 * Geometry for a single-path run (the generated linkages of one branch): each crank's input arm down and
 * output arm up, pushrods level at their card length. Parts off the path get none.
 */
export function chainGeometry(graph: LinkageGraph): LinkageGeometry {
  const ctx = buildContext(graph);
  const parts: Record<string, PartGeometry> = {};
  const start = ctx.nodes.findIndex((n) => ctx.nodeRole[ctx.nodeIndex.get(n.id)!] === "input");
  let cur = start, port = "attach", end = { x: 0, y: 0 }; // the attach point of the current driver
  if (cur >= 0) {
    const [, attach] = (ENGINE[ctx.nodes[cur].kind] as { arms: (p: unknown) => [number, number] }).arms(ctx.nodes[cur].props);
    parts[ctx.nodes[cur].id] = part(0, attach, { attach: -90, grip: 90 });
  }
  for (let guard = 0; cur >= 0 && guard < ctx.nodes.length; guard++) {
    // The pushrod on this arm (a travel stop or another part may share the port).
    const j = jointsAt(ctx, cur, port).find((x) => ctx.nodeRole[otherNode(ctx, x, cur)] === "link");
    if (j === undefined) break;
    const rod = otherNode(ctx, j, cur);
    const far = jointsAt(ctx, rod, otherPort(ctx, j, cur) === "a" ? "b" : "a");
    if (!far.length) break;
    const next = otherNode(ctx, far[0], rod);
    const len = (ctx.nodes[rod].props as { length: number }).length;
    const x = end.x + len;
    const node = ctx.nodes[next];
    if (ctx.nodeRole[next] === "horn") {
      parts[node.id] = part(x, end.y + (node.props as { hornArm: number }).hornArm, { attach: -90 });
      break;
    }
    const [inArm, outArm] = (ENGINE[node.kind] as { arms: (p: unknown) => [number, number] }).arms(node.props);
    const py = end.y + inArm;
    parts[node.id] = part(x, py, { in: -90, out: 90 });
    end = { x, y: py + outArm };
    cur = next;
    port = "out";
  }
  return { plane: "side", datum: "generated", inputForward: "ccw", surfaceUp: "ccw", parts };
}
