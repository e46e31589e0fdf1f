/**
 * The part-kind registry is complete: every kind registered in shared/linkage/kinds has a props schema, ports
 * (with sides and names, including the ports its engine role uses), a display name, a hint and defaults that
 * pass its schema; and its editor half (editor/nodes/kinds) has a glyph, card lines and a form whose fields are
 * exactly its props. The card of each kind renders with its name and lines. (The browser test
 * tests/e2e/editor.test.ts drops each kind on the canvas.)
 */
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { ReactFlowProvider } from "@xyflow/react";
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { defaultProps, KIND_LIST, KINDS, NODE_KINDS, PORT_SIDES, PORTS, ROLE_PORTS } from "@/shared/linkage/kinds";
import { graphSchema, nodeSchema } from "@/shared/linkage/schema";
import { EDITOR_KIND_LIST, EDITOR_KINDS } from "@/editor/nodes/kinds";
import { KindGlyph } from "@/editor/nodes/glyphs";
import { nodeLines, nodeTypes } from "@/editor/nodes";
import { nodeSections } from "@/editor/panels/specs";
import { createEditorStore } from "@/editor/store";
import { EditorStoreContext } from "@/editor/context";
import { emptyGraph } from "@/shared/linkage/schema";

describe("the part-kind registry", () => {
  it("lists each kind once, in both halves, in the same order", () => {
    expect(NODE_KINDS.length).toBeGreaterThanOrEqual(10);
    expect(new Set(NODE_KINDS).size).toBe(NODE_KINDS.length);
    expect(EDITOR_KIND_LIST.map((d) => d.kind)).toEqual(NODE_KINDS);
    expect(Object.keys(nodeTypes).sort()).toEqual([...NODE_KINDS].sort());
    // The node schema accepts exactly the registered kinds.
    expect(nodeSchema.options.map((o) => o.shape.kind.value).sort()).toEqual([...NODE_KINDS].sort());
  });

  for (const def of KIND_LIST) {
    describe(def.kind, () => {
      it("has a props schema, ports with sides and names, a name, a hint and defaults that pass the schema", () => {
        expect(def.props).toBeInstanceOf(z.ZodObject);
        expect(def.name.trim().length).toBeGreaterThan(2);
        expect(def.hint.trim().length).toBeGreaterThan(5);
        const ports = Object.entries(def.ports);
        expect(ports.length).toBeGreaterThan(0);
        for (const [id, p] of ports) {
          expect(["left", "right", "top", "bottom"]).toContain(p.side);
          expect(p.name.trim()).not.toBe("");
          expect(PORT_SIDES[def.kind][id]).toBe(p.side);
        }
        expect(PORTS[def.kind]).toEqual(ports.map(([id]) => id));
        // The engine reads fixed port names for each role.
        for (const port of ROLE_PORTS[def.engine.role]) expect(PORTS[def.kind]).toContain(port);
        for (const system of ["pitch", "roll", "yaw", "flap", "trim", "other"] as const) {
          expect(def.props.safeParse(def.defaults(system)).success).toBe(true);
        }
        const part = { id: "p", kind: def.kind, label: "", position: { x: 0, y: 0 }, props: defaultProps(def.kind) };
        expect(graphSchema.safeParse({ formatVersion: 1, nodes: [part], joints: [] }).success).toBe(true);
      });

      it("has a glyph, card lines and a form that asks for every prop and nothing else", () => {
        const ed = EDITOR_KINDS[def.kind];
        expect(ed.kind).toBe(def.kind);
        const svg = renderToStaticMarkup(createElement(KindGlyph, { kind: def.kind }));
        expect(svg).toMatch(/<svg[^>]*>.*<(path|line|rect|circle|ellipse)\b/);
        const node = { id: "p", kind: def.kind, label: "", position: { x: 0, y: 0 }, props: defaultProps(def.kind) } as never;
        const us = nodeLines(node, "US");
        expect(us.length).toBeGreaterThan(0);
        for (const l of us) expect(l.trim()).not.toBe("");
        expect(nodeLines(node, "SI").length).toBe(us.length); // the card's height does not depend on units
        const fieldPaths = nodeSections(def.kind).flatMap((s) => s.fields.map((f) => f.path));
        expect(fieldPaths).toContain("label");
        const props = Object.keys(KINDS[def.kind].props.shape).map((k) => `props.${k}`);
        expect(fieldPaths.filter((p) => p.startsWith("props.")).sort()).toEqual(props.sort());
      });

      it("renders as a card in the editor with its name and key numbers", () => {
        const store = createEditorStore(emptyGraph());
        const id = store.getState().addNode(def.kind, { x: 0, y: 0 });
        const node = store.getState().nodes.find((n) => n.id === id)!;
        expect(node.label).toBe(`${def.name} 1`);
        const Card = nodeTypes[def.kind] as unknown as (p: object) => React.ReactElement;
        const html = renderToStaticMarkup(
          createElement(ReactFlowProvider, null,
            createElement(EditorStoreContext.Provider, { value: store },
              createElement(Card as never, { id, data: { node }, selected: false, type: def.kind } as never))),
        );
        expect(html).toContain(`data-testid="node-${id}"`);
        expect(html).toContain(`data-kind="${def.kind}"`);
        expect(html).toContain(`${def.name} 1`);
        for (const l of nodeLines(node, "US")) expect(html).toContain(l.replace(/&/g, "&amp;").replace(/"/g, "&quot;"));
      });
    });
  }
});
