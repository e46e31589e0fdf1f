import { NextResponse } from "next/server";
import { withUser } from "@/lib/http";
import { readBodyCapped, MAX_BODY_BYTES } from "@/lib/body";
import { engineAnalyze } from "@/lib/engine/threads";

/** Runs the load-path check on a posted linkage (shared/schemas/graph.ts analyzeInput) without storing anything: `{report}`. */
export const POST = withUser(async ({ req }) => {
  const { answer } = await engineAnalyze(await readBodyCapped(req, MAX_BODY_BYTES));
  return new NextResponse(answer as Uint8Array<ArrayBuffer>, { status: 200, headers: { "content-type": "application/json" } });
});
