/**
 * A long build in the browser (600 log entries, one photo each, a first screen of 20 and pages of 50): the log shows its total
 * and scrolls to the oldest entry, the PDF of all entries holds every entry (its text read back with
 * pdftotext), and the files list reaches the first upload.
 */
import { spawnSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, ARTIFACTS, launchBrowser, signInPage } from "../support/browser";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { deleteTestObjects, s3Client, S3 } from "../support/upload";
import { seedLongBuild } from "../support/long-build";

const N = 600;
/** The screen as seen (a full-page picture of 600 entries is too big to be useful). */
const shot = (p: Page, name: string) => p.screenshot({ path: path.join(ARTIFACTS, `${name}.png`) });
let browser: Browser;
let page: Page;
let buildId: string;
const errors: string[] = [];
let keys: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  const owner = await makeUser("e2e-long");
  ({ buildId } = await makeBuild({ owner }));
  keys = (await seedLongBuild(testDb, { client: s3Client, bucket: S3.bucket }, { buildId, ownerId: owner.id, size: { entries: N, years: 3, photosPerEntry: 1, linkages: 2, revisions: 4, comments: 0, signoffs: 0, parts: 0 } })).objectKeys;
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  page.on("pageerror", (e) => errors.push(String(e)));
  await signInPage(page, owner.email, TEST_PASSWORD);
}, 300_000);
afterAll(async () => { await browser?.close(); await deleteTestObjects(keys); await testDb.destroy(); });

/** Scrolls to the end of the list until every item is shown (the sentinel loads the next page as it comes into view). */
async function scrollToEnd(noun: string) {
  const shown = page.getByTestId("shown-count");
  const until = Date.now() + 180_000;
  while (!(await shown.textContent())?.startsWith("All ")) {
    expect(Date.now()).toBeLessThan(until);
    await page.evaluate(() => window.scrollTo(0, document.body.scrollHeight));
    await page.waitForTimeout(150);
  }
  expect(await shown.textContent()).toBe(`All ${N} ${noun} shown.`);
}

describe("a long build", () => {
  it("the log shows its total, loads more from a button or by scrolling, and reaches the oldest entry", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/log`);
    expect(await page.getByTestId("log-total").textContent()).toBe(`${N} entries in the log, newest first.`);
    // The first screen holds 20 entries (lib/paging.ts LOG_FIRST_SCREEN); more come 50 at a time.
    expect(await page.getByTestId("log-entry").count()).toBe(20);
    expect(await page.getByTestId("shown-count").textContent()).toBe(`Showing 20 of ${N} entries, newest first.`);
    // Keyboard users: the button.
    await page.getByRole("button", { name: "Load more" }).focus();
    await page.keyboard.press("Enter");
    await expect.poll(() => page.getByTestId("log-entry").count()).toBeGreaterThanOrEqual(70);
    await scrollToEnd("entries");
    expect(await page.getByTestId("log-entry").count()).toBe(N);
    expect(await page.getByTestId("log-entry").last().locator("h3").textContent()).toMatch(/^Entry 1: /);
    await shot(page, "long-01-log-end");
  }, 300_000);

  it("the PDF of all entries, made as a job, has every entry", async () => {
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.getByTestId("log-pdf").click();
    const est = page.getByTestId("export-estimate");
    await est.waitFor();
    expect(await est.textContent()).toMatch(new RegExp(`^${N} entries, ${N} photos: about \\d`));
    await page.getByRole("button", { name: "Make the PDF" }).click();
    const link = page.getByTestId("export-download");
    await link.waitFor({ timeout: 360_000 });
    await shot(page, "long-02-pdf-ready");
    const res = await page.request.get(`${APP_URL}${await link.getAttribute("href")}`);
    expect(res.status()).toBe(200);
    const dir = path.join(ARTIFACTS, "long-build");
    mkdirSync(dir, { recursive: true });
    const file = path.join(dir, "log.pdf");
    writeFileSync(file, await res.body());
    const text = spawnSync("/usr/bin/pdftotext", [file, "-"], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 }).stdout;
    const numbers = new Set([...text.matchAll(/Entry (\d+): /g)].map((m) => Number(m[1])));
    expect(numbers.size).toBe(N);
    expect(Math.min(...numbers)).toBe(1);
    expect(Math.max(...numbers)).toBe(N);
    expect(text).toContain(`${N} entries`);
  }, 420_000);

  it("the files list reaches the first upload", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/files`);
    expect(await page.getByTestId("files-total").textContent()).toBe(`${N} files in this build.`);
    await scrollToEnd("files");
    expect(await page.getByTestId("file-card").last().textContent()).toContain("photo-1-1.jpg");
    await shot(page, "long-03-files-end");
    expect(errors).toEqual([]);
  }, 300_000);
});
