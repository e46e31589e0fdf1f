/**
 * How a person reads a part, a port, a joint or the subject of a finding — the one way, used by the editor,
 * the findings, e-mail, the checklist, the hardware list and the PDFs. A part is its label, or its kind's
 * name when it has none; a joint is its two ends, each the part and the port's name:
 * "Aft pushrod B ↔ Elevator horn, attach". Never an internal id.
 */
import { KIND_NAMES, portDef } from "./kinds";
import type { Joint, LinkageNode } from "./schema";

type Part = Pick<LinkageNode, "kind" | "label">;
/** Parts by id: a Map, or a list (indexed once per array, see indexById). */
export type PartLookup = ReadonlyMap<string, Part> | readonly (Part & { id: string })[];

const indexes = new WeakMap<readonly { id: string }[], Map<string, { id: string }>>();
/**
 * id → item of a parts or joints array (the first with that id, as `find` would), built once per array.
 * Arrays of a graph or of the editor store are replaced, never mutated, so naming many subjects of one
 * array does one pass over it instead of one per name.
 */
export function indexById<T extends { id: string }>(list: readonly T[]): Map<string, T> {
  let m = indexes.get(list);
  if (!m) {
    m = new Map();
    for (const x of list) if (!m.has(x.id)) m.set(x.id, x);
    indexes.set(list, m);
  }
  return m as Map<string, T>;
}

const lookup = (parts: PartLookup, id: string): Part | undefined =>
  parts instanceof Map ? parts.get(id) : indexById(parts as readonly (Part & { id: string })[]).get(id);

/** A part: its label, or its kind's name ("Pushrod") when it has none. */
export function partName(part: Part | undefined): string {
  if (!part) return "a part no longer in the drawing";
  const label = part.label?.trim();
  return label || (KIND_NAMES as Record<string, string>)[part.kind] || "Part";
}

/** A port of a kind as a person reads it: "attach", "pivot", "B". */
export function portName(kind: string, port: string): string {
  return portDef(kind, port)?.name ?? port;
}

/** One end of a joint: "Aft pushrod B", "Elevator horn, attach". */
export function endName(part: Part | undefined, port: string): string {
  if (!part) return partName(part);
  const def = portDef(part.kind, port);
  return def?.end ? `${partName(part)} ${def.name}` : `${partName(part)}, ${def?.name ?? port}`;
}

/** A joint: "Aft pushrod B ↔ Elevator horn, attach". */
export function jointName(joint: Pick<Joint, "from" | "to">, parts: PartLookup): string {
  return `${endName(lookup(parts, joint.from.node), joint.from.port)} ↔ ${endName(lookup(parts, joint.to.node), joint.to.port)}`;
}

export type SubjectRef = { type: "node" | "joint" | "linkage"; id: string };
type GraphLike = { nodes: readonly LinkageNode[]; joints: readonly Joint[] };

/** What a finding, comment or acknowledgement is about, named: a part, a joint, or "Whole linkage". */
export function subjectName(graph: GraphLike, s: SubjectRef): string {
  if (s.type === "node") return partName(indexById(graph.nodes).get(s.id));
  if (s.type === "joint") {
    const j = indexById(graph.joints).get(s.id);
    return j ? jointName(j, graph.nodes) : "a joint no longer in the drawing";
  }
  return "Whole linkage";
}

/** The same with what it is, for a sentence: "the joint Aft pushrod B ↔ Elevator horn, attach". */
export function subjectPhrase(graph: GraphLike, s: SubjectRef): string {
  if (s.type === "linkage") return "the linkage";
  return `the ${s.type === "node" ? "part" : "joint"} ${subjectName(graph, s)}`;
}
