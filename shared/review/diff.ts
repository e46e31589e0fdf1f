/**
 * What changed between two revisions of a linkage: parts and joints added, removed, and changed,
 * with every changed field as a dotted path and its old → new value. Positions on the canvas are
 * layout, not design, and are reported only as a count of moved parts. Every part and joint carries its
 * name (shared/linkage/names.ts), and a joint's ends are written by name, not by id. The one difference of
 * two graphs: the review history and the editor's conflict dialog both show it.
 */
import type { LinkageGraph } from "../linkage/schema";
import { endName, indexById, jointName, partName } from "../linkage/names";
import { valueWords } from "../analysis/unentered";

export type FieldChange = { path: string; before: unknown; after: unknown };
/** A part (with its kind and typed label) or a joint, and its name as shown. */
export type ItemRef = { id: string; name: string; kind?: string; label?: string };
export type ChangedItem = ItemRef & { fields: FieldChange[] };
export type GraphDiff = {
  linkage: FieldChange[];
  nodes: { added: ItemRef[]; removed: ItemRef[]; changed: ChangedItem[]; moved: number };
  joints: { added: ItemRef[]; removed: ItemRef[]; changed: ChangedItem[] };
  /** True when nothing but positions changed. */
  same: boolean;
};

const isPlainObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

/** Leaves of a value as dotted paths; arrays are leaves (compared whole). */
function flatten(v: unknown, prefix: string, out: Map<string, unknown>) {
  if (isPlainObject(v)) {
    const keys = Object.keys(v).filter((k) => v[k] !== undefined);
    if (keys.length === 0 && prefix) out.set(prefix, {});
    for (const k of keys) flatten(v[k], prefix ? `${prefix}.${k}` : k, out);
  } else out.set(prefix, v);
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** Field-by-field changes between two values (absent on one side = undefined there). */
export function diffFields(a: unknown, b: unknown, prefix = ""): FieldChange[] {
  const fa = new Map<string, unknown>();
  const fb = new Map<string, unknown>();
  flatten(a, prefix, fa);
  flatten(b, prefix, fb);
  const paths = [...new Set([...fa.keys(), ...fb.keys()])].sort();
  const out: FieldChange[] = [];
  for (const p of paths) {
    const x = fa.get(p);
    const y = fb.get(p);
    if (!same(x, y)) out.push({ path: p, before: x, after: y });
  }
  return out;
}

const endKey = (e: { node: string; port: string }) => `${e.node}\u0000${e.port}`;

type GraphPart = Pick<LinkageGraph, "nodes" | "joints"> & Partial<Pick<LinkageGraph, "name" | "system">>;

/** What changed from `a` (before, or mine) to `b` (after, or theirs). */
export function diffGraphs(a: GraphPart, b: GraphPart): GraphDiff {
  const linkage = diffFields({ name: a.name, system: a.system }, { name: b.name, system: b.system });

  const aNodes = new Map(a.nodes.map((n) => [n.id, n]));
  const bNodes = new Map(b.nodes.map((n) => [n.id, n]));
  const nodes: GraphDiff["nodes"] = { added: [], removed: [], changed: [], moved: 0 };
  const part = (n: LinkageGraph["nodes"][number]): ItemRef => ({ id: n.id, name: partName(n), kind: n.kind, label: n.label });
  for (const n of b.nodes) if (!aNodes.has(n.id)) nodes.added.push(part(n));
  for (const n of a.nodes) if (!bNodes.has(n.id)) nodes.removed.push(part(n));
  for (const n of b.nodes) {
    const old = aNodes.get(n.id);
    if (!old) continue;
    // Starting values in words ("grip arm and attach arm"), so confirming them shows as a change a reviewer can read.
    const starting = (x: typeof n) => (x.unentered?.length ? valueWords(x.unentered) : undefined);
    const fields = diffFields({ kind: old.kind, label: old.label, props: old.props, "starting values": starting(old) }, { kind: n.kind, label: n.label, props: n.props, "starting values": starting(n) });
    if (fields.length) nodes.changed.push({ ...part(n), fields });
    if (old.position.x !== n.position.x || old.position.y !== n.position.y) nodes.moved++;
  }

  const aJoints = new Map(a.joints.map((j) => [j.id, j]));
  const bJoints = new Map(b.joints.map((j) => [j.id, j]));
  const joint = (j: LinkageGraph["joints"][number], g: GraphPart): ItemRef => ({ id: j.id, name: jointName(j, g.nodes) });
  const end = (e: { node: string; port: string }, g: GraphPart) => endName(indexById(g.nodes).get(e.node), e.port);
  const joints: GraphDiff["joints"] = { added: [], removed: [], changed: [] };
  for (const j of b.joints) if (!aJoints.has(j.id)) joints.added.push(joint(j, b));
  for (const j of a.joints) if (!bJoints.has(j.id)) joints.removed.push(joint(j, a));
  for (const j of b.joints) {
    const old = aJoints.get(j.id);
    if (!old) continue;
    const fields = [
      // An end moved to another part or port (compared by id), shown by name.
      ...diffFields({ from: endKey(old.from), to: endKey(old.to) }, { from: endKey(j.from), to: endKey(j.to) }).map((f) => {
        const k = f.path as "from" | "to";
        return { path: k, before: end(old[k], a), after: end(j[k], b) };
      }),
      ...diffFields(old.hardware, j.hardware, "hardware"),
    ];
    if (fields.length) joints.changed.push({ ...joint(j, b), fields });
  }

  const isSame =
    linkage.length === 0 &&
    nodes.added.length + nodes.removed.length + nodes.changed.length === 0 &&
    joints.added.length + joints.removed.length + joints.changed.length === 0;
  return { linkage, nodes, joints, same: isSame };
}

/** A value as a person reads it in a diff. */
export function showValue(v: unknown): string {
  if (v === undefined) return "(not set)";
  if (v === null) return "(none)";
  if (typeof v === "boolean") return v ? "yes" : "no";
  if (typeof v === "string") return v === "" ? "(empty)" : v;
  if (typeof v === "number") return String(v);
  return JSON.stringify(v);
}
