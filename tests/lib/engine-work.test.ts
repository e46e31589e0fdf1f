/**
 * lib/engine/work.ts on its own: the body's text in, the texts to store and answer out (or the refusal the
 * request gets), the same whether it runs in the request's thread or an engine thread.
 */
import { describe, expect, it } from "vitest";
import { runEngineJob, type AnalyzeOutcome, type CreateOutcome, type SaveOutcome } from "@/lib/engine/work";
import { demoPitchLinkage } from "@/shared/demo";
import { analyze } from "@/shared/analysis";
import { graphSchema } from "@/shared/linkage/schema";

const graph = graphSchema.parse(demoPitchLinkage());
const settings = { ultimateFactor: 2 };

/** A body as the route reads it: bytes (a string as it is, anything else as its JSON). */
const enc = (v: unknown) => new TextEncoder().encode(typeof v === "string" ? v : JSON.stringify(v));

const ok = <T>(a: ReturnType<typeof runEngineJob>): T => {
  if (!a.ok) throw new Error(`refused: ${JSON.stringify(a.refusal)}`);
  return a.value as T;
};
const refusal = (a: ReturnType<typeof runEngineJob>) => (a.ok ? null : a.refusal);

describe("a save's body", () => {
  it("gives the graph, the engine's report of it with the build's settings, and that report's summary, as text", () => {
    const v = ok<SaveOutcome>(runEngineJob({ kind: "save", body: enc({ baseRevision: 4, graph: demoPitchLinkage() }), settings }));
    const report = analyze(graph, settings);
    expect(v.baseRevision).toBe(4);
    expect(JSON.parse(v.graphJson)).toEqual(graph); // defaults filled, as the schema reads it
    expect(v.analysisJson).toBe(JSON.stringify(report));
    expect(JSON.parse(v.summaryJson)).toEqual(report.summary);
    // The settings reach the engine: the same graph with the default settings reads differently.
    expect(v.analysisJson).not.toBe(JSON.stringify(analyze(graph)));
  });

  it("is refused as the route would refuse it: malformed, too deep, or not fitting the schema (fields named)", () => {
    expect(refusal(runEngineJob({ kind: "save", body: enc("{"), settings: undefined }))).toMatchObject({ code: "invalid_json" });
    expect(refusal(runEngineJob({ kind: "save", body: new Uint8Array([0x7b, 0xff, 0x7d]), settings: undefined }))?.message).toMatch(/not valid UTF-8/);
    expect(refusal(runEngineJob({ kind: "save", body: enc("[".repeat(100) + "]".repeat(100)), settings: undefined }))?.message).toMatch(/nested too deeply/);
    const noBase = refusal(runEngineJob({ kind: "save", body: enc({ graph: demoPitchLinkage() }), settings: undefined }));
    expect(noBase).toMatchObject({ code: "invalid_input" });
    expect(Object.keys(noBase!.fields!)).toEqual(["baseRevision"]);
    const g = demoPitchLinkage();
    const dup = refusal(runEngineJob({ kind: "save", body: enc({ baseRevision: 1, graph: { ...g, nodes: [...g.nodes, g.nodes[0]] } }), settings: undefined }));
    expect(dup?.fields?.[`graph.nodes.${g.nodes.length}.id`]).toMatch(/duplicate node id/);
  });
});

describe("a new linkage's body", () => {
  it("without a graph: no report", () => {
    const v = ok<CreateOutcome>(runEngineJob({ kind: "create", body: enc({ name: "Flap run", system: "flap" }), settings: undefined }));
    expect(v).toEqual({ input: { name: "Flap run", system: "flap" }, analysisJson: null, summaryJson: null });
  });
  it("with an imported graph: its report and summary", () => {
    const v = ok<CreateOutcome>(runEngineJob({ kind: "create", body: enc({ name: "Copy", system: "pitch", graph: demoPitchLinkage() }), settings }));
    expect(v.input.graph).toEqual(graph);
    expect(v.analysisJson).toBe(JSON.stringify(analyze(graph, settings)));
    expect(JSON.parse(v.summaryJson!)).toEqual(analyze(graph, settings).summary);
  });
});

describe("a check's body (POST /api/analyze)", () => {
  it("answers the report with the settings the body gives", () => {
    const v = ok<AnalyzeOutcome>(runEngineJob({ kind: "analyze", body: enc({ graph: demoPitchLinkage(), settings: { ultimateFactor: 2 } }) }));
    expect(JSON.parse(new TextDecoder().decode(v.answer))).toEqual({ report: JSON.parse(JSON.stringify(analyze(graph, settings))) });
  });
});
