/**
 * The Content-Security-Policy in a real browser: the editor opens, takes an edit and saves it, exports
 * its picture, and the geometry view draws its motion charts and its own picture — with not one policy
 * violation reported (console, page errors or `securitypolicyviolation` events). The headers themselves
 * are checked in tests/api/hardening/headers.test.ts.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { dropPart, openEditor, waitSaved } from "../support/editor-page";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { demoPitchLinkage } from "@/shared/demo";
import { demoPitchGeometry } from "@/shared/demo-geometry";

let browser: Browser;
let context: BrowserContext;
let page: Page;
let editorUrl = "";
const violations: string[] = [];
const pageErrors: string[] = [];

/** Report every violation the page sees (a listener added on each document before its scripts run). */
async function watch(p: Page) {
  await p.exposeFunction("__cspViolation", (v: string) => violations.push(v));
  await p.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      (window as unknown as { __cspViolation: (v: string) => void }).__cspViolation(`${e.violatedDirective} blocked ${e.blockedURI || "(inline)"} at ${e.sourceFile}:${e.lineNumber}`);
    });
  });
  p.on("console", (m) => {
    if (/Content[- ]Security[- ]Policy|Refused to (load|execute|apply|connect|frame)/i.test(m.text())) violations.push(`console: ${m.text()}`);
  });
  p.on("pageerror", (e) => pageErrors.push(String(e)));
}

beforeAll(async () => {
  browser = await launchBrowser();
  const owner = await makeUser("e2e-csp");
  const { buildId, linkageId } = await makeBuild({ owner });
  // The demo pitch run with its geometry: the geometry view has what it needs to chart the motion.
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 })
    .update({ graph: JSON.stringify({ ...demoPitchLinkage(), name: "Pitch run", geometry: demoPitchGeometry() }) });
  editorUrl = `${APP_URL}/builds/${buildId}/linkages/${linkageId}`;
  context = await browser.newContext({ viewport: { width: 1600, height: 1000 }, acceptDownloads: true });
  page = await context.newPage();
  await watch(page);
  await signInPage(page, owner.email, TEST_PASSWORD);
}, 120_000);
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

describe("the pages under the Content-Security-Policy", () => {
  it("the policy is in force and its violations are heard (an image from another origin is refused)", async () => {
    await page.goto(`${APP_URL}/builds`);
    await page.evaluate(() => { const i = new Image(); i.src = "https://img.invalid.example/x.png"; document.body.append(i); });
    await expect.poll(() => violations.some((v) => v.startsWith("img-src blocked https://img.invalid.example/"))).toBe(true);
    await page.waitForTimeout(300); // the console's report of the same refusal may come after the event
    expect(violations.filter((v) => !/img\.invalid\.example/.test(v))).toEqual([]); // nothing else on the builds page
    violations.length = 0;
  });

  it("the editor opens, takes an edit and saves it", async () => {
    await openEditor(page, editorUrl);
    await dropPart(page, "pushrod", 700, 520);
    await waitSaved(page);
    await shot(page, "csp-01-editor");
    expect(violations).toEqual([]);
  });

  it("exports the picture of the linkage", async () => {
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("btn-export-png").click()]);
    const { readFile } = await import("node:fs/promises");
    const png = await readFile((await download.path())!);
    expect(png.subarray(1, 4).toString("latin1")).toBe("PNG");
    expect(violations).toEqual([]);
  });

  it("draws the motion charts and exports the geometry picture", async () => {
    await page.getByTestId("btn-geometry").click();
    await page.getByTestId("motion-charts").waitFor({ timeout: 30_000 });
    await expect.poll(() => page.locator("[data-testid=motion-charts] .recharts-line").count(), { timeout: 15_000 }).toBeGreaterThanOrEqual(4);
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("geometry-picture").click()]);
    const { readFile } = await import("node:fs/promises");
    const png = await readFile((await download.path())!);
    expect(png.subarray(1, 4).toString("latin1")).toBe("PNG");
    await shot(page, "csp-02-geometry");
    expect(violations).toEqual([]);
  });

  it("reloads the editor with nothing refused and no page error", async () => {
    await page.reload();
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    await page.waitForTimeout(500);
    expect(violations).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
