// Drawing a circuit: one cable drawn, its return offered and made in one undoable step, and the check sees one closed circuit.
import { beforeAll, describe, expect, it } from "vitest";
import { createEditorStore, toGraph } from "@/editor/store";
import { returnCableEnds, returnableCable } from "@/editor/store/cable";
import { COMMANDS, handleKey, type CommandCtx } from "@/editor/commands";
import { emptyGraph, nodeSchema } from "@/shared/linkage/schema";
import { analyze } from "@/shared/analysis";
import { loadSchema } from "@/editor/store/schema";

// The cards load the graph schema before they show (editor/panels/Inspector.tsx); so do these tests.
beforeAll(() => loadSchema());

function sectorToHorn() {
  let i = 0;
  const store = createEditorStore(emptyGraph("Elevator cables", "pitch"), { revision: 1, newId: (k) => `${k}-${++i}`, now: () => 0 });
  const s = () => store.getState();
  const sector = s().addNode("cableSector", { x: 0, y: 0 });
  const cable = s().addNode("cable", { x: 200, y: 0 }, { label: "Up cable", props: { size: "1/8", riggingTension: 30, riggingTemperature: 70, tensionMin: 25, tensionMax: 35 } });
  const horn = s().addNode("controlHorn", { x: 400, y: 0 });
  return { store, s, sector, cable, horn };
}

describe("the return cable", () => {
  it("is not offered until the cable is joined at both ends", () => {
    const { s, sector, cable } = sectorToHorn();
    expect(returnCableEnds(s(), cable)).toBeNull();
    s().connect({ node: sector, port: "out" }, { node: cable, port: "a" });
    expect(returnCableEnds(s(), cable)).toBeNull();
    expect(s().addReturnCable(cable)).toBe("");
    expect(s().notice?.text).toMatch(/not joined at both ends/);
  });

  it("joins the same two ports, copies the cable's make but not its rigging reading, and is one step to undo", () => {
    const { s, sector, cable, horn } = sectorToHorn();
    s().connect({ node: sector, port: "out" }, { node: cable, port: "a" });
    s().connect({ node: cable, port: "b" }, { node: horn, port: "attach" });
    expect(analyze(toGraph(s())).findings.map((f) => f.code)).not.toContain("linkage-loop");
    const before = { nodes: s().nodes.length, joints: s().joints.length };
    const id = s().addReturnCable(cable);
    expect(id).not.toBe("");
    const ret = s().nodes.find((n) => n.id === id)!;
    expect(ret).toMatchObject({ kind: "cable", label: "Up cable (return)", props: { size: "1/8", tensionMin: 25, tensionMax: 35 } });
    expect((ret.props as { riggingTension?: number }).riggingTension).toBeUndefined();
    // Made without the schema, it is what the schema makes of it.
    expect(JSON.stringify(nodeSchema.parse(ret))).toBe(JSON.stringify(ret));
    expect(nodeSchema.parse(ret)).toEqual(ret);
    const ends = s().joints.filter((j) => j.from.node === id).map((j) => [j.from.port, j.to.node, j.to.port]);
    expect(ends).toEqual([["a", sector, "out"], ["b", horn, "attach"]]);
    expect(returnCableEnds(s(), cable)).toBeNull(); // offered once
    expect(returnCableEnds(s(), id)).toBeNull();
    const g = toGraph(s());
    expect(analyze(g).findings.filter((f) => f.code === "cable-pushes" || f.code === "linkage-loop")).toEqual([]);
    s().undo();
    expect({ nodes: s().nodes.length, joints: s().joints.length }).toEqual(before);
  });
});

describe("the return cable from the joint just drawn, and by key", () => {
  const press = (store: ReturnType<typeof sectorToHorn>["store"], canEdit = true) =>
    handleKey({ key: "r", ctrlKey: false, metaKey: false, shiftKey: false, altKey: false, target: null, preventDefault: () => {} } as unknown as KeyboardEvent,
      { store, canEdit } as unknown as CommandCtx);

  it("is offered on the joint that closes the cable's second end (the selection after drawing it)", () => {
    const { s, sector, cable, horn } = sectorToHorn();
    s().connect({ node: sector, port: "out" }, { node: cable, port: "a" });
    expect(returnableCable(s())).toBeNull(); // the first end only
    const joint = s().connect({ node: cable, port: "b" }, { node: horn, port: "attach" });
    expect(s().selection).toEqual({ nodes: [], joints: [joint.ok ? joint.value : ""] });
    expect(returnableCable(s())).toBe(cable);
    s().select({ type: "node", id: horn });
    expect(returnableCable(s())).toBeNull(); // not a cable, not a joint
  });

  it("R adds it once; R does nothing for someone who may not edit", () => {
    const { store, s, sector, cable, horn } = sectorToHorn();
    s().connect({ node: sector, port: "out" }, { node: cable, port: "a" });
    s().connect({ node: cable, port: "b" }, { node: horn, port: "attach" });
    press(store, false);
    expect(s().nodes.filter((n) => n.kind === "cable")).toHaveLength(1);
    press(store);
    expect(s().nodes.filter((n) => n.kind === "cable")).toHaveLength(2);
    press(store); // the new cable is selected and already has its return
    expect(s().nodes.filter((n) => n.kind === "cable")).toHaveLength(2);
    expect(s().notice?.text).toMatch(/Select a cable joined at both ends/);
    expect(COMMANDS.find((c) => c.id === "returnCable")!.keys).toBe("R");
  });
});

describe("the return cable's starting values", () => {
  it("copies the marks of the values it copies: a starting size stays a starting size", () => {
    const { s, sector, cable, horn } = sectorToHorn();
    s().connect({ node: sector, port: "out" }, { node: cable, port: "a" });
    s().connect({ node: cable, port: "b" }, { node: horn, port: "attach" });
    expect(s().nodes.find((n) => n.id === cable)!.unentered).toEqual(["construction", "material", "terminalA", "terminalB"]);
    const back = s().addReturnCable(cable);
    const node = s().nodes.find((n) => n.id === back)!;
    expect(node.unentered).toEqual(["construction", "material", "terminalA", "terminalB"]);
    expect(nodeSchema.parse(node)).toEqual(node);
  });
});
