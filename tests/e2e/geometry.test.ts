/**
 * The geometry view in a real browser: type the demo run's geometry in, see the charts, move the slider through
 * the travel, then move a pivot with the keyboard until a transmission angle leaves 40°–140° and the finding
 * appears; the geometry is saved with the graph.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { demoPitchLinkage } from "@/shared/demo";
import { readFile } from "node:fs/promises";
import { barRun } from "../shared/analysis/motion-fixtures";

let browser: Browser;
let page: Page;
let buildId: string;
let linkageId: string;
const errors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  const owner = await makeUser("e2e-geometry");
  ({ buildId, linkageId } = await makeBuild({ owner }));
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).update({ graph: JSON.stringify({ ...demoPitchLinkage(), name: "Pitch run" }) });
  page = await browser.newPage({ viewport: { width: 1600, height: 1000 } });
  page.on("pageerror", (e) => errors.push(String(e)));
  page.on("response", async (r) => {
    if (!/\.js(\?|$)/.test(r.url())) return;
    const body = await r.text().catch(() => "");
    if (body.includes("recharts-cartesian-grid")) chartScripts.push(r.url());
  });
  await signInPage(page, owner.email, TEST_PASSWORD);
});
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

/** Bodies of the scripts the page has loaded so far that carry the chart library (its class-name prefix). */
const chartScripts: string[] = [];
const transmissionFindings = () => page.locator('[data-testid=finding][data-code="motion-transmission-angle"]').count();

describe("geometry and motion", () => {
  it("enters the demo run's geometry, charts it, plays it and flags a pivot moved out of the band", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/linkages/${linkageId}`);
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    // Stick travel of 5° each way (the demo's arms gear the elevator about 1.6 : 1).
    await page.locator('.react-flow__node[data-id="stick"]').click();
    await page.getByLabel(/Forward travel/).fill("5");
    await page.getByLabel(/Aft travel/).fill("5");

    expect(await page.getByTestId("motion-status").textContent()).toBe("Motion not checked");
    await page.waitForTimeout(500);
    expect(chartScripts).toEqual([]); // the editor's first load does not carry the chart library
    await page.getByTestId("btn-geometry").click();
    await page.getByTestId("geometry-empty").waitFor();
    await page.getByTestId("geometry-start-empty").click();
    await page.getByTestId("geometry-datum").fill("firewall face, top longeron");
    const enter = async (id: string, values: Record<string, string>) => {
      for (const [field, v] of Object.entries(values)) await page.getByTestId(`geo-${id}-${field}`).fill(v);
    };
    await enter("stick", { x: "20", y: "0", attach: "-90", grip: "90" });
    await enter("bellcrank", { x: "50", y: "-3", in: "-90", out: "90" });
    await enter("horn", { x: "122", y: "6", attach: "-90" }); // the 5 in arm reaches down to y 1, level with the bellcrank's out arm

    await page.getByTestId("motion-charts").waitFor();
    await expect.poll(() => page.locator("[data-testid=motion-charts] .recharts-line").count()).toBeGreaterThanOrEqual(4);
    expect(await page.getByTestId("geometry-rod").count()).toBe(2);
    expect((await page.getByTestId("geometry-view").boundingBox())!.height).toBeGreaterThan(150); // drawn, not squeezed
    expect(await page.getByTestId("worst-mark").count()).toBe(1);
    await expect.poll(() => page.getByTestId("worst-loads").textContent()).toMatch(/Forward pushrod/);
    expect(await transmissionFindings()).toBe(0);
    expect(chartScripts.length).toBeGreaterThan(0); // loaded with the geometry view
    await expect.poll(() => page.getByTestId("motion-status").textContent()).toBe("Motion checked");
    // Control sense (14 CFR 23.779 table): the demo's stick forward takes the elevator down, right for a tail.
    expect(await page.getByTestId("geometry-sense").textContent()).toMatch(/^Control sense: stick forward takes the trailing edge down — the right way for a tail behind the wing \(tail taken: the geometry does not say\)/);
    const senseFindings = () => page.locator('[data-testid=finding][data-code="control-sense-reversed"]').count();
    expect(await senseFindings()).toBe(0);
    // Said to be a canard, the same run is reversed: a hazard, until it is set back to a tail.
    await page.getByTestId("geometry-pitch-surface").selectOption("canard");
    await expect.poll(() => page.getByTestId("geometry-sense").textContent()).toMatch(/reversed for a canard ahead of the wing/);
    await expect.poll(senseFindings, { timeout: 20_000 }).toBeGreaterThan(0); // in the list, and on the selected stick's card
    await page.getByTestId("geometry-pitch-surface").selectOption("tail");
    await expect.poll(senseFindings, { timeout: 20_000 }).toBe(0);
    expect(await page.getByTestId("geometry-sense").textContent()).not.toMatch(/tail taken/);
    await shot(page, "geometry-01-entered");
    // The picture: the run at the back stop, neutral and the forward stop, 3 × 360 px drawn at 2×.
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("geometry-picture").click()]);
    const png = await readFile((await download.path())!);
    expect(png.subarray(1, 4).toString()).toBe("PNG");
    expect(png.readUInt32BE(16)).toBe(2160); // width from the IHDR chunk

    // The slider moves the drawing: the forward rod's end moves when the stick is at its forward stop.
    const rodX = () => page.locator("[data-testid=geometry-rod] line").first().getAttribute("x1");
    const atNeutral = await rodX();
    await page.getByTestId("geometry-slider").focus();
    await page.keyboard.press("End");
    await expect.poll(() => page.getByTestId("geometry-readout").textContent()).toMatch(/^Input 5\.0° fwd/);
    expect(await rodX()).not.toBe(atNeutral);
    await page.getByTestId("geometry-play").click();
    await expect.poll(() => page.getByTestId("geometry-readout").textContent()).not.toMatch(/^Input 5\.0° fwd/); // the input moved (the worst-angle note may name 5.0° fwd)
    await page.getByTestId("geometry-play").click();
    await shot(page, "geometry-02-moved");

    // Raise the bellcrank 1 in at a time until the forward rod meets its arms outside 40°–140°.
    const pivot = page.getByTestId("pivot-bellcrank");
    let presses = 0;
    while ((await transmissionFindings()) === 0 && presses < 60) {
      await pivot.focus();
      await page.keyboard.press("Shift+ArrowUp");
      presses++;
      if (presses % 5 === 0) await page.waitForTimeout(300);
    }
    await expect.poll(transmissionFindings).toBe(1);
    expect(presses).toBeGreaterThan(10); // it takes a real move: about 25 in up puts the 30 in rod 40° off square
    const f = page.locator('[data-testid=finding][data-code="motion-transmission-angle"]');
    expect(await f.getAttribute("data-subject")).toBe("node:pushrod-fwd");
    await shot(page, "geometry-03-out-of-band");

    await page.waitForFunction(() => document.querySelector("[data-testid=save-status]")?.getAttribute("data-status") === "saved", null, { timeout: 20_000 });
    const rev = await testDb("linkages").where({ id: linkageId }).first();
    const row = await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: rev.current_revision }).first();
    const graph = typeof row.graph === "string" ? JSON.parse(row.graph) : row.graph;
    expect(graph.geometry.datum).toBe("firewall face, top longeron");
    expect(graph.geometry.pitchSurface).toBe("tail");
    expect(graph.geometry.parts.bellcrank.pivot.y).toBeGreaterThan(5);
    // The arrow keys moved the pivot in the geometry, not the selected card on the diagram.
    expect(graph.nodes.find((n: { id: string }) => n.id === "stick").position).toEqual(demoPitchLinkage().nodes[0].position);
    expect(errors).toEqual([]);
  }, 180_000);

  it("a roll run's sense is read once the geometry names the aileron's wing: a hazard on the right wing, the right way on the left, saved", async () => {
    // Stick right (the roll view's forward turn) lowers this aileron's trailing edge (tests/shared/analysis/motion-fixtures).
    const bar = barRun({ a: 3, c: 3, o2: [0, 0], o4: [30, 0], alpha: 90, beta: -90 });
    const graph = { ...bar, name: "Roll run", system: "roll", nodes: bar.nodes.map((n) => (n.id === "elevator" ? { ...n, label: "Aileron" } : n)) };
    const [l] = await testDb("linkages").insert({ build_id: buildId, name: "Roll run", system: "roll", current_revision: 1 }).returning("id");
    await testDb("linkage_revisions").insert({ linkage_id: l.id, revision: 1, graph: JSON.stringify(graph) });
    await page.goto(`${APP_URL}/builds/${buildId}/linkages/${l.id}`);
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    await page.getByTestId("btn-geometry").click();
    await page.getByTestId("geometry-slider").waitFor();
    // Not read until the wing is named: no sense line, no finding, and the run's notes ask for it.
    expect(await page.getByTestId("geometry-sense").count()).toBe(0);
    const senseFindings = () => page.locator('[data-testid=finding][data-code="control-sense-reversed"]').count();
    expect(await senseFindings()).toBe(0);
    await page.getByTestId("geometry-roll-side").selectOption("right");
    await expect.poll(() => page.getByTestId("geometry-sense").textContent()).toMatch(/^Control sense: stick right takes the trailing edge of the right wing's aileron down — reversed for the right wing's aileron/);
    await expect.poll(senseFindings, { timeout: 20_000 }).toBeGreaterThan(0);
    await page.getByTestId("geometry-roll-side").selectOption("left");
    await expect.poll(() => page.getByTestId("geometry-sense").textContent()).toMatch(/^Control sense: stick right takes the trailing edge of the left wing's aileron down — the right way/);
    await expect.poll(senseFindings, { timeout: 20_000 }).toBe(0);
    // The view speaks of the stick right and left, not forward and back.
    await page.getByTestId("geometry-slider").focus();
    await page.keyboard.press("End");
    await expect.poll(() => page.getByTestId("geometry-readout").textContent()).toMatch(/^Input 15\.0° right/);
    await page.keyboard.press("Home");
    await expect.poll(() => page.getByTestId("geometry-readout").textContent()).toMatch(/^Input 15\.0° left/);
    await shot(page, "geometry-04-roll-sense");
    await page.waitForFunction(() => document.querySelector("[data-testid=save-status]")?.getAttribute("data-status") === "saved", null, { timeout: 20_000 });
    const rev = await testDb("linkages").where({ id: l.id }).first();
    const row = await testDb("linkage_revisions").where({ linkage_id: l.id, revision: rev.current_revision }).first();
    expect((typeof row.graph === "string" ? JSON.parse(row.graph) : row.graph).geometry.rollSide).toBe("left");
    expect(errors).toEqual([]);
  }, 120_000);
});
