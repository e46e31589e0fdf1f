/**
 * The parts of the linkage format that need no schema library: the version, the limits, the control systems
 * and tube materials, a joint's default hardware, an empty graph and the file text. The editor draws and edits
 * a linkage with these and loads the zod schemas (schema.ts) on first use; schema.ts re-exports them all.
 */
import type { JointHardware, LinkageGraph } from "./schema";

export const FORMAT_VERSION = 1 as const;

/**
 * What one linkage may hold. The check walks the run once from every stick, pedal and wheel, so its work is
 * (inputs + 1) × (parts + joints): capping the inputs keeps it linear in the graph's size. A real run has
 * one to four inputs (dual controls, two pedal sets); a whole aircraft's controls are several linkages.
 */
export const GRAPH_LIMITS = { parts: 10_000, joints: 20_000, inputs: 64 } as const;

export const SYSTEMS = ["pitch", "roll", "yaw", "flap", "trim", "other"] as const;
export type ControlSystem = (typeof SYSTEMS)[number];

export const TUBE_MATERIALS = ["4130N", "6061-T6", "2024-T3"] as const;

/**
 * The hardware of a new joint: what the hardware schema makes of `{}` (its defaults, in its key order;
 * tests/shared/linkage/format.test.ts checks the two agree). A new object each time.
 */
export function defaultHardware(): JointHardware {
  return { torqueStripe: false, photos: [], note: "" };
}

export function emptyGraph(name = "", system: ControlSystem = "other"): LinkageGraph {
  return { formatVersion: FORMAT_VERSION, name, system, nodes: [], joints: [] };
}

/** The file text of a linkage: fixed top-level key order, two-space indent, trailing newline. */
export function serializeLinkage(graph: LinkageGraph): string {
  const { formatVersion, name, system, nodes, joints, geometry } = graph;
  return JSON.stringify(geometry ? { formatVersion, name, system, nodes, joints, geometry } : { formatVersion, name, system, nodes, joints }, null, 2) + "\n";
}
