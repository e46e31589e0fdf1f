/**
 * What the builder sees of a part's values still at their starting values (`unentered`): the part's card says
 * so in words under each such field (tied to it by aria-describedby) and in one line with a button to confirm
 * them; the canvas card carries a small "N to enter" tab and says it in the part's accessible name. Rendered
 * to static markup (the pure project has no DOM), so the button's click is checked through the store action
 * it calls (tests/editor/unentered.test.ts). Also: a number box left as it was keeps its value exactly, so
 * typing in one field of an SI card neither changes nor unmarks another.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { ReactFlowProvider } from "@xyflow/react";
import { createEditorStore, toGraph, type EditorStore } from "@/editor/store";
import { EditorConfigContext, EditorStoreContext } from "@/editor/context";
import { loadSchema } from "@/editor/store/schema";
import { NodeInspector } from "@/editor/panels/Cards";
import { toCanonical } from "@/editor/panels/SchemaForm";
import { nodeSections } from "@/editor/panels/specs";
import { nodeTypes } from "@/editor/nodes";
import { partAccessibleName } from "@/editor/a11y";
import { inputText } from "@/editor/units";
import { emptyGraph, type LinkageNode, type NodeKind } from "@/shared/linkage/schema";

beforeAll(() => loadSchema());

/** A store opened on a graph holding one part (a server render reads the store's opening state). */
function opened(edit?: (s: EditorStore, id: string) => void, kind: NodeKind = "pushrod") {
  let i = 0;
  const draft = createEditorStore(emptyGraph("Pitch", "pitch"), { newId: (k) => `${k}-${++i}`, now: () => 0 });
  const id = draft.getState().addNode(kind, { x: 0, y: 0 });
  edit?.(draft, id);
  return { store: createEditorStore(toGraph(draft.getState()), { now: () => 0 }), id };
}

function card(store: EditorStore, id: string, readOnly = false) {
  return renderToStaticMarkup(
    createElement(EditorConfigContext.Provider, { value: { unitSystem: "US", readOnly } },
      createElement(EditorStoreContext.Provider, { value: store }, createElement(NodeInspector, { id }))),
  );
}

/** The attributes of the element whose data-testid is `testId`. */
function attrs(html: string, testId: string): string {
  const m = new RegExp(`<[a-z]+[^>]*data-testid="${testId}"[^>]*>`).exec(html);
  if (!m) throw new Error(`no element ${testId}`);
  return m[0];
}

describe("the part's card", () => {
  it("says under each field still at its starting value that it is one, tied to the box", () => {
    const { store, id } = opened();
    const html = card(store, id);
    for (const k of ["material", "outsideDiameter", "wall", "length"]) {
      const field = `node-form-props__${k}`;
      expect(html).toContain(`id="${field}-start"`);
      expect(attrs(html, `${field}-starting`)).toContain(`id="${field}-start"`);
      expect(attrs(html, field)).toMatch(new RegExp(`aria-describedby="[^"]*${field}-start`));
    }
    expect(html).toMatch(/starting value — enter yours/);
    // The label is a value of the card, not of the part: never marked.
    expect(html).not.toContain("node-form-label-starting");
  });

  it("shows one line with the count and a button to confirm them", () => {
    const { store, id } = opened();
    const html = card(store, id);
    expect(attrs(html, "starting-values")).toBeTruthy();
    expect(html).toContain("4 values are still the starting values: the check uses none of them");
    const button = attrs(html, "btn-confirm-values");
    expect(button).toMatch(/^<button type="button"/);
    expect(html).toMatch(/data-testid="btn-confirm-values"[^>]*>These values are right<\/button>/);
  });

  it("marks only the fields still unentered after an edit, and says 1 value in the singular", () => {
    const { store, id } = opened((s, id) => {
      const n = s.getState().nodes[0] as Extract<LinkageNode, { kind: "pushrod" }>;
      s.getState().updateNode(id, { props: { ...n.props, material: "6061-T6", outsideDiameter: 0.625, wall: 0.049 } });
    });
    const html = card(store, id);
    expect(html).toContain("node-form-props__length-starting");
    expect(html).not.toContain("node-form-props__wall-starting");
    expect(attrs(html, "node-form-props__wall")).not.toContain("aria-describedby");
    expect(html).toContain("1 value is still the starting value");
    expect(html).toMatch(/>This value is right<\/button>/);
  });

  it("shows nothing of it once the values are confirmed (what the button does)", () => {
    const { store, id } = opened((s, id) => s.getState().confirmValues(id));
    const html = card(store, id);
    expect(html).toContain('data-testid="node-form"');
    expect(html).not.toContain("starting value");
    expect(html).not.toContain('data-testid="starting-values"');
    expect(html).not.toContain("btn-confirm-values");
  });

  it("shows the line but no button to someone who may only read", () => {
    const { store, id } = opened();
    const html = card(store, id, true);
    expect(html).toContain("4 values are still the starting values");
    expect(html).not.toContain("btn-confirm-values");
  });
});

describe("the part on the canvas", () => {
  const render = (store: EditorStore, id: string) => {
    const node = store.getState().nodes.find((n) => n.id === id)!;
    const Card = nodeTypes[node.kind] as unknown as (p: object) => React.ReactElement;
    return renderToStaticMarkup(
      createElement(ReactFlowProvider, null,
        createElement(EditorStoreContext.Provider, { value: store },
          createElement(Card as never, { id, data: { node }, selected: false, type: node.kind } as never))),
    );
  };

  it("carries a small tab with how many values are to enter, and says it in its name", () => {
    const { store, id } = opened();
    const html = render(store, id);
    expect(html).toMatch(new RegExp(`data-testid="to-enter-${id}"[^>]*>4 to enter<`));
    // Before the live check has run, the name says so (nodes/coverage.ts).
    expect(html).toContain("Pushrod, Pushrod 1, no findings, not checked yet, 4 values to enter");
  });

  it("carries none when every value is entered", () => {
    const { store, id } = opened((s, id) => s.getState().confirmValues(id));
    const html = render(store, id);
    expect(html).not.toContain(`to-enter-${id}`);
    expect(html).toContain("Pushrod, Pushrod 1, no findings, not checked yet<");
  });

  it("names one value in the singular", () => {
    expect(partAccessibleName({ kind: "pushrod", label: "Aft pushrod" }, undefined, 1)).toBe("Pushrod, Aft pushrod, no findings, 1 value to enter");
    expect(partAccessibleName({ kind: "pushrod", label: "Aft pushrod" }, undefined, 0)).toBe("Pushrod, Aft pushrod, no findings");
  });
});

describe("a number box left as it was", () => {
  it("keeps its value exactly in SI, while a box typed in is converted", () => {
    const sections = nodeSections("bellcrank", "pitch");
    const base = { label: "Bellcrank 1", props: { inputArm: 3, outputArm: 3, armAngle: 90 } };
    const box = (v: number) => inputText(v, "length", "SI");
    expect(box(3)).toBe("76.2"); // and 76.2 / 25.4 is 3.0000000000000004
    const v = { label: "Bellcrank under the seat", props__inputArm: box(3), props__outputArm: "80", props__armAngle: "90" };
    const { out, errors } = toCanonical({ v, on: {} }, sections, "SI", base);
    expect(errors).toEqual({});
    const props = out.props as Record<string, number>;
    expect(props.inputArm).toBe(3);
    expect(props.outputArm).toBeCloseTo(80 / 25.4, 12);
    expect(out.label).toBe("Bellcrank under the seat");
  });

  it("so a label typed on an SI card leaves every starting value marked", () => {
    const { store, id } = opened(undefined, "bellcrank");
    const n = store.getState().nodes[0];
    const p = n.props as Record<string, number>;
    const v = { label: "Bellcrank under the seat", props__inputArm: inputText(p.inputArm, "length", "SI"), props__outputArm: inputText(p.outputArm, "length", "SI"), props__armAngle: inputText(p.armAngle, "angle", "SI") };
    const { out } = toCanonical({ v, on: {} }, nodeSections("bellcrank", "pitch"), "SI", { label: n.label, props: n.props });
    expect(store.getState().updateNode(id, out as never).ok).toBe(true);
    expect(store.getState().nodes[0].label).toBe("Bellcrank under the seat");
    expect(store.getState().nodes[0].props).toEqual({ inputArm: 3, outputArm: 3, armAngle: 90 });
    expect(store.getState().nodes[0].unentered).toEqual(["inputArm", "outputArm", "armAngle"]);
  });
});

describe("a cable's terminal on the joint card", () => {
  it("says it is still the starting terminal, tied to its box, until it is entered", async () => {
    const { CableEndFields } = await import("@/editor/panels/CableEndFields");
    let i = 0;
    const draft = createEditorStore(emptyGraph("Pitch", "pitch"), { newId: (k) => `${k}-${++i}`, now: () => 0 });
    const s = () => draft.getState();
    const sector = s().addNode("cableSector", { x: 0, y: 0 });
    const cable = s().addNode("cable", { x: 200, y: 0 }, { props: { terminalB: "nicopress" } });
    const a = s().connect({ node: sector, port: "out" }, { node: cable, port: "a" });
    const b = s().connect({ node: cable, port: "b" }, { node: sector, port: "in" });
    if (!a.ok || !b.ok) throw new Error("not joined");
    const store = createEditorStore(toGraph(s()), { now: () => 0 });
    const ends = (jointId: string) => renderToStaticMarkup(
      createElement(EditorConfigContext.Provider, { value: { unitSystem: "US", readOnly: false } },
        createElement(EditorStoreContext.Provider, { value: store }, createElement(CableEndFields, { jointId }))),
    );
    const atA = ends(a.value);
    const start = `cable-terminal-${cable}-a-start`;
    expect(attrs(atA, start)).toContain(`id="${start}"`);
    expect(attrs(atA, `cable-terminal-${cable}-a`)).toContain(`aria-describedby="${start}"`);
    expect(atA).toContain("starting value — enter yours");
    // The terminal at B was given when the cable was placed: not marked.
    const atB = ends(b.value);
    expect(atB).toContain(`cable-terminal-${cable}-b`);
    expect(atB).not.toContain("starting value");
  });
});
