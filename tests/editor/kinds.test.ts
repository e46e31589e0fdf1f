/**
 * The part-kind registry is complete: every kind registered in shared/linkage/kinds has ports (with sides and
 * names, including the ports its engine role uses), a display name, a hint and defaults (`<kind>/index.ts`,
 * without the schema library), and a props schema (`<kind>/schema.ts`) that gives those defaults back exactly;
 * and its editor half (editor/nodes/kinds) has a glyph, card lines and a form whose fields are exactly its
 * props. The card of each kind renders with its name and lines. (The browser test
 * tests/e2e/editor-kinds.test.ts drops each kind on the canvas.)
 */
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { ReactFlowProvider } from "@xyflow/react";
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { defaultProps, KIND_LIST, NODE_KINDS, PORT_SIDES, PORTS, ROLE_PORTS } from "@/shared/linkage/kinds";
import { KIND_SCHEMAS } from "@/shared/linkage/kinds/schemas";
import { graphSchema, nodeSchema, SYSTEMS } from "@/shared/linkage/schema";
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
    // The node schema accepts exactly the registered kinds, and each has a schema half.
    expect(nodeSchema.options.map((o) => o.shape.kind.value).sort()).toEqual([...NODE_KINDS].sort());
    expect(Object.keys(KIND_SCHEMAS).sort()).toEqual([...NODE_KINDS].sort());
  });

  it("keeps each kind in a folder of its own, its first half free of the schema library", () => {
    const dir = path.resolve(__dirname, "../../shared/linkage/kinds");
    const folders = readdirSync(dir, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name);
    expect(folders.sort()).toEqual([...NODE_KINDS].sort());
    // What the editor draws with (the registry, its types, each kind's index.ts and the format's constants)
    // must not load zod at run time, or the schema library is back in the editor's first load.
    const free = ["index.ts", "types.ts", ...NODE_KINDS.map((k) => `${k}/index.ts`), "../format.ts"];
    for (const f of free) {
      const text = readFileSync(path.join(dir, f), "utf8");
      const runtime = text.split("\n").filter((l) => /^import (?!type )/.test(l));
      expect(runtime.filter((l) => /"zod"|schema"|\/fields"/.test(l)), f).toEqual([]);
    }
  });

  for (const def of KIND_LIST) {
    describe(def.kind, () => {
      it("has a props schema, ports with sides and names, a name, a hint and defaults the schema gives back as they are", () => {
        const props = KIND_SCHEMAS[def.kind] as z.ZodObject;
        expect(props).toBeInstanceOf(z.ZodObject);
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
          const d = (def.defaults as (s: typeof system) => object)(system);
          const r = props.safeParse(d);
          expect(r.success).toBe(true);
          // Complete and in the schema's order: a new part is placed without the schema (editor/store/graph.ts).
          expect(JSON.stringify(r.data)).toBe(JSON.stringify(d));
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
        for (const system of SYSTEMS) {
          expect(nodeLines(node, "US", system).length).toBe(us.length); // nor on the run's system
          const fieldPaths = nodeSections(def.kind, system).flatMap((s) => s.fields.map((f) => f.path));
          expect(fieldPaths).toContain("label");
          const props = Object.keys((KIND_SCHEMAS[def.kind] as z.ZodObject).shape).map((k) => `props.${k}`);
          expect(fieldPaths.filter((p) => p.startsWith("props.")).sort()).toEqual(props.sort());
        }
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

describe("a control surface's travel in its run's words", () => {
  const surface = { id: "s", kind: "controlSurface", label: "", position: { x: 0, y: 0 }, props: { travelUp: 30, travelDown: 25 } } as never;
  const labels = (system: (typeof SYSTEMS)[number]) => nodeSections("controlSurface", system)[1].fields.map((f) => `${f.path} ${f.label}`);
  it("a rudder (yaw run) reads left and right, the up travel being the trailing edge to the right", () => {
    expect(nodeLines(surface, "US", "yaw")).toEqual(["left 25° · right 30°"]);
    expect(labels("yaw").slice(0, 2)).toEqual(["props.travelDown Left travel", "props.travelUp Right travel"]);
  });
  it("an elevator, aileron, flap or tab reads up and down", () => {
    for (const system of ["pitch", "roll", "flap", "trim", "other"] as const) {
      expect(nodeLines(surface, "US", system)).toEqual(["up 30° · down 25°"]);
      expect(labels(system).slice(0, 2)).toEqual(["props.travelUp Up travel", "props.travelDown Down travel"]);
    }
  });
});
