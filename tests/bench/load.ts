/**
 * npm run bench:load — requests per second under load, on loopback, against a `next start` of its own
 * (throwaway database linkwright_bench_load on the test cluster, seeded with the demo; port LW_TEST_PORT + 4,
 * S3 fake and mail sink on LW_S3_PORT + 1 and LW_SMTP_PORT + 1, no export worker). Signed in as the demo
 * build's owner, autocannon keeps LW_BENCH_CONNECTIONS (16) connections busy for LW_BENCH_SECONDS (10 s) on
 * each route, after a 3 s warm-up of that route:
 *   - GET /api/health: the bare route (no session, no database): what Next alone answers on this machine;
 *   - GET the graph of the demo pitch linkage (session, membership, linkage, revision, JSON of the graph);
 *   - PUT the graph with its analysis: every request is a real, non-stale save. Each of 32 copies of the demo
 *     pitch linkage is lent to one request at a time with its current revision as `baseRevision`, and given
 *     back with the revision the save answered, so no save is ever refused as stale (a 409 would count as a
 *     non-2xx answer, and any non-2xx answer fails the bench);
 *   - GET the pitch linkage's comments (the first page of threads).
 * The bare route runs before and after each other route, and each route's requests/s is reported as a ratio
 * to the mean of the two bare runs around it (other work on the machine then moves both alike), beside its target
 * (signed-in GET graph ≥ 60 % of bare, PUT with analysis ≥ 40 %), with its p50 and p95 latency; the figures
 * go to tests/artifacts/bench-load.json (the server's own output to tests/artifacts/bench-load-server.log). A miss sets exit code 1. The load generator runs on the same 2
 * cores as the server, so absolute figures are this machine's; the ratios are what to compare, and beside them
 * the server process's CPU time per request (from /proc), which work of other processes moves least, with its
 * kernel share, the CPU all PostgreSQL processes spent per request and the load generator's own (the whole
 * machine's budget for one request).
 * `LW_BENCH_ONLY=text` measures only the routes whose names contain it. `LW_SKIP_BUILD=1` reuses the build in LW_BENCH_DIST (default .next-bench). `LW_BENCH_PROFILE=dir` starts the
 * server with `--cpu-prof --cpu-prof-dir=dir` (one .cpuprofile per process, written when it stops).
 */
import { spawn, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, openSync, readFileSync, readdirSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import autocannon from "autocannon";
import knex from "knex";
import { DEMO_BUILD, DEMO_USERS } from "../../db/demo-accounts";
import { demoPitchLinkage } from "../../shared/demo";
import { localDbUrl } from "../../db/local-cluster.cjs";
import { signInAt } from "./common";
import { PREFER_MINIMAL } from "../../shared/prefer";
import { nextStartArgs } from "../../scripts/next-start.mjs";

const ROOT = path.resolve(__dirname, "../..");
const DB = "linkwright_bench_load";
const DB_URL = localDbUrl(DB, "test");
const PORT = Number(process.env.LW_TEST_PORT || 3100) + 4; // +1 two-instance test, +2 bench:scale, +3 bench:open
const APP = `http://127.0.0.1:${PORT}`;
const DIST = process.env.LW_BENCH_DIST || ".next-bench";
const OUT = path.join(ROOT, "tests/artifacts/bench-load.json");
const CONNECTIONS = Number(process.env.LW_BENCH_CONNECTIONS || 16);
const SECONDS = Math.min(60, Number(process.env.LW_BENCH_SECONDS || 10)); // bounded: at most a minute a route
const WARM_S = 3;
/** Copies of the pitch linkage that PUT saves to: two per connection, so one is always free. */
const SAVE_TARGETS = CONNECTIONS * 2;
/** Targets from the hardening issue: each route's requests/s against the bare route's in the same run. */
const T = { graphGet: 0.6, graphPut: 0.4 };

function sh(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, args, { cwd: ROOT, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", ...env } });
  if (r.status !== 0) throw new Error(`${args.join(" ")} failed`);
}
const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));
const pct = (xs: number[], p: number) => { const s = [...xs].sort((a, b) => a - b); return s[Math.min(s.length - 1, Math.floor(s.length * p))] ?? NaN; };

const signIn = (email: string, password: string) => signInAt(APP, email, password);

type Route = { name: string; method: "GET" | "PUT"; requests: autocannon.Request[] };
type Result = { name: string; requests: number; rps: number; cpuMsPerRequest: number; sysMsPerRequest: number; pgMsPerRequest: number; loadGenMsPerRequest: number; machineMsPerRequest: number; stealMsPerRequest: number; machineBusy: number; jsThreadBusy: number; p50: number; p95: number; p99: number; non2xx: number; errors: number; timeouts: number; statuses: Record<string, number> };

/**
 * CPU time the server process has used (user + system, ms) from /proc: divided by the requests of a run it is
 * each request's cost to the server, which other work on the machine moves far less than requests/s.
 */
function cpuMs(pid: number) {
  const f = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ");
  return ((Number(f[11]) + Number(f[12])) * 1000) / CLK_TCK;
}
/** The kernel's share of cpuMs (socket writes and reads). */
function sysMs(pid: number) {
  const f = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1].split(" ");
  return (Number(f[12]) * 1000) / CLK_TCK;
}
/** CPU of every PostgreSQL process on the machine (ms): the database's share of each request (nothing else runs PostgreSQL during a bench). */
function pgCpuMs() {
  let t = 0;
  for (const d of readdirSync("/proc")) {
    if (!/^\d+$/.test(d)) continue;
    try {
      const st = readFileSync(`/proc/${d}/stat`, "utf8");
      if (!st.includes("(postgres)")) continue;
      const f = st.split(") ")[1].split(" ");
      t += ((Number(f[11]) + Number(f[12])) * 1000) / CLK_TCK;
    } catch { /* gone */ }
  }
  return t;
}
/**
 * The whole machine's CPU time (ms, all cores) from /proc/stat: busy is everything but idle and I/O wait, with
 * the kernel's interrupt work and steal (time the host gave to other guests while this one wanted to run).
 */
function machineMs() {
  const [user, nice, system, , , irq, softirq, steal] = readFileSync("/proc/stat", "utf8").split("\n")[0].trim().split(/\s+/).slice(1).map(Number);
  return { busy: ((user + nice + system + irq + softirq + steal) * 1000) / CLK_TCK, steal: (steal * 1000) / CLK_TCK };
}
/** CPU time (ms) of the server's main thread alone, the one JavaScript runs on (GC helper threads excluded). */
function mainThreadMs(pid: number) {
  const f = readFileSync(`/proc/${pid}/task/${pid}/stat`, "utf8").split(") ")[1].split(" ");
  return ((Number(f[11]) + Number(f[12])) * 1000) / CLK_TCK;
}
const CORES = os.availableParallelism();
const CLK_TCK = Number(spawnSync("getconf", ["CLK_TCK"], { encoding: "utf8" }).stdout.trim()) || 100;

/** One autocannon run of `seconds` on a route; latencies of every answer are kept (bounded by the duration). */
async function load(route: Route, seconds: number, cookie: string, serverPid: number): Promise<Result> {
  const cpu0 = cpuMs(serverPid); const sys0 = sysMs(serverPid); const pg0 = pgCpuMs(); const me0 = process.cpuUsage();
  const m0 = machineMs(); const js0 = mainThreadMs(serverPid); const t0 = performance.now();
  const latencies: number[] = [];
  const statuses: Record<string, number> = {};
  let instance!: autocannon.Instance;
  const done = new Promise<autocannon.Result>((resolve, reject) => { instance = autocannon({
    url: APP,
    connections: CONNECTIONS,
    pipelining: 1,
    duration: seconds,
    timeout: 30,
    headers: { cookie, "content-type": "application/json" },
    method: route.method,
    requests: route.requests,
  }, (err, result) => (err ? reject(err) : resolve(result))); });
  instance.on("response", (_client, status, _bytes, ms) => { latencies.push(ms); statuses[status] = (statuses[status] ?? 0) + 1; });
  const r = await done;
  const cpu = cpuMs(serverPid) - cpu0;
  const n = Math.max(1, r.requests.total);
  const me = process.cpuUsage(me0);
  const m1 = machineMs(); const wall = performance.now() - t0;
  return {
    name: route.name,
    requests: r.requests.total,
    rps: r.requests.total / seconds,
    cpuMsPerRequest: cpu / n,
    sysMsPerRequest: (sysMs(serverPid) - sys0) / n,
    pgMsPerRequest: (pgCpuMs() - pg0) / n,
    loadGenMsPerRequest: (me.user + me.system) / 1000 / n,
    machineMsPerRequest: (m1.busy - m0.busy) / n,
    stealMsPerRequest: (m1.steal - m0.steal) / n,
    machineBusy: (m1.busy - m0.busy) / (wall * CORES),
    jsThreadBusy: (mainThreadMs(serverPid) - js0) / wall,
    p50: pct(latencies, 0.5),
    p95: pct(latencies, 0.95),
    p99: pct(latencies, 0.99),
    non2xx: r.non2xx,
    errors: r.errors,
    timeouts: r.timeouts,
    statuses,
  };
}

export async function run() {
  console.log(`Throwaway database ${DB} on the test cluster; app on ${APP}; ${CONNECTIONS} connections, ${SECONDS} s a route`);
  sh(["--import", "tsx", "scripts/reset-db.ts", DB]);
  sh(["--import", "tsx", "scripts/migrate.ts", "--seed"], { DATABASE_URL: DB_URL });
  const { startLocalServices } = await import("../../scripts/services.mjs");
  const env: Record<string, string> = { ...(process.env as Record<string, string>), LW_SERVICES_MODE: "bench", DATABASE_URL: DB_URL, NEXT_DIST_DIR: DIST, NEXTAUTH_SECRET: "bench-secret-not-for-production", NEXTAUTH_URL: APP, NEXT_TELEMETRY_DISABLED: "1", LW_WORKER: "0" };
  const services = await startLocalServices(env);
  if (process.env.LW_SKIP_BUILD !== "1" || !existsSync(path.join(ROOT, DIST, "BUILD_ID"))) sh(["node_modules/next/dist/bin/next", "build"], { ...env, NODE_ENV: "production" });
  // The server's output goes to a file: a run's end cuts the saves in flight, which the server logs as aborted requests.
  mkdirSync(path.dirname(OUT), { recursive: true });
  const serverLog = openSync(path.join(ROOT, "tests/artifacts/bench-load-server.log"), "w");
  const profile = process.env.LW_BENCH_PROFILE;
  const nodeArgs = profile ? ["--cpu-prof", `--cpu-prof-dir=${path.resolve(profile)}`] : [];
  const server = spawn(process.execPath, nextStartArgs("127.0.0.1", PORT, nodeArgs), { cwd: ROOT, env: { ...env, NODE_ENV: "production" }, stdio: ["ignore", serverLog, serverLog] });
  const db = knex({ client: "pg", connection: DB_URL, pool: { min: 0, max: 2 } });
  try {
    for (let i = 0; ; i++) { try { if ((await fetch(`${APP}/api/health`)).ok) break; } catch {} if (i > 240) throw new Error("the app did not start"); await wait(250); }
    const owner = DEMO_USERS.find((u) => u.role === "owner")!;
    const cookie = await signIn(owner.email, owner.password);
    const demo = await db("builds").where({ name: DEMO_BUILD.name }).first("id");
    const pitch = await db("linkages").where({ build_id: demo.id, name: demoPitchLinkage().name }).first("id");
    const L = (id: string) => `/api/builds/${demo.id}/linkages/${id}`;
    const current = await (await fetch(`${APP}${L(pitch.id)}/graph`, { headers: { cookie } })).json();
    const graphJson = JSON.stringify(current.graph);

    // The save targets: copies of the pitch linkage made through the API, each lent to one request at a time.
    const all: { id: string; revision: number }[] = [];
    let free: typeof all = [];
    for (let i = 0; i < SAVE_TARGETS; i++) {
      const res = await fetch(`${APP}/api/builds/${demo.id}/linkages`, { method: "POST", headers: { cookie, "content-type": "application/json" }, body: JSON.stringify({ name: `Bench save target ${i + 1}`, system: current.graph.system, graph: current.graph }) });
      if (res.status !== 201) throw new Error(`making a save target: HTTP ${res.status} ${await res.text()}`);
      const { linkage } = await res.json();
      all.push({ id: linkage.id, revision: linkage.revision });
    }
    /**
     * Every target free again, at its revision as stored: a request in flight when a run stopped never gave
     * its target back, and its save may have landed after the stop.
     */
    const refreshTargets = async () => {
      await wait(1000);
      const rows: { id: string; current_revision: number }[] = await db("linkages").whereIn("id", all.map((t) => t.id)).select("id", "current_revision");
      for (const t of all) t.revision = rows.find((r) => r.id === t.id)!.current_revision;
      free = [...all];
    };
    await refreshTargets();
    type SaveCtx = { target?: { id: string; revision: number } };
    const putRoute = (name: string, headers: Record<string, string>): Route => ({
      name,
      method: "PUT",
      requests: [{
        method: "PUT",
        setupRequest: (req, context) => {
          const target = free.pop();
          if (!target) throw new Error("no save target free: more requests in flight than targets");
          (context as SaveCtx).target = target;
          return { ...req, method: "PUT", headers: { ...req.headers, ...headers }, path: `${L(target.id)}/graph`, body: `{"baseRevision":${target.revision},"graph":${graphJson}}` };
        },
        onResponse: (status, body, context) => {
          const target = (context as SaveCtx).target;
          if (!target) return;
          if (status === 200) target.revision = JSON.parse(body).revision;
          free.push(target);
        },
      }],
    });
    const routes: Route[] = [
      { name: "GET /api/health (bare)", method: "GET", requests: [{ method: "GET", path: "/api/health" }] },
      { name: "GET graph", method: "GET", requests: [{ method: "GET", path: `${L(pitch.id)}/graph` }] },
      // As the editor saves (Prefer: return=minimal: the report computed and stored, its summary answered), and as
      // an API client that wants the whole report back.
      putRoute("PUT graph (with analysis, as the editor saves)", { prefer: PREFER_MINIMAL }),
      putRoute("PUT graph (with analysis, whole report answered)", {}),
      { name: "GET comments", method: "GET", requests: [{ method: "GET", path: `${L(pitch.id)}/comments` }] },
    ];

    // The bare route runs before and after each other route: each ratio is to the mean of the two bare runs
    // around it, so other work on the machine that comes and goes during the bench moves both alike.
    const [bareRoute, ...others] = routes;
    // LW_BENCH_ONLY="GET graph": only the routes whose names contain it (with the bare route around each), e.g. to profile one.
    const only = process.env.LW_BENCH_ONLY;
    const measured = only ? others.filter((r) => r.name.includes(only)) : others;
    const run1 = async (route: Route, warm: boolean) => {
      if (warm) await load(route, WARM_S, cookie, server.pid!); // the server's first compile and the JIT of this route are not measured
      if (route.method === "PUT") await refreshTargets();
      const r = await load(route, SECONDS, cookie, server.pid!);
      if (route.method === "PUT") await refreshTargets();
      console.log(`  ${r.name}: ${r.rps.toFixed(0)} requests/s, server CPU ${r.cpuMsPerRequest.toFixed(2)} ms a request (kernel ${r.sysMsPerRequest.toFixed(2)}), PostgreSQL ${r.pgMsPerRequest.toFixed(2)} ms, load generator ${r.loadGenMsPerRequest.toFixed(2)} ms, whole machine ${r.machineMsPerRequest.toFixed(2)} ms (steal ${r.stealMsPerRequest.toFixed(2)}; cores ${(r.machineBusy * 100).toFixed(0)} % busy, server's JavaScript thread ${(r.jsThreadBusy * 100).toFixed(0)} %), p95 ${r.p95.toFixed(0)} ms, answers ${JSON.stringify(r.statuses)}${r.errors ? `, ${r.errors} errors` : ""}`);
      return r;
    };
    const bares: Result[] = [await run1(bareRoute, true)];
    const results: (Result & { bareRps: number })[] = [];
    for (const route of measured) {
      const r = await run1(route, true);
      bares.push(await run1(bareRoute, false));
      results.push({ ...r, bareRps: (bares.at(-2)!.rps + bares.at(-1)!.rps) / 2 });
    }
    const target: Record<string, number | undefined> = { "GET graph": T.graphGet, "PUT graph (with analysis, as the editor saves)": T.graphPut };
    let ok = bares.every((b) => b.non2xx === 0 && b.errors === 0 && b.timeouts === 0);
    const rows = [{
      route: bareRoute.name,
      "requests/s": `${Math.round(Math.min(...bares.map((b) => b.rps)))}–${Math.round(Math.max(...bares.map((b) => b.rps)))}`,
      "÷ bare": "100 %",
      target: "reported",
      "server CPU ms/request": bares.map((b) => b.cpuMsPerRequest.toFixed(2)).join(" / "),
      "PostgreSQL CPU ms": bares.map((b) => b.pgMsPerRequest.toFixed(2)).join(" / "),
      "machine CPU ms": bares.map((b) => b.machineMsPerRequest.toFixed(2)).join(" / "),
      "cores / JS thread busy": bares.map((b) => `${(b.machineBusy * 100).toFixed(0)}/${(b.jsThreadBusy * 100).toFixed(0)} %`).join(" · "),
      "p50 ms": bares.map((b) => b.p50.toFixed(1)).join(" / "),
      "p95 ms": bares.map((b) => b.p95.toFixed(1)).join(" / "),
      holds: ok ? "" : "NO (non-2xx or errors)",
    }, ...results.map((r) => {
      const ratio = r.rps / r.bareRps;
      const t = target[r.name];
      const clean = r.non2xx === 0 && r.errors === 0 && r.timeouts === 0;
      const holds = clean && (t === undefined || ratio >= t);
      ok &&= holds;
      return {
        route: r.name,
        "requests/s": String(Math.round(r.rps)),
        "÷ bare": `${(ratio * 100).toFixed(0)} %`,
        target: t === undefined ? "reported" : `≥ ${(t * 100).toFixed(0)} %`,
        "server CPU ms/request": r.cpuMsPerRequest.toFixed(2),
        "PostgreSQL CPU ms": r.pgMsPerRequest.toFixed(2),
        "machine CPU ms": r.machineMsPerRequest.toFixed(2),
        "cores / JS thread busy": `${(r.machineBusy * 100).toFixed(0)}/${(r.jsThreadBusy * 100).toFixed(0)} %`,
        "p50 ms": r.p50.toFixed(1),
        "p95 ms": r.p95.toFixed(1),
        holds: !clean ? "NO (non-2xx or errors)" : t === undefined ? "" : holds ? "yes" : "NO",
      };
    })];
    console.table(rows);
    const saved = await db("linkage_revisions").whereIn("linkage_id", all.map((t) => t.id)).count<{ n: string }[]>("* as n");
    console.log(`(${CONNECTIONS} connections, ${SECONDS} s a route after ${WARM_S} s of warm-up; the bare route before and after each other route, each ratio to the mean of those two; ${Number(saved[0].n) - SAVE_TARGETS} saves stored across ${SAVE_TARGETS} linkages; load generator and server share this machine's ${CORES} cores)`);
    mkdirSync(path.dirname(OUT), { recursive: true });
    writeFileSync(OUT, JSON.stringify({ at: new Date().toISOString(), connections: CONNECTIONS, seconds: SECONDS, targets: T, bare: bares, results: results.map((r) => ({ ...r, ratioToBare: r.rps / r.bareRps })), ok }, null, 2));
    console.log(`Figures written to ${path.relative(ROOT, OUT)}`);
    return { ok };
  } finally {
    server.kill("SIGTERM");
    await new Promise((r) => { if (server.exitCode !== null) r(null); else { server.once("exit", r); setTimeout(r, 10_000); } });
    await db.destroy();
    await services.stop?.();
  }
}

if (process.argv[1]?.endsWith("load.ts")) run().then((r) => { process.exitCode = r.ok ? 0 : 1; process.exit(); }, (e) => { console.error(e); process.exit(1); });
