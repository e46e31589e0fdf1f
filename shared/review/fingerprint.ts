/**
 * A stable fingerprint of what a finding is about: a joint's hardware, a node's kind and props, or the
 * shape of the whole linkage. An acknowledgement keeps the fingerprint of its subject; when the
 * fingerprint of the same subject in a later revision differs, the acknowledgement has lapsed.
 * Pure (no I/O, no node:crypto) so the browser can compute it too.
 */
import type { LinkageGraph } from "../linkage/schema";
import type { Subject } from "../analysis/types";

/** JSON with object keys sorted, so equal values always give equal text. */
export function stableStringify(v: unknown): string {
  if (v === undefined) return "null";
  if (v === null || typeof v !== "object") return JSON.stringify(v);
  if (Array.isArray(v)) return `[${v.map(stableStringify).join(",")}]`;
  const o = v as Record<string, unknown>;
  return `{${Object.keys(o)
    .filter((k) => o[k] !== undefined)
    .sort()
    .map((k) => `${JSON.stringify(k)}:${stableStringify(o[k])}`)
    .join(",")}}`;
}

/** cyrb53-style 2×32-bit hash rendered as 16 hex digits: not cryptographic, only a change detector. */
export function hashText(s: string): string {
  let h1 = 0xdeadbeef ^ s.length,
    h2 = 0x41c6ce57 ^ s.length;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    h1 = Math.imul(h1 ^ c, 2654435761);
    h2 = Math.imul(h2 ^ c, 1597334677);
  }
  h1 = Math.imul(h1 ^ (h1 >>> 16), 2246822507) ^ Math.imul(h2 ^ (h2 >>> 13), 3266489909);
  h2 = Math.imul(h2 ^ (h2 >>> 16), 2246822507) ^ Math.imul(h1 ^ (h1 >>> 13), 3266489909);
  return (h2 >>> 0).toString(16).padStart(8, "0") + (h1 >>> 0).toString(16).padStart(8, "0");
}

/** What of a subject counts: hardware without the free-text note and the photo list; node kind and props. */
export function subjectMaterial(graph: LinkageGraph, subject: Subject): unknown | null {
  if (subject.type === "joint") {
    const j = graph.joints.find((x) => x.id === subject.id);
    if (!j) return null;
    const { note: _note, photos: _photos, ...hardware } = j.hardware;
    return { from: j.from, to: j.to, hardware };
  }
  if (subject.type === "node") {
    const n = graph.nodes.find((x) => x.id === subject.id);
    return n ? nodeMaterial(n) : null;
  }
  // The linkage as a whole: its parts and how they are joined, with every joint's hardware.
  return {
    nodes: graph.nodes.map((n) => ({ id: n.id, ...nodeMaterial(n) })).sort((a, b) => a.id.localeCompare(b.id)),
    joints: graph.joints.map((j) => ({ id: j.id, material: subjectMaterial(graph, { type: "joint", id: j.id }) })).sort((a, b) => a.id.localeCompare(b.id)),
  };
}

/**
 * A part as signed: its kind, its values and which of them are still starting values (confirming one changes what
 * the check says of the run, so a sign-off given before it is stale). Absent `unentered` adds nothing, so
 * revisions from before it existed keep their fingerprints.
 */
function nodeMaterial(n: LinkageGraph["nodes"][number]) {
  return n.unentered?.length ? { kind: n.kind, props: n.props, unentered: [...n.unentered].sort() } : { kind: n.kind, props: n.props };
}

/** The fingerprint, or null when the subject is not in this graph. */
export function fingerprint(graph: LinkageGraph, subject: Subject): string | null {
  const m = subjectMaterial(graph, subject);
  return m === null ? null : hashText(stableStringify(m));
}

export const subjectKey = (s: Subject) => `${s.type}:${s.id}`;
