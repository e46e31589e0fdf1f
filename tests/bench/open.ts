/**
 * Opening the editor against opening the builds list, in Debian Chromium on a `next start` of its own
 * (throwaway database linkwright_bench_open on the test cluster, seeded with the demo; port LW_TEST_PORT + 3):
 * the time from navigation to the first finding on the demo pitch linkage, and to the first build card on the
 * builds list, each from a cold browser cache (median of 5), and the script each page loads. Targets (issue
 * "at the aircraft"): the editor within 2 × the builds list, and at most 350 KB of script the builds list does
 * not load. `LW_SKIP_BUILD=1` reuses the build in LW_BENCH_DIST (default .next-bench).
 */
import { spawn, spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import knex from "knex";
import { chromium, type BrowserContext } from "playwright-core";
import { DEMO_BUILD, DEMO_USERS } from "../../db/demo-accounts";
import { demoPitchLinkage } from "../../shared/demo";
import { localDbUrl } from "../../db/local-cluster.cjs";
import { nextStartArgs } from "../../scripts/next-start.mjs";

const ROOT = path.resolve(__dirname, "../..");
const DB = "linkwright_bench_open";
const DB_URL = localDbUrl(DB, "test");
const PORT = Number(process.env.LW_TEST_PORT || 3100) + 3; // +1 two-instance test, +2 bench:scale
const APP = `http://127.0.0.1:${PORT}`;
const DIST = process.env.LW_BENCH_DIST || ".next-bench";
const T = { ratio: 2, editorOnlyKB: 350 };
const RUNS = 5;
/** The editor's first finding (the server's, until the editor is loaded), and its canvas drawn with a part. */
const FINDING = "[data-testid=findings] [data-testid=finding]";
const CANVAS = "[data-testid=linkage-editor] .react-flow__node";

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1];
function sh(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, args, { cwd: ROOT, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", ...env } });
  if (r.status !== 0) throw new Error(`${args.join(" ")} failed`);
}

/**
 * One cold open: a new context (empty cache) with the session cookie; ms to `ready`, and every script's bytes by URL
 * once `drawn` shows (the page's own script has run: the editor's first finding is the server's, shown while the
 * editor's script loads, and on a busy machine the network can fall quiet for a moment before that script is asked for).
 */
async function open(ctx: () => Promise<BrowserContext>, url: string, ready: string, drawn = ready) {
  const c = await ctx();
  const page = await c.newPage();
  const scripts = new Map<string, number>();
  page.on("response", (r) => {
    if (r.request().resourceType() !== "script") return;
    void r.body().then((b) => scripts.set(new URL(r.url()).pathname, b.length)).catch(() => {});
  });
  const t0 = Date.now();
  await page.goto(url, { waitUntil: "commit" });
  await page.locator(ready).first().waitFor({ timeout: 60_000 });
  const ms = Date.now() - t0;
  await page.locator(drawn).first().waitFor({ timeout: 60_000 });
  await page.waitForLoadState("networkidle").catch(() => {});
  await c.close();
  return { ms, scripts };
}

export async function run() {
  console.log(`Throwaway database ${DB} on the test cluster; app on ${APP}`);
  sh(["--import", "tsx", "scripts/reset-db.ts", DB]);
  sh(["--import", "tsx", "scripts/migrate.ts", "--seed"], { DATABASE_URL: DB_URL });
  const { startLocalServices } = await import("../../scripts/services.mjs");
  const env: Record<string, string> = { ...(process.env as Record<string, string>), LW_SERVICES_MODE: "bench", DATABASE_URL: DB_URL, NEXT_DIST_DIR: DIST, NEXTAUTH_SECRET: "bench-secret-not-for-production", NEXTAUTH_URL: APP, NEXT_TELEMETRY_DISABLED: "1", LW_WORKER: "0" };
  const services = await startLocalServices(env);
  // LW_SKIP_BUILD=1 reuses the build, when there is one.
  if (process.env.LW_SKIP_BUILD !== "1" || !existsSync(path.join(ROOT, DIST, "BUILD_ID"))) sh(["node_modules/next/dist/bin/next", "build"], { ...env, NODE_ENV: "production" });
  const server = spawn(process.execPath, nextStartArgs("127.0.0.1", PORT), { cwd: ROOT, env: { ...env, NODE_ENV: "production" }, stdio: "ignore" });
  const db = knex({ client: "pg", connection: DB_URL, pool: { min: 0, max: 2 } });
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH || "/usr/bin/chromium", args: ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking"] });
  try {
    for (let i = 0; ; i++) { try { if ((await fetch(`${APP}/api/auth/csrf`)).ok) break; } catch {} if (i > 240) throw new Error("the app did not start"); await new Promise((r) => setTimeout(r, 250)); }
    const demo = await db("builds").where({ name: DEMO_BUILD.name }).first("id");
    const linkage = await db("linkages").where({ build_id: demo.id, name: demoPitchLinkage().name }).first("id");
    // Sign in once through the page; each measured open starts from an empty cache with that session.
    const first = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const p = await first.newPage();
    await p.goto(`${APP}/sign-in`);
    await p.getByLabel("E-mail").fill(DEMO_USERS[0].email);
    await p.getByLabel("Password").fill(DEMO_USERS[0].password);
    await p.getByRole("button", { name: "Sign in" }).click();
    await p.waitForURL(/\/builds/);
    const state = await first.storageState();
    await first.close();
    const ctx = () => browser.newContext({ viewport: { width: 1440, height: 900 }, storageState: state });

    const listUrl = `${APP}/builds`, editorUrl = `${APP}/builds/${demo.id}/linkages/${linkage.id}`;
    await open(ctx, listUrl, "[data-testid=build-card]"); // the server's first compile of each page is not measured
    await open(ctx, editorUrl, FINDING, CANVAS);
    const list: number[] = [], editor: number[] = [];
    let listScripts = new Map<string, number>(), editorScripts = new Map<string, number>();
    for (let i = 0; i < RUNS; i++) {
      const a = await open(ctx, listUrl, "[data-testid=build-card]");
      const b = await open(ctx, editorUrl, FINDING, CANVAS);
      list.push(a.ms); editor.push(b.ms); listScripts = a.scripts; editorScripts = b.scripts;
    }
    const kb = (m: Map<string, number>) => [...m.values()].reduce((x, y) => x + y, 0) / 1024;
    const onlyEditor = new Map([...editorScripts].filter(([k]) => !listScripts.has(k)));
    const ratio = median(editor) / median(list);
    const rows = [
      { measure: "builds list: first build card (median, cold cache)", value: `${median(list)} ms`, target: "reported", holds: "" },
      { measure: "editor: first finding (median, cold cache)", value: `${median(editor)} ms`, target: "reported", holds: "" },
      { measure: "editor ÷ builds list", value: `${ratio.toFixed(2)} ×`, target: `≤ ${T.ratio} ×`, holds: ratio <= T.ratio ? "yes" : "NO" },
      { measure: "script, builds list", value: `${kb(listScripts).toFixed(0)} KB`, target: "reported", holds: "" },
      { measure: "script, editor", value: `${kb(editorScripts).toFixed(0)} KB`, target: "reported", holds: "" },
      { measure: "script only the editor loads", value: `${kb(onlyEditor).toFixed(1)} KB`, target: `≤ ${T.editorOnlyKB} KB`, holds: kb(onlyEditor) <= T.editorOnlyKB ? "yes" : "NO" },
    ];
    console.table(rows);
    const top = [...onlyEditor].sort((a, b) => b[1] - a[1]).slice(0, 6).map(([k, v]) => `${path.basename(k)} ${(v / 1024).toFixed(0)} KB`);
    console.log(`(largest scripts only the editor loads: ${top.join(", ")})`);
    console.log(`(runs: builds list ${list.join(", ")} ms; editor ${editor.join(", ")} ms; uncompressed script bytes as the browser received them)`);
    return { ok: ratio <= T.ratio && kb(onlyEditor) <= T.editorOnlyKB };
  } finally {
    await browser.close();
    server.kill("SIGTERM");
    await db.destroy();
    await services.stop?.();
  }
}

if (process.argv[1]?.endsWith("open.ts")) run().then((r) => { process.exitCode = r.ok ? 0 : 1; process.exit(); }, (e) => { console.error(e); process.exit(1); });
