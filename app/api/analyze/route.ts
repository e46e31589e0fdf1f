import { withUser, parseBody, json } from "@/lib/http";
import { analyzeInput } from "@/shared/schemas/graph";
import { analyze } from "@/shared/analysis";

/** Runs the load-path check on a posted linkage without storing anything. */
export const POST = withUser(async ({ req }) => {
  const body = await parseBody(req, analyzeInput);
  return json({ report: analyze(body.graph, body.settings) });
});
