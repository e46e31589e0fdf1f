import { expect } from "vitest";
import type { Client } from "./http";
import { fetchBytes } from "./upload";

/** Polls an export job until it is done or failed (or `ms` pass); returns its last state. */
export async function waitForJob(c: Client, buildId: string, jobId: string, ms = 240_000) {
  const until = Date.now() + ms;
  for (;;) {
    const r = await c.request("GET", `/api/builds/${buildId}/exports/${jobId}`);
    expect(r.status).toBe(200);
    if (r.body.job.status === "done" || r.body.job.status === "failed" || Date.now() > until) return r.body.job;
    await new Promise((res) => setTimeout(res, 250));
  }
}

/** Starts an export, waits for it, and downloads the file. */
export async function exportFile(c: Client, buildId: string, kind: string, params: object = {}) {
  const start = await c.request("POST", `/api/builds/${buildId}/exports`, { kind, params });
  expect(start.status, JSON.stringify(start.body)).toBe(202);
  const job = await waitForJob(c, buildId, start.body.job.id);
  expect(job.status, job.error ?? "").toBe("done");
  const file = await fetchBytes(c, job.downloadUrl);
  expect(file.status).toBe(200);
  return { job, ...file };
}
