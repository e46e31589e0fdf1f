/**
 * Exports as jobs in PostgreSQL, run by the worker process beside the test server: progress and a
 * download; a failure that says why and can be retried; a job that outlives its worker; the e-mail to
 * someone who left; and the queue is the database (a job put in through pg-boss alone is run).
 */
import { randomUUID } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import * as tar from "tar";
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { makeBuild, makeUser, testDb } from "../support/db";
import { signIn, type Client } from "../support/http";
import { TEST_DB_URL } from "../support/env";
import { exportFile, waitForJob } from "../support/exports";
import { mailTo } from "../support/review";
import { deleteTestObjects, s3Client, S3 } from "../support/upload";
import { seedLongBuild } from "../support/long-build";

let owner: Client, viewer: Client;
let ownerEmail: string, ownerId: string, buildId: string;
let boss: PgBoss;
let keys: string[] = [];
const B = () => `/api/builds/${buildId}`;

beforeAll(async () => {
  const [o, v] = await Promise.all([makeUser("exp-owner"), makeUser("exp-viewer")]);
  ownerEmail = o.email;
  ownerId = o.id;
  ({ buildId } = await makeBuild({ owner: o, viewer: v }));
  keys = (await seedLongBuild(testDb, { client: s3Client, bucket: S3.bucket }, { buildId, ownerId, size: { entries: 600, years: 2, photosPerEntry: 2, linkages: 1, revisions: 3, comments: 0, signoffs: 0, parts: 0 } })).objectKeys;
  [owner, viewer] = await Promise.all([signIn(o.email), signIn(v.email)]);
  boss = new PgBoss({ connectionString: TEST_DB_URL, schema: "pgboss", supervise: false, schedule: false, max: 1 });
  await boss.start();
});
// A loaded machine gives the worker (at a lower priority than the app) little time: generous limits.
vi.setConfig({ testTimeout: 300_000 });
afterAll(async () => { await boss?.stop({ graceful: false, wait: true }); await deleteTestObjects(keys); await testDb.destroy(); });

/** A job row written straight to the database and put in the queue through pg-boss (as another app instance would). */
async function queueDirect(row: Record<string, unknown>) {
  const queueJobId = randomUUID();
  const [j] = await testDb("export_jobs").insert({ build_id: buildId, user_id: ownerId, params: "{}", label: "fixture", queue_job_id: queueJobId, ...row }).returning("id");
  await boss.send("exports", { exportId: j.id }, { id: queueJobId });
  return j.id as string;
}
async function dbWait(id: string, until: (r: { status: string; worker: string | null; attempts: number }) => boolean, ms = 240_000) {
  const end = Date.now() + ms;
  for (;;) {
    const r = await testDb("export_jobs").where({ id }).first();
    if (until(r) || Date.now() > end) return r;
    await new Promise((res) => setTimeout(res, 200));
  }
}

describe("exports as background jobs", () => {
  it("makes the full log PDF off the request, with progress, and serves it for download", async () => {
    const est = (await viewer.request("GET", `${B()}/log/estimate`)).body.estimate;
    expect(est).toMatchObject({ entries: 600, photos: 1200 });
    const started = Date.now();
    const start = await viewer.request("POST", `${B()}/exports`, { kind: "log-pdf", params: {} });
    expect(start.status).toBe(202);
    expect(Date.now() - started).toBeLessThan(5_000); // the answer does not wait for the PDF
    expect(start.body.job).toMatchObject({ status: "queued", progress: 0, downloadUrl: null, estimatedBytes: est.estimatedBytes });
    const seen = new Set<string>();
    let job = start.body.job;
    // Another person's requests go on being answered while the PDF is made (it is made by the worker process).
    let answeredWhileRunning = 0;
    while (job.status !== "done" && job.status !== "failed") {
      const other = await owner.request("GET", `${B()}/log?limit=20`);
      expect(other.status).toBe(200);
      job = (await viewer.request("GET", `${B()}/exports/${job.id}`)).body.job;
      if (job.status === "running") answeredWhileRunning++;
      seen.add(`${job.status}:${job.progress > 0 && job.progress < 1 ? "partway" : job.progress}`);
      await new Promise((r) => setTimeout(r, 50));
    }
    expect(job.status, job.error).toBe("done");
    expect(seen.has("running:partway")).toBe(true);
    expect(answeredWhileRunning).toBeGreaterThanOrEqual(2);
    expect(job.resultSize).toBeGreaterThan(0);
    // Early downloads are refused, finished ones stream from storage.
    const file = await exportFile(viewer, buildId, "hardware-csv");
    expect(file.headers.get("content-disposition")).toContain("attachment");
  });

  it("a failed job says why, and a retry runs it again", async () => {
    // A checklist of a linkage that is gone by the time the worker runs.
    const id = await queueDirect({ kind: "checklist-pdf", label: "Checklist", params: JSON.stringify({ linkageId: randomUUID() }) });
    const failed = await waitForJob(owner, buildId, id);
    expect(failed.status).toBe("failed");
    expect(failed.error).toBe("The linkage was deleted before its checklist could be printed.");
    expect((await owner.request("GET", `${B()}/exports/${id}/download`)).status).toBe(409);
    await testDb("export_jobs").where({ id }).update({ kind: "hardware-csv", params: "{}" });
    const again = await owner.request("POST", `${B()}/exports/${id}/retry`);
    expect([again.status, again.body.job.status]).toEqual([202, "queued"]);
    const done = await waitForJob(owner, buildId, id);
    expect([done.status, done.attempts, done.error]).toEqual(["done", 2, null]);
    expect((await owner.request("POST", `${B()}/exports/${id}/retry`)).status).toBe(409);
  });

  it("a job survives its worker being killed mid-way: another worker finishes it", async () => {
    const start = await owner.request("POST", `${B()}/exports`, { kind: "log-pdf", params: {} });
    const running = await dbWait(start.body.job.id, (r) => r.status === "running" || r.status === "done");
    expect(running.status).toBe("running");
    const pid = Number(running.worker!.split(":")[1]);
    process.kill(pid, "SIGKILL");
    const done = await dbWait(start.body.job.id, (r) => r.status === "done" || r.status === "failed");
    expect(done.status, done.error ?? "").toBe("done");
    expect(done.attempts).toBe(2);
    expect(Number(done.worker!.split(":")[1])).not.toBe(pid);
  });

  it("e-mails the link to someone who left the page, and not to someone watching", async () => {
    const left = await queueDirect({ kind: "hardware-csv", label: "Hardware list CSV", seen_at: testDb.raw("now() - interval '1 hour'") });
    const r = await dbWait(left, (x) => x.status === "done");
    expect(r.status).toBe("done");
    const csvMail = async (ms: number) => {
      const end = Date.now() + ms;
      for (;;) {
        const got = (await mailTo(ownerEmail, { ms: 0 })).filter((m) => m.subject === "Ready: Hardware list CSV");
        if (got.length || Date.now() > end) return got;
        await new Promise((res) => setTimeout(res, 200));
      }
    };
    const mail = await csvMail(15_000);
    expect(mail.length).toBe(1);
    expect(mail[0].text).toContain(`/api/builds/${buildId}/exports/${left}/download`);
    await exportFile(owner, buildId, "hardware-csv"); // polled throughout
    await new Promise((res) => setTimeout(res, 1000));
    expect((await csvMail(0)).length).toBe(1);
  });

  it("archives the whole build for its owner: log PDF, each linkage's file and checklist, every stored file, the hardware CSV", async () => {
    expect((await viewer.request("POST", `${B()}/exports`, { kind: "build-archive", params: {} })).status).toBe(403);
    const { job, bytes } = await exportFile(owner, buildId, "build-archive");
    expect(job.resultName).toMatch(/-archive-\d{4}-\d{2}-\d{2}\.tar$/);
    const dir = mkdtempSync(path.join(os.tmpdir(), "lw-archive-test-"));
    try {
      writeFileSync(path.join(dir, "a.tar"), bytes);
      const names: string[] = [];
      await tar.t({ file: path.join(dir, "a.tar"), onReadEntry: (e) => { names.push(e.path); } });
      const top = names[0].split("/")[0];
      const inFiles = names.filter((n) => n.startsWith(`${top}/files/`) && !n.endsWith("/"));
      const stored = Number((await testDb("files").where({ build_id: buildId }).count<{ n: string }[]>("* as n"))[0].n);
      expect(stored).toBeGreaterThan(900); // the fixture's 1,200 photos
      expect(inFiles).toHaveLength(stored);
      const linkages = await testDb("linkages").where({ build_id: buildId }).select("name");
      for (const n of [`${top}/build-log.pdf`, `${top}/hardware-list.csv`, `${top}/README.txt`]) expect(names).toContain(n);
      expect(names.filter((n) => n.endsWith(".linkage.json"))).toHaveLength(linkages.length);
      expect(names.filter((n) => n.endsWith("-checklist.pdf"))).toHaveLength(linkages.length);
      await tar.x({ file: path.join(dir, "a.tar"), cwd: dir });
      const readme = readFileSync(path.join(dir, top, "README.txt"), "utf8");
      expect(readme).toContain(`${stored} files`);
      expect(readme).toMatch(/qualified inspector/); // the caution
      expect(readFileSync(path.join(dir, top, "build-log.pdf")).subarray(0, 5).toString()).toBe("%PDF-");
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
