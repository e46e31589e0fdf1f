/**
 * Small controls with a mouse, in Chromium at 1440 × 900 (a fine pointer, so `.touch-target`'s 44 px does not
 * apply): the text buttons and links the UI review measured at 16 px, and the table sort headers, are at least
 * 24 px tall (WCAG 2.2 target size, minimum).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import { APP_URL, launchBrowser, signInPage } from "../support/browser";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { demoPitchLinkage } from "@/shared/demo";
import { analyze } from "@/shared/analysis";

let browser: Browser;
let page: Page;
let buildId: string, linkageId: string;

const height = async (l: Locator) => (await l.boundingBox())?.height ?? 0;

beforeAll(async () => {
  browser = await launchBrowser();
  const owner = await makeUser("e2e-targets");
  ({ buildId, linkageId } = await makeBuild({ owner }));
  const graph = demoPitchLinkage();
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).update({ graph: JSON.stringify(graph), analysis: JSON.stringify(analyze(graph)) });
  page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
  await signInPage(page, owner.email, TEST_PASSWORD);
});
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

describe("targets of at least 24 px with a mouse", () => {
  it("overview: Open the build log, All activity", async () => {
    expect(await page.evaluate(() => matchMedia("(pointer: coarse)").matches)).toBe(false);
    await page.goto(`${APP_URL}/builds/${buildId}`);
    for (const name of ["Open the build log", "All activity"]) expect(await height(page.getByRole("link", { name })), name).toBeGreaterThanOrEqual(24);
  });

  it("checklist: Add a note", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/checklist/${linkageId}`);
    const note = page.getByRole("button", { name: "Add a note" }).first();
    await note.waitFor();
    expect(await height(note)).toBeGreaterThanOrEqual(24);
  });

  it("hardware list: the sort headers", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/hardware`);
    const sorts = page.getByTestId("hardware-table").locator("th button");
    await sorts.first().waitFor();
    expect(await sorts.count()).toBeGreaterThan(2);
    for (const b of await sorts.all()) expect(await height(b), (await b.textContent()) ?? "").toBeGreaterThanOrEqual(24);
  });

  it("editor side panel: Revision history", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/linkages/${linkageId}`);
    const toggle = page.getByTestId("history-toggle");
    await toggle.waitFor({ timeout: 30_000 });
    expect(await height(toggle)).toBeGreaterThanOrEqual(24);
  });
});
