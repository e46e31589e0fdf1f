/**
 * Drawing a cable circuit as quickly as a pushrod run: a cable joined at both ends with no other cable between
 * the same two parts is offered its return cable, made in one undoable step (a cable joined to the same two
 * ports, so the two pull opposite ways and the check sees one closed circuit).
 */
import type { Joint, LinkageNode } from "@/shared/linkage/schema";
import { defaultHardware } from "@/shared/linkage/format";
import type { CableActions, EditorState, Endpoint } from "./types";
import type { Commit } from "./history";

type Get = () => EditorState;

/** The two far ends of a cable joined at both terminals, when it has no return yet; otherwise null. */
export function returnCableEnds(s: Pick<EditorState, "nodes" | "joints">, cableId: string): { a: Endpoint; b: Endpoint } | null {
  const cable = s.nodes.find((n) => n.id === cableId);
  if (!cable || cable.kind !== "cable") return null;
  const far = (port: string): Endpoint | null => {
    const j = s.joints.find((x) => (x.from.node === cableId && x.from.port === port) || (x.to.node === cableId && x.to.port === port));
    if (!j) return null;
    return j.from.node === cableId ? j.to : j.from;
  };
  const a = far("a"), b = far("b");
  if (!a || !b) return null;
  const cables = new Set(s.nodes.filter((n) => n.kind === "cable" && n.id !== cableId).map((n) => n.id));
  const touches = (nodeId: string) => {
    const out = new Set<string>();
    for (const j of s.joints) {
      if (j.from.node === nodeId && cables.has(j.to.node)) out.add(j.to.node);
      if (j.to.node === nodeId && cables.has(j.from.node)) out.add(j.from.node);
    }
    return out;
  };
  const atA = touches(a.node);
  for (const c of touches(b.node)) if (atA.has(c)) return null; // another cable already joins the same two parts
  return { a, b };
}

/**
 * The cable the selection would add a return to: the one selected cable, or the cable at either end of the one
 * selected joint (the joint just drawn), when it has no return yet; otherwise null.
 */
export function returnableCable(s: Pick<EditorState, "nodes" | "joints" | "selection">): string | null {
  const { nodes, joints } = s.selection;
  let ids: string[] = [];
  if (nodes.length === 1 && joints.length === 0) ids = [nodes[0]];
  else if (joints.length === 1 && nodes.length === 0) {
    const j = s.joints.find((x) => x.id === joints[0]);
    if (j) ids = [j.from.node, j.to.node];
  }
  for (const id of ids) if (returnCableEnds(s, id)) return id;
  return null;
}

export function cableActions(get: Get, commit: Commit, newId: (kind: string) => string): CableActions {
  return {
    /** Adds the return cable of `cableId` (same size and make, no rigging reading of its own) and joins it; returns its id or "". */
    addReturnCable(cableId: string): string {
      const s = get();
      if (s.readOnly) return "";
      const ends = returnCableEnds(s, cableId);
      const cable = s.nodes.find((n) => n.id === cableId) as Extract<LinkageNode, { kind: "cable" }> | undefined;
      if (!ends || !cable) {
        s.setNotice("This cable is not joined at both ends, or it already has its return cable.");
        return "";
      }
      const { size, construction, material, length, terminalA, terminalB, tensionMin, tensionMax, rangeTemperature } = cable.props;
      const id = newId("cable");
      // Fields of a cable that passed the schema, in its key order: the node schema would give it back as it
      // is (tests/editor/return-cable.test.ts), so the return cable needs no schema.
      const node: LinkageNode = {
        id, kind: "cable", label: `${cable.label || "Cable"} (return)`,
        position: { x: cable.position.x, y: cable.position.y + 120 },
        props: { size, construction, material, length, terminalA, terminalB, tensionMin, tensionMax, rangeTemperature },
      };
      // A value copied from a starting value is a starting value still (shared/analysis/unentered.ts).
      const unentered = cable.unentered?.filter((k) => k in node.props);
      if (unentered?.length) node.unentered = unentered;
      const joint = (port: string, to: Endpoint): Joint => ({ id: newId("joint"), from: { node: id, port }, to: { ...to }, hardware: defaultHardware() });
      commit({ nodes: [...s.nodes, node], joints: [...s.joints, joint("a", ends.a), joint("b", ends.b)], selection: { nodes: [id], joints: [] } });
      return id;
    },
  };
}
