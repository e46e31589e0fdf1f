/**
 * Editor benchmark (issue 4), in headless Debian Chromium against a production Vite build of the editor
 * alone (tests/bench/editor-harness; the API is answered in the page, so no server or database).
 * Reports: time to first render of a generated 500-part linkage; while a part near the middle of the
 * canvas is dragged for 2 s (the pointer stays inside the canvas, so React Flow does not auto-pan), the
 * interval between animation frames AND the main-thread work per frame; and the PNG export time for
 * 200 parts.
 *
 * The frame interval alone cannot show "under 16 ms": at 60 Hz it never goes below the 16.7 ms vsync,
 * and a frame that needs 20 ms of work shows up as 33.3 ms. So the drag is also traced (CDP Tracing) and
 * for each frame (from one BeginMainFrame on the renderer's main thread to the next) the main thread's
 * work (input handling, React, rAF, style, layout, paint) is summed twice: as CPU time of the thread, and
 * as wall time, which also counts the time the thread was ready but waiting for a core.
 * Targets: first render < 2 s; drag: main-thread CPU per frame p95 < 16 ms and frame interval p95 at the
 * 60 Hz vsync (< 17 ms: 95 % of frames on time, none dropped); export < 1.5 s.
 * The wall time per frame is reported, not judged: on a 2-core machine the renderer's main thread shares
 * the cores with its compositor and raster threads, the browser and display processes (software drawing,
 * no GPU) and this script, so it exceeds the CPU time by the time spent waiting; the frame interval shows
 * whether that wait cost a frame.
 */
import path from "node:path";
import { build, preview } from "vite";
import { chromium, type CDPSession, type Page } from "playwright-core";

const ROOT = path.resolve(__dirname, "../..");
const HARNESS = path.join(__dirname, "editor-harness");
const OUT = path.join(ROOT, "tests/artifacts/bench-editor-dist");

export type EditorBenchResult = {
  firstRenderMs: number;
  dragFrameMedianMs: number;
  dragFrameP95Ms: number;
  dragFrames: number;
  /** Main-thread busy time per frame while dragging (from the trace). */
  dragWorkMedianMs: number;
  dragWorkP95Ms: number;
  dragWorkMaxMs: number;
  /** Main-thread CPU time per frame while dragging (from the trace). */
  dragCpuMedianMs: number;
  dragCpuP95Ms: number;
  /** Frames whose main-thread work was 16 ms or more. */
  dragFramesOver16: number;
  dragMoves: number;
  exportMs: number;
  exportParts: number;
};

function pct(xs: number[], p: number) {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))];
}

/** Opens the generated linkage; returns when it was ready (ms after navigation) and how many parts are mounted. */
async function openEditor(page: Page, base: string, n: number): Promise<{ readyMs: number; mounted: number }> {
  await page.goto(`${base}/?n=${n}`);
  // Ready: the opening view is set and every part the canvas mounted (only those in view) is measured and
  // shown with its ports.
  await page.waitForFunction(
    () => {
      if (!document.querySelector('[data-view="ready"]')) return false;
      const nodes = Array.from(document.querySelectorAll<HTMLElement>(".react-flow__node"));
      if (nodes.length === 0) return false;
      return nodes.every((el) => el.style.visibility !== "hidden" && el.querySelector(".react-flow__handle"));
    },
    undefined,
    { timeout: 60_000, polling: "raf" },
  );
  const readyMs = await page.evaluate(() => performance.now());
  return { readyMs, mounted: await page.locator(".react-flow__node").count() };
}

type TraceEvent = { name: string; ph: string; pid: number; tid: number; ts: number; dur?: number; tdur?: number; args?: { name?: string } };

async function traceStart(cdp: CDPSession) {
  const events: TraceEvent[] = [];
  cdp.on("Tracing.dataCollected", (d) => events.push(...(d.value as unknown as TraceEvent[])));
  // RunTask (every main-thread task) and BeginMainFrame (one per frame); nothing heavier.
  await cdp.send("Tracing.start", { traceConfig: { includedCategories: process.env.LW_BENCH_CATEGORIES ? process.env.LW_BENCH_CATEGORIES.split(",") : ["disabled-by-default-devtools.timeline", "benchmark"], excludedCategories: ["*"] }, transferMode: "ReportEvents" });
  return async () => {
    const done = new Promise((r) => cdp.once("Tracing.tracingComplete", r));
    await cdp.send("Tracing.end");
    await done;
    return events;
  };
}

/**
 * Per frame on the renderer main thread: busy time (merged RunTask spans, wall clock) between consecutive
 * BeginMainFrames, and the main thread's CPU time in the tasks that start in that frame (robust to other
 * processes competing for the CPU, which stretch wall time).
 */
function workPerFrame(events: TraceEvent[]): { wall: number[]; cpu: number[] } {
  const mains = new Set(events.filter((e) => e.ph === "M" && e.name === "thread_name" && e.args?.name === "CrRendererMain").map((e) => `${e.pid}:${e.tid}`));
  const busy = new Map<string, number>();
  for (const e of events) if (e.name === "RunTask" && e.ph === "X" && mains.has(`${e.pid}:${e.tid}`)) busy.set(`${e.pid}:${e.tid}`, (busy.get(`${e.pid}:${e.tid}`) ?? 0) + (e.dur ?? 0));
  const main = [...busy].sort((a, b) => b[1] - a[1])[0]?.[0];
  if (!main) return { wall: [], cpu: [] };
  const on = (e: TraceEvent) => `${e.pid}:${e.tid}` === main;
  const frames = events.filter((e) => on(e) && e.ph === "X" && e.name === "ProxyMain::BeginMainFrame").map((e) => e.ts).sort((a, b) => a - b);
  const runTasks = events.filter((e) => on(e) && e.ph === "X" && e.name === "RunTask").sort((a, b) => a.ts - b.ts);
  const tasks = runTasks.map((e) => [e.ts, e.ts + (e.dur ?? 0)] as const);
  // Merge nested / overlapping tasks.
  const spans: [number, number][] = [];
  for (const [a, b] of tasks) {
    const last = spans[spans.length - 1];
    if (last && a <= last[1]) last[1] = Math.max(last[1], b);
    else spans.push([a, b]);
  }
  const wall: number[] = [];
  const cpu: number[] = [];
  let j = 0;
  for (let i = 0; i + 1 < frames.length; i++) {
    const [f0, f1] = [frames[i], frames[i + 1]];
    let sum = 0;
    while (j < spans.length && spans[j][1] <= f0) j++;
    for (let k = j; k < spans.length && spans[k][0] < f1; k++) sum += Math.min(f1, spans[k][1]) - Math.max(f0, spans[k][0]);
    wall.push(sum / 1000);
    // Top-level tasks only (a nested RunTask's time is inside its parent's).
    let c = 0;
    let end = -Infinity;
    for (const t of runTasks) {
      if (t.ts >= f1) break;
      if (t.ts < end) continue;
      end = t.ts + (t.dur ?? 0);
      if (t.ts >= f0) c += t.tdur ?? t.dur ?? 0;
    }
    cpu.push(c / 1000);
  }
  return { wall, cpu };
}

export async function run(): Promise<{ ok: boolean; result: EditorBenchResult }> {
  await build({
    root: HARNESS,
    configFile: false,
    logLevel: "error",
    resolve: { tsconfigPaths: true },
    css: { postcss: ROOT },
    build: { outDir: OUT, emptyOutDir: true, minify: !process.env.LW_BENCH_PROFILE, reportCompressedSize: false, chunkSizeWarningLimit: 5000, modulePreload: { polyfill: false } },
  });
  const server = await preview({ root: HARNESS, configFile: false, logLevel: "error", build: { outDir: OUT }, preview: { port: 0, host: "127.0.0.1" } });
  const base = server.resolvedUrls?.local[0]?.replace(/\/$/, "") ?? "";
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || "/usr/bin/chromium",
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking"],
  });
  try {
    const ctx = await browser.newContext({ viewport: { width: 1600, height: 1000 }, acceptDownloads: true });
    // 1. Time to first render: navigation start → the parts in view measured and shown.
    const renders: number[] = [];
    let mounted500 = 0;
    for (let i = 0; i < 3; i++) {
      const p = await ctx.newPage();
      p.on("pageerror", (e) => console.error("page error:", String(e)));
      const o = await openEditor(p, base, 500);
      renders.push(o.readyMs);
      mounted500 = o.mounted;
      if (i < 2) await p.close();
    }
    const firstRenderMs = pct(renders, 50);

    // 2. Drag the part nearest the middle of the canvas for 2 s (the pointer stays well inside the canvas),
    //    recording the interval between animation frames and, from a trace, the main-thread work per frame.
    const page = ctx.pages()[ctx.pages().length - 1];
    if (process.env.LW_BENCH_CSS) await page.addStyleTag({ content: process.env.LW_BENCH_CSS });
    const pane = (await page.locator(".react-flow").boundingBox())!;
    const boxes = await page.locator(".react-flow__node").evaluateAll((els) => els.map((el) => el.getBoundingClientRect().toJSON() as DOMRect));
    const cx = pane.x + pane.width / 2;
    const cy = pane.y + pane.height / 2;
    const box = boxes.reduce((a, b) => (Math.hypot(b.x + b.width / 2 - cx, b.y + b.height / 2 - cy) < Math.hypot(a.x + a.width / 2 - cx, a.y + a.height / 2 - cy) ? b : a));
    const x0 = box.x + box.width / 2;
    const y0 = box.y + 10;
    await page.mouse.move(x0, y0);
    await page.mouse.down();
    await page.mouse.move(x0 + 8, y0 + 8, { steps: 2 });
    const cdp = await page.context().newCDPSession(page);
    const traceStop = await traceStart(cdp);
    if (process.env.LW_BENCH_PROFILE) { await cdp.send("Profiler.enable"); await cdp.send("Profiler.setSamplingInterval", { interval: 200 }); await cdp.send("Profiler.start"); }
    // A string, so the loader's helpers (tsx names functions) do not leak into the page.
    await page.evaluate(`(() => {
      window.__frames = [];
      window.__stop = false;
      let last = 0;
      const tick = (t) => {
        window.__frames.push(t - last);
        last = t;
        if (!window.__stop) requestAnimationFrame(tick);
      };
      requestAnimationFrame((t) => { last = t; requestAnimationFrame(tick); });
    })()`);
    const start = Date.now();
    let k = 0;
    while (Date.now() - start < 2000) {
      k++;
      await page.mouse.move(x0 + 8 + 150 * Math.sin(k / 15), y0 + 8 + 80 * Math.cos(k / 20));
    }
    const frames = (await page.evaluate("(() => { window.__stop = true; return window.__frames; })()")) as number[];
    if (process.env.LW_BENCH_PROFILE) { const { profile } = await cdp.send("Profiler.stop"); (await import("node:fs")).writeFileSync(process.env.LW_BENCH_PROFILE, JSON.stringify(profile)); }
    const trace = await traceStop();
    // LW_BENCH_TRACE=file.json keeps the drag's trace (open it in chrome://tracing or Perfetto).
    if (process.env.LW_BENCH_TRACE) (await import("node:fs")).writeFileSync(process.env.LW_BENCH_TRACE, JSON.stringify({ traceEvents: trace }));
    const { wall: work, cpu } = workPerFrame(trace);
    await cdp.detach();
    await page.mouse.up();

    // 3. PNG export of a 200-part linkage (click → file downloaded).
    const p200 = await ctx.newPage();
    p200.on("pageerror", (e) => console.error("page error:", String(e)));
    p200.on("console", (m) => m.type() === "error" && console.error("console:", m.text()));
    await openEditor(p200, base, 200);
    const exports: number[] = [];
    for (let i = 0; i < 3; i++) {
      const t0 = Date.now();
      const [dl] = await Promise.all([p200.waitForEvent("download", { timeout: 20_000 }), p200.getByTestId("btn-export-png").click()]).catch(async (e) => {
        throw new Error(`no picture: ${(await p200.getByTestId("notice").textContent().catch(() => "")) || String(e)}`);
      });
      await dl.path();
      exports.push(Date.now() - t0);
    }
    const exportMs = pct(exports, 50);

    const result: EditorBenchResult = {
      firstRenderMs: Math.round(firstRenderMs),
      dragFrameMedianMs: Number(pct(frames, 50).toFixed(1)),
      dragFrameP95Ms: Number(pct(frames, 95).toFixed(1)),
      dragFrames: frames.length,
      dragWorkMedianMs: Number(pct(work, 50).toFixed(1)),
      dragWorkP95Ms: Number(pct(work, 95).toFixed(1)),
      dragWorkMaxMs: Number(Math.max(0, ...work).toFixed(1)),
      dragCpuMedianMs: Number((pct(cpu, 50) ?? 0).toFixed(1)),
      dragCpuP95Ms: Number((pct(cpu, 95) ?? 0).toFixed(1)),
      dragFramesOver16: work.filter((w) => w >= 16).length,
      dragMoves: k,
      exportMs,
      exportParts: 200,
    };
    const checks = {
      firstRender: result.firstRenderMs < 2000,
      work: cpu.length > 0 && result.dragCpuP95Ms < 16,
      interval: result.dragFrameP95Ms < 17,
      export: result.exportMs < 1500,
    };
    const ok = checks.firstRender && checks.work && checks.interval && checks.export;
    const yes = (b: boolean) => (b ? "yes" : "NO");
    console.table([
      { measure: "first render, 500 parts", value: `${result.firstRenderMs} ms`, target: "< 2000 ms", holds: yes(checks.firstRender) },
      { measure: "drag: main-thread CPU per frame p50", value: `${result.dragCpuMedianMs} ms`, target: "reported", holds: "" },
      { measure: "drag: main-thread CPU per frame p95", value: `${result.dragCpuP95Ms} ms`, target: "< 16 ms", holds: yes(checks.work) },
      { measure: "drag: main-thread wall time per frame p95", value: `${result.dragWorkP95Ms} ms`, target: "reported (CPU time plus waiting for a core)", holds: "" },
      { measure: "drag: frame interval p50", value: `${result.dragFrameMedianMs} ms`, target: "reported (16.7 ms = 60 Hz vsync)", holds: "" },
      { measure: "drag: frame interval p95", value: `${result.dragFrameP95Ms} ms`, target: "< 17 ms (33 ms = a dropped frame)", holds: yes(checks.interval) },
      { measure: "PNG export, 200 parts", value: `${result.exportMs} ms`, target: "< 1500 ms", holds: yes(checks.export) },
    ]);
    console.log(
      `(drag: ${result.dragMoves} pointer moves, ${result.dragFrames} frames, ${work.length} traced frames, ${cpu.filter((c) => c >= 16).length} with ≥ 16 ms of main-thread CPU (${result.dragFramesOver16} of wall time), worst ${result.dragWorkMaxMs} ms; ` +
        `first renders ${renders.map((r) => Math.round(r)).join(", ")} ms with ${mounted500} of 500 parts in view and mounted; exports ${exports.join(", ")} ms)`,
    );
    console.log(`editor targets: ${ok ? "all hold" : `missed: ${Object.entries(checks).filter(([, v]) => !v).map(([k]) => k).join(", ")}`}`);
    return { ok, result };
  } finally {
    await browser.close();
    await new Promise<void>((r) => server.httpServer.close(() => r()));
  }
}

if (process.argv[1] && process.argv[1].endsWith("editor.ts")) {
  run().then(({ ok }) => (process.exitCode = ok ? 0 : 1));
}
