import { NextResponse } from "next/server";
import { withUser } from "@/lib/http";
import { engineAnalyze } from "@/lib/engine/threads";

/** Runs the load-path check on a posted linkage (shared/schemas/graph.ts analyzeInput) without storing anything: `{report}`. */
export const POST = withUser(async ({ req }) => {
  const { answer } = await engineAnalyze(req);
  return new NextResponse(answer as Uint8Array<ArrayBuffer>, { status: 200, headers: { "content-type": "application/json" } });
});
