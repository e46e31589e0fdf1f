import { withBuild, parseParams, UUID_RE } from "@/lib/http";
import { exportNotReady, notFound } from "@/lib/errors";
import { getExport } from "@/db/exports";
import { streamObject } from "@/lib/records-http";
import { z } from "zod";

type P = { buildId: string; jobId: string };

/** The finished export's file, streamed from storage; 409 while it is still being made. */
export const GET = withBuild<P>("read", async ({ build, params }) => {
  const row = await getExport(build.id, parseParams(params.jobId, z.string().regex(UUID_RE)));
  if (!row) throw notFound("export");
  if (row.status !== "done" || !row.result_key) throw exportNotReady(row.status === "failed" ? `This export failed: ${row.error}` : "This export is not finished yet.");
  return streamObject(row.result_key, { contentType: row.result_type ?? "application/octet-stream", name: row.result_name ?? "export", download: true });
});
