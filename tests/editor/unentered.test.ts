/**
 * A part's values still at the starting values it was placed with (`unentered`, shared/linkage/schema.ts): the
 * editor store marks them when a part is placed, forgets one when an edit changes its value, forgets them
 * when the builder confirms them (one undoable step), and keeps them through copy, paste, duplicate and the
 * return cable. The check takes nothing from a value so marked, so each of these matters.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { createEditorStore, toGraph } from "@/editor/store";
import { emptyGraph, graphSchema, nodeSchema, type LinkageNode } from "@/shared/linkage/schema";
import { defaultProps, NODE_KINDS } from "@/shared/linkage/kinds";
import { loadSchema } from "@/editor/store/schema";

// The cards load the graph schema before they show (editor/panels/Inspector.tsx); so do these tests.
beforeAll(() => loadSchema());

function make(opts: { readOnly?: boolean } = {}, graph = emptyGraph("Pitch", "pitch")) {
  let i = 0;
  let t = 0;
  const store = createEditorStore(graph, { revision: 1, newId: (k) => `${k}-${++i}`, now: () => (t += 10_000), ...opts });
  return { store, s: () => store.getState() };
}

const node = (s: () => ReturnType<ReturnType<typeof make>["s"]>, id: string) => s().nodes.find((n) => n.id === id) as LinkageNode;
const PUSHROD_KEYS = ["material", "outsideDiameter", "wall", "length"];

describe("placing a part", () => {
  it("marks every starting value it was given as unentered, in the props' order", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 });
    expect(node(s, id).unentered).toEqual(PUSHROD_KEYS);
    expect(Object.keys(node(s, id).props)).toEqual(PUSHROD_KEYS);
  });

  it("does not mark the values its placer supplied", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 }, { props: { outsideDiameter: 0.75, wall: 0.049 } });
    expect(node(s, id).unentered).toEqual(["material", "length"]);
    expect(node(s, id).props).toMatchObject({ outsideDiameter: 0.75, wall: 0.049, length: 36 });
  });

  it("omits the field when the placer supplied every starting value", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 }, { props: { material: "4130N", outsideDiameter: 0.5, wall: 0.035, length: 36 } });
    expect(node(s, id)).not.toHaveProperty("unentered");
  });

  it("leaves a blank text out (a mount's empty note claims nothing)", () => {
    const { s } = make();
    const id = s().addNode("structureMount", { x: 0, y: 0 });
    expect(defaultProps("structureMount")).toEqual({ note: "" });
    expect(node(s, id)).not.toHaveProperty("unentered");
  });

  it("places every kind, without the schema, as the schema would give it back", () => {
    const { s } = make();
    for (const kind of NODE_KINDS) {
      const id = s().addNode(kind, { x: 0, y: 0 });
      const n = node(s, id);
      expect(JSON.stringify(nodeSchema.parse(n)), kind).toBe(JSON.stringify(n));
    }
    expect(graphSchema.safeParse(toGraph(s())).success).toBe(true);
  });
});

describe("editing a part's values", () => {
  it("forgets only the value the edit changed", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 });
    const r = s().updateNode(id, { props: { ...node(s, id).props, wall: 0.049 } });
    expect(r.ok).toBe(true);
    expect(node(s, id).unentered).toEqual(["material", "outsideDiameter", "length"]);
    expect(node(s, id).props).toMatchObject({ wall: 0.049 });
  });

  it("keeps a value sent unchanged marked (a form sends every field), and a label edit marks nothing", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 });
    const props = { ...node(s, id).props };
    expect(s().updateNode(id, { label: "Aft pushrod", props }).ok).toBe(true);
    expect(node(s, id).label).toBe("Aft pushrod");
    expect(node(s, id).unentered).toEqual(PUSHROD_KEYS);
  });

  it("drops the field when the last marked value is changed", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 }, { props: { material: "6061-T6", outsideDiameter: 0.75, wall: 0.049 } });
    expect(node(s, id).unentered).toEqual(["length"]);
    s().updateNode(id, { props: { ...node(s, id).props, length: 30 } });
    expect(node(s, id)).not.toHaveProperty("unentered");
    expect(nodeSchema.parse(node(s, id))).toEqual(node(s, id));
  });

  it("undo brings a changed value back with its mark", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 });
    s().updateNode(id, { props: { ...node(s, id).props, length: 30 } });
    expect(node(s, id).unentered).not.toContain("length");
    s().undo();
    expect(node(s, id).props).toMatchObject({ length: 36 });
    expect(node(s, id).unentered).toEqual(PUSHROD_KEYS);
  });
});

describe("confirming a part's starting values", () => {
  it("forgets every mark when no keys are named, values unchanged, in one undoable step", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 });
    const props = node(s, id).props;
    const past = s().past.length;
    expect(s().confirmValues(id).ok).toBe(true);
    expect(node(s, id)).not.toHaveProperty("unentered");
    expect(node(s, id).props).toBe(props);
    expect(s().past.length).toBe(past + 1);
    expect(s().dirty).toBe(true);
    s().undo();
    expect(node(s, id).unentered).toEqual(PUSHROD_KEYS);
    s().redo();
    expect(node(s, id)).not.toHaveProperty("unentered");
  });

  it("forgets only the keys named", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 });
    s().confirmValues(id, ["material", "length"]);
    expect(node(s, id).unentered).toEqual(["outsideDiameter", "wall"]);
    s().confirmValues(id, ["outsideDiameter", "wall"]);
    expect(node(s, id)).not.toHaveProperty("unentered");
    s().undo();
    expect(node(s, id).unentered).toEqual(["outsideDiameter", "wall"]);
  });

  it("is no step at all when nothing it names is marked", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 }, { props: { length: 30 } });
    const past = s().past.length;
    const nodes = s().nodes;
    expect(s().confirmValues(id, ["length"]).ok).toBe(true);
    expect(s().nodes).toBe(nodes);
    expect(s().past.length).toBe(past);
    expect(s().confirmValues("nope").ok).toBe(false);
  });

  it("is refused on a read-only linkage", () => {
    const { s } = make();
    const id = s().addNode("pushrod", { x: 0, y: 0 });
    const ro = createEditorStore(toGraph(s()), { readOnly: true });
    const r = ro.getState().confirmValues(id);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/read-only/);
    expect(ro.getState().nodes[0].unentered).toEqual(PUSHROD_KEYS);
    expect(ro.getState().dirty).toBe(false);
    // Nor does an edit of a read-only linkage forget a mark.
    expect(ro.getState().updateNode(id, { props: { ...ro.getState().nodes[0].props, length: 30 } }).ok).toBe(false);
    expect(ro.getState().nodes[0].unentered).toEqual(PUSHROD_KEYS);
  });
});

describe("copies of a part", () => {
  it("duplicate, copy and paste keep the marks as they were on the original", () => {
    const { s } = make();
    const a = s().addNode("pushrod", { x: 0, y: 0 });
    s().updateNode(a, { props: { ...node(s, a).props, wall: 0.049 } });
    const b = s().addNode("bellcrank", { x: 200, y: 0 });
    s().confirmValues(b);
    s().setSelection({ nodes: [a, b], joints: [] });
    s().duplicate();
    const [da, db] = s().selection.nodes;
    expect(node(s, da).unentered).toEqual(["material", "outsideDiameter", "length"]);
    expect(node(s, db)).not.toHaveProperty("unentered");
    s().setSelection({ nodes: [a], joints: [] });
    s().copy();
    s().paste();
    s().paste({ x: 500, y: 500 });
    const pasted = s().nodes.slice(-2);
    for (const p of pasted) expect(p.unentered).toEqual(["material", "outsideDiameter", "length"]);
    expect(graphSchema.safeParse(toGraph(s())).success).toBe(true);
  });

  it("the return cable keeps the marks of the values it copies from its cable", () => {
    const { s } = make();
    const sector = s().addNode("cableSector", { x: 0, y: 0 });
    const cable = s().addNode("cable", { x: 200, y: 0 }, { props: { size: "3/32" } });
    const horn = s().addNode("controlHorn", { x: 400, y: 0 });
    s().connect({ node: sector, port: "out" }, { node: cable, port: "a" });
    s().connect({ node: cable, port: "b" }, { node: horn, port: "attach" });
    expect(node(s, cable).unentered).toEqual(["construction", "material", "terminalA", "terminalB"]);
    const ret = s().addReturnCable(cable);
    expect(node(s, ret).unentered).toEqual(["construction", "material", "terminalA", "terminalB"]);
    expect(JSON.stringify(nodeSchema.parse(node(s, ret)))).toBe(JSON.stringify(node(s, ret)));
  });
});
