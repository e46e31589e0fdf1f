/**
 * npm run bench:scale — a ten-year build on a throwaway database (linkwright_bench_scale, in the
 * local test cluster) and its own app server, S3 fake and mail sink: 5,000 log entries over eight years
 * with 3 small real JPEGs each, 12 linkages × 500 revisions, 3,000 comments, 200 sign-offs, a
 * 2,000-row parts library. Reports each page's server time and first-screen payload beside the demo
 * build's, the full-log PDF's time, and other requests' p95 while it runs — each beside its target:
 * every page within 2× the demo build and under 300 KB for its first screen; the full-log PDF under
 * 30 s; other requests' p95 under 100 ms during the export. A miss sets exit code 1.
 * Knobs: LW_BENCH_FRACTION=0.2 seeds that fraction of the build; LW_SKIP_BUILD=1 reuses the build (LW_BENCH_DIST, default .next-bench); LW_BENCH_REUSE=1 reuses the last seeded
 * database and bucket; LW_BENCH_KEEP=1 leaves the server up to look at. Not while `npm test` runs: it restarts the test cluster.
 */
import { spawn, spawnSync } from "node:child_process";
import { rmSync } from "node:fs";
import path from "node:path";
import knex from "knex";
import bcrypt from "bcryptjs";
import { S3Client } from "@aws-sdk/client-s3";
import { BENCH_SIZE, seedLongBuild } from "../support/long-build";
import { DEMO_BUILD, DEMO_USERS } from "../../db/demo-accounts";
import { localDbUrl, TEST_PG_PORT } from "../../db/local-cluster.cjs";
import { signInAt } from "./common";
import { nextStartArgs } from "../../scripts/next-start.mjs";

const ROOT = path.resolve(__dirname, "../..");
const DB = "linkwright_bench_scale";
const DB_URL = localDbUrl(DB, "test");
// LW_TEST_PORT + 1 is the two-instance test's second server.
const PORT = Number(process.env.LW_TEST_PORT || 3100) + 2;
const APP = `http://127.0.0.1:${PORT}`;
const DIST = process.env.LW_BENCH_DIST || ".next-bench";
/** LW_BENCH_FRACTION=0.2 seeds a fifth of the long build (entries, photos, revisions, comments…) to look at growth quickly. */
function benchSize() {
  const f = Number(process.env.LW_BENCH_FRACTION || 1);
  if (!(f > 0 && f <= 1)) throw new Error("LW_BENCH_FRACTION is a fraction in (0, 1]");
  const n = (x: number) => Math.max(1, Math.round(x * f));
  return { ...BENCH_SIZE, entries: n(BENCH_SIZE.entries), revisions: n(BENCH_SIZE.revisions), comments: n(BENCH_SIZE.comments), signoffs: n(BENCH_SIZE.signoffs), parts: n(BENCH_SIZE.parts) };
}
const T = { pageRatio: 2, firstScreenKB: 300, pdfS: 30, p95Ms: 100 };

function sh(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, args, { cwd: ROOT, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", ...env } });
  if (r.status !== 0) throw new Error(`${args.join(" ")} failed`);
}
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1];
const pct = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(xs.length * p))];
const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

const signIn = (email: string, password: string) => signInAt(APP, email, password);

async function timed(cookie: string, url: string, init: RequestInit = {}) {
  const t0 = performance.now();
  const res = await fetch(`${APP}${url}`, { ...init, headers: { cookie, ...(init.headers ?? {}) }, redirect: "manual" });
  const body = Buffer.from(await res.arrayBuffer());
  const ms = performance.now() - t0;
  if (res.status >= 400) throw new Error(`${url}: HTTP ${res.status} ${body.toString("utf8").slice(0, 200)}`);
  return { ms, bytes: body.length, body };
}

/** A page's first screen: its HTML and the API calls its client part makes on first paint. */
function pages(b: { id: string; linkage: string }) {
  const B = `/builds/${b.id}`, A = `/api/builds/${b.id}`;
  return [
    ["overview", [B]],
    ["build log", [`${B}/log`]],
    ["files", [`${B}/files`]],
    ["activity", [`${B}/activity`]],
    ["parts library", [`${B}/parts`, `${A}/parts`]],
    ["hardware list", [`${B}/hardware`, `${A}/hardware`]],
    ["checklist", [`${B}/checklist/${b.linkage}`, `${A}/linkages/${b.linkage}/checklist`]],
    ["linkage editor", [`${B}/linkages/${b.linkage}`, `${A}/linkages/${b.linkage}/comments`, `${A}/linkages/${b.linkage}/revisions`]],
  ] as [string, string[]][];
}

async function measure(cookie: string, urls: string[]) {
  const runs: { ms: number; bytes: number }[] = [];
  for (let i = 0; i < 6; i++) {
    let ms = 0, bytes = 0;
    for (const u of urls) { const r = await timed(cookie, u); ms += r.ms; bytes += r.bytes; }
    if (i > 0) runs.push({ ms, bytes }); // the first run warms caches
  }
  return { ms: median(runs.map((r) => r.ms)), kb: runs[0].bytes / 1024 };
}

export async function run() {
  console.log(`Throwaway database ${DB} on the test cluster (port ${TEST_PG_PORT}); app on ${APP}`);
  const reuse = process.env.LW_BENCH_REUSE === "1";
  if (!reuse) {
    sh(["--import", "tsx", "scripts/reset-db.ts", DB]);
    sh(["--import", "tsx", "scripts/migrate.ts", "--seed"], { DATABASE_URL: DB_URL });
    rmSync(path.join(ROOT, ".data/s3-bench"), { recursive: true, force: true });
  }
  const { startLocalServices } = await import("../../scripts/services.mjs");
  const env: Record<string, string> = { ...(process.env as Record<string, string>), LW_SERVICES_MODE: "bench", DATABASE_URL: DB_URL, NEXT_DIST_DIR: DIST, NEXTAUTH_SECRET: "bench-secret-not-for-production", NEXTAUTH_URL: APP, NEXT_TELEMETRY_DISABLED: "1" };
  const services = await startLocalServices(env);

  const db = knex({ client: "pg", connection: DB_URL, pool: { min: 0, max: 4 } });
  const dana = DEMO_USERS[0];
  const owner = await db("users").whereRaw("lower(email) = lower(?)", [dana.email]).first("id");
  const demo = await db("builds").where({ name: DEMO_BUILD.name }).first("id");
  const demoLinkage = await db("linkages").where({ build_id: demo.id }).first("id");
  let t0 = performance.now();
  const existing = reuse ? await db("builds").where({ name: "Ten-year build (bench)" }).first("id") : null;
  let long: { id: string }, seeded: { linkageIds: string[] };
  if (existing) {
    long = existing;
    seeded = { linkageIds: (await db("linkages").where({ build_id: long.id }).orderBy("name").select("id")).map((l: { id: string }) => l.id) };
    console.log("Reusing the seeded long build (LW_BENCH_REUSE=1)");
  } else {
    [long] = await db("builds").insert({ name: "Ten-year build (bench)", model: "invented two-seater", created_by: owner.id }).returning("id");
    await db("memberships").insert({ build_id: long.id, user_id: owner.id, role: "owner" });
    const [rev] = await db("users").insert({ email: "bench-reviewer@bench.linkwright.test", name: "Bench Reviewer", password_hash: await bcrypt.hash("not-used", 4) }).returning("id");
    await db("memberships").insert({ build_id: long.id, user_id: rev.id, role: "reviewer" });
    const s3 = new S3Client({ endpoint: env.S3_ENDPOINT, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } });
    seeded = await seedLongBuild(db, { client: s3, bucket: env.S3_BUCKET }, { buildId: long.id, ownerId: owner.id, reviewerId: rev.id, size: benchSize(), log: (s) => console.log(`  seeding: ${s}`) });
    await db.raw("analyze");
    console.log(`Seeded in ${((performance.now() - t0) / 1000).toFixed(0)} s`);
  }

  if (process.env.LW_SKIP_BUILD !== "1") sh(["node_modules/next/dist/bin/next", "build"], { ...env, NODE_ENV: "production" });
  const server = spawn(process.execPath, nextStartArgs("127.0.0.1", PORT), { cwd: ROOT, env: { ...env, NODE_ENV: "production" }, stdio: ["ignore", "pipe", "inherit"] });
  // The export worker's start-up sweep lists every stored object from the S3 fake, which runs in this process:
  // pages are measured once it is done, as they are served the rest of the day.
  let swept = false;
  server.stdout!.on("data", (d: Buffer) => {
    process.stdout.write(d);
    if (d.toString().includes("[storage] orphan sweep")) swept = true;
  });
  let ok = true;
  try {
    for (let i = 0; ; i++) { try { if ((await fetch(`${APP}/api/auth/csrf`)).ok) break; } catch {} if (i > 240) throw new Error("the app did not start"); await wait(250); }
    const cookie = await signIn(dana.email, dana.password);
    for (let i = 0; !swept && i < 600; i++) await wait(500);
    if (!swept) console.log("(the start-up orphan sweep did not report within 5 minutes: measuring anyway)");

    console.log("\nPage (first screen)      demo ms  long ms  ratio  long KB  target: ratio ≤ 2, KB < 300");
    const longB = { id: long.id, linkage: seeded.linkageIds[0] }, demoB = { id: demo.id, linkage: demoLinkage.id };
    const pd = pages(demoB), pl = pages(longB);
    for (let i = 0; i < pl.length; i++) {
      const d = await measure(cookie, pd[i][1]);
      const l = await measure(cookie, pl[i][1]);
      const ratio = l.ms / d.ms;
      const pass = ratio <= T.pageRatio && l.kb < T.firstScreenKB;
      ok &&= pass;
      console.log(`${pl[i][0].padEnd(24)} ${d.ms.toFixed(0).padStart(7)}  ${l.ms.toFixed(0).padStart(7)}  ${ratio.toFixed(2).padStart(5)}  ${l.kb.toFixed(0).padStart(7)}  ${pass ? "ok" : "MISSED"}`);
    }

    // Other requests (another person on the demo build) before and during the full-log PDF.
    const others = [`/api/builds/${demo.id}/log?limit=50`, `/api/me`, `/api/builds/${demo.id}/files`, `/api/builds/${demo.id}/linkages/${demoLinkage.id}/checklist`];
    const load = async (ms: number, stop?: () => boolean) => {
      const lat: number[] = [];
      const end = Date.now() + ms;
      await Promise.all([0, 1].map(async (k) => {
        for (let i = k; (stop ? !stop() : true) && Date.now() < end; i++) { lat.push((await timed(cookie, others[i % others.length])).ms); await wait(20); }
      }));
      return lat;
    };
    const quiet = await load(8_000);
    const est = (await timed(cookie, `/api/builds/${long.id}/log/estimate`)).body;
    t0 = performance.now();
    const start = JSON.parse((await timed(cookie, `/api/builds/${long.id}/exports`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ kind: "log-pdf", params: {} }) })).body.toString());
    let job = start.job;
    let finished = false;
    const during = load(10 * 60_000, () => finished);
    while (job.status !== "done" && job.status !== "failed") {
      await wait(500);
      job = JSON.parse((await timed(cookie, `/api/builds/${long.id}/exports/${job.id}`)).body.toString()).job;
      if (performance.now() - t0 > 15 * 60_000) break;
    }
    finished = true;
    const lat = await during;
    const pdfS = (Date.parse(job.finishedAt ?? new Date().toISOString()) - Date.parse(job.startedAt ?? job.createdAt)) / 1000;
    const wallS = (performance.now() - t0) / 1000;
    const p95 = pct(lat, 0.95);
    const estimate = JSON.parse(est.toString()).estimate;
    console.log(`\nFull-log PDF: ${job.status}${job.error ? ` (${job.error})` : ""}; ${estimate.entries} entries, ${estimate.photos} photos; estimated ${(estimate.estimatedBytes / 1e6).toFixed(1)} MB, made ${((job.resultSize ?? 0) / 1e6).toFixed(1)} MB`);
    console.log(`  worker time ${pdfS.toFixed(1)} s (request to download link ${wallS.toFixed(1)} s)   target < ${T.pdfS} s   ${job.status === "done" && pdfS < T.pdfS ? "ok" : "MISSED"}`);
    console.log(`  other requests: p95 ${pct(quiet, 0.95).toFixed(0)} ms before (n=${quiet.length}), p95 ${p95.toFixed(0)} ms during (n=${lat.length}, max ${Math.max(...lat).toFixed(0)} ms)   target < ${T.p95Ms} ms   ${p95 < T.p95Ms ? "ok" : "MISSED"}`);
    ok &&= job.status === "done" && pdfS < T.pdfS && p95 < T.p95Ms;
    if (process.env.LW_BENCH_KEEP === "1") { console.log(`\nLeft running on ${APP} (Ctrl+C to stop).`); await new Promise(() => {}); }
  } finally {
    server.kill("SIGTERM");
    await services.stop?.();
    await db.destroy();
  }
  return { ok };
}

if (process.argv[1]?.endsWith("scale.ts")) run().then((r) => { process.exitCode = r.ok ? 0 : 1; process.exit(); }, (e) => { console.error(e); process.exit(1); });
