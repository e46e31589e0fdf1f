/**
 * The engine's share of a request that carries a linkage graph, in the request's thread or an engine thread
 * (lib/engine/threads.ts): the body's bytes are read as UTF-8 and parsed (depth and character checks,
 * lib/body.ts), checked against the route's zod schema, the graph analysed, and the graph and report serialised
 * to the JSON text that is stored, or to the bytes that are answered. Only bytes, text and small values cross
 * between the threads. Pure: no database, no request; tested directly.
 */
import type { z } from "zod";
import { decodeBody, parseJsonWith } from "../body";
import { ApiError, type ErrorCode, type Fields } from "../errors";
import { analyzeInput, graphPut } from "../../shared/schemas/graph";
import { linkageCreate } from "../../shared/schemas/linkages";
import { analyze } from "../../shared/analysis";
import type { AnalysisSettings } from "../../shared/analysis/types";

type Settings = Partial<AnalysisSettings> | undefined;

export type EngineJob =
  /** PUT graph: the next revision and its report. */
  | { kind: "save"; body: Uint8Array; settings: Settings }
  /** POST linkages: a new linkage, with the report of its imported graph if it has one. */
  | { kind: "create"; body: Uint8Array; settings: Settings }
  /** POST /api/analyze: the report of a posted graph, nothing stored. */
  | { kind: "analyze"; body: Uint8Array };

export type SaveOutcome = { baseRevision: number; graphJson: string; analysisJson: string; summaryJson: string };
export type CreateOutcome = { input: z.infer<typeof linkageCreate>; analysisJson: string | null; summaryJson: string | null };
/** The answer's JSON as UTF-8 bytes, `{"report": …}` (handed over, not copied, from an engine thread). */
export type AnalyzeOutcome = { answer: Uint8Array };
export type Refusal = { code: ErrorCode; message: string; fields?: Fields; extra?: Record<string, unknown> };

export type EngineAnswer =
  | { ok: true; value: SaveOutcome | CreateOutcome | AnalyzeOutcome }
  | { ok: false; refusal: Refusal };

const parse = <S extends z.ZodTypeAny>(body: Uint8Array, schema: S): z.infer<S> => parseJsonWith(decodeBody(body), schema);
const utf8 = new TextEncoder();

function run(job: EngineJob): SaveOutcome | CreateOutcome | AnalyzeOutcome {
  switch (job.kind) {
    case "save": {
      const { baseRevision, graph } = parse(job.body, graphPut);
      const report = analyze(graph, job.settings);
      // Serialised once: stored with the revision and answered as the same text.
      return { baseRevision, graphJson: JSON.stringify(graph), analysisJson: JSON.stringify(report), summaryJson: JSON.stringify(report.summary) };
    }
    case "create": {
      const input = parse(job.body, linkageCreate);
      const report = input.graph ? analyze(input.graph, job.settings) : null;
      return { input, analysisJson: report && JSON.stringify(report), summaryJson: report && JSON.stringify(report.summary) };
    }
    case "analyze": {
      const { graph, settings } = parse(job.body, analyzeInput);
      return { answer: utf8.encode(`{"report":${JSON.stringify(analyze(graph, settings))}}`) };
    }
  }
}

/** One job's answer: a refusal (the 4xx the request gets) is an answer too; anything else thrown is a fault. */
export function runEngineJob(job: EngineJob): EngineAnswer {
  try {
    return { ok: true, value: run(job) };
  } catch (e) {
    if (e instanceof ApiError) return { ok: false, refusal: { code: e.code, message: e.message, ...(e.fields ? { fields: e.fields } : {}), ...(e.extra ? { extra: e.extra } : {}) } };
    throw e;
  }
}
