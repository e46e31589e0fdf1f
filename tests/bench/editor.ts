/**
 * Editor benchmark (issue 4), in headless Debian Chromium against a production Vite build of the editor
 * alone (tests/bench/editor-harness; the API is answered in the page, so no server or database).
 * Reports: time to first render of a generated 500-part linkage, the median and 95th-percentile frame
 * time (interval between animation frames) while a part is dragged for 2 s, and the PNG export time
 * for 200 parts. Targets: first render < 2 s, drag frames < 16 ms (p50; one 60 Hz frame is 16.7 ms),
 * export < 1.5 s.
 */
import path from "node:path";
import { build, preview } from "vite";
import { chromium, type Page } from "playwright-core";

const ROOT = path.resolve(__dirname, "../..");
const HARNESS = path.join(__dirname, "editor-harness");
const OUT = path.join(ROOT, "tests/artifacts/bench-editor-dist");

export type EditorBenchResult = {
  firstRenderMs: number;
  dragFrameMedianMs: number;
  dragFrameP95Ms: number;
  dragFrames: number;
  exportMs: number;
  exportParts: number;
};

function pct(xs: number[], p: number) {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))];
}

async function openEditor(page: Page, base: string, n: number) {
  await page.goto(`${base}/?n=${n}`);
  await page.waitForFunction(
    (count) => {
      const nodes = document.querySelectorAll(".react-flow__node");
      if (nodes.length !== count) return false;
      // React Flow shows a node once it is measured.
      return Array.from(nodes).every((el) => (el as HTMLElement).style.visibility !== "hidden");
    },
    n,
    { timeout: 60_000, polling: "raf" },
  );
  return page.evaluate(() => performance.now());
}

export async function run(): Promise<{ ok: boolean; result: EditorBenchResult }> {
  await build({
    root: HARNESS,
    configFile: false,
    logLevel: "error",
    resolve: { tsconfigPaths: true },
    css: { postcss: ROOT },
    build: { outDir: OUT, emptyOutDir: true, reportCompressedSize: false, chunkSizeWarningLimit: 5000, modulePreload: { polyfill: false } },
  });
  const server = await preview({ root: HARNESS, configFile: false, logLevel: "error", build: { outDir: OUT }, preview: { port: 0, host: "127.0.0.1" } });
  const base = server.resolvedUrls?.local[0]?.replace(/\/$/, "") ?? "";
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || "/usr/bin/chromium",
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking"],
  });
  try {
    const ctx = await browser.newContext({ viewport: { width: 1600, height: 1000 }, acceptDownloads: true });
    // 1. Time to first render: navigation start → all 500 parts measured and shown.
    const renders: number[] = [];
    for (let i = 0; i < 3; i++) {
      const p = await ctx.newPage();
      renders.push(await openEditor(p, base, 500));
      if (i < 2) await p.close();
    }
    const firstRenderMs = pct(renders, 50);

    // 2. Drag one part for 2 s and record the interval between animation frames.
    const page = ctx.pages()[ctx.pages().length - 1];
    const handle = page.locator(".react-flow__node").first();
    const box = (await handle.boundingBox())!;
    const x0 = box.x + box.width / 2;
    const y0 = box.y + 10;
    await page.mouse.move(x0, y0);
    await page.mouse.down();
    await page.mouse.move(x0 + 8, y0 + 8, { steps: 2 });
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
      exportMs,
      exportParts: 200,
    };
    const ok = result.firstRenderMs < 2000 && result.dragFrameMedianMs < 17 && result.exportMs < 1500;
    console.table([
      { measure: "first render, 500 parts", value: `${result.firstRenderMs} ms`, target: "< 2000 ms", ok: result.firstRenderMs < 2000 },
      { measure: "drag frame p50 (500 parts)", value: `${result.dragFrameMedianMs} ms`, target: "≤ 16.7 ms (60 Hz)", ok: result.dragFrameMedianMs < 17 },
      { measure: "drag frame p95 (500 parts)", value: `${result.dragFrameP95Ms} ms`, target: "reported", ok: true },
      { measure: "PNG export, 200 parts", value: `${result.exportMs} ms`, target: "< 1500 ms", ok: result.exportMs < 1500 },
    ]);
    console.log(`(${result.dragFrames} frames while dragging; first renders ${renders.map((r) => Math.round(r)).join(", ")} ms; exports ${exports.join(", ")} ms)`);
    return { ok, result };
  } finally {
    await browser.close();
    await new Promise<void>((r) => server.httpServer.close(() => r()));
  }
}

if (process.argv[1] && process.argv[1].endsWith("editor.ts")) {
  run().then(({ ok }) => (process.exitCode = ok ? 0 : 1));
}
