/** The build overview and settings in a real browser: import a linkage file, change the design forces. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { demoPitchLinkage } from "@/shared/demo";
import { serializeLinkage } from "@/shared/linkage/io";

let browser: Browser;
let page: Page;
let buildId: string;
const errors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  const owner = await makeUser("e2e-overview");
  ({ buildId } = await makeBuild({ owner }));
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  page.on("pageerror", (e) => errors.push(String(e)));
  await signInPage(page, owner.email, TEST_PASSWORD);
});
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

describe("build overview", () => {
  it("refuses a broken linkage file with the reasons, and imports a good one with its findings", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}`);
    const rows = page.getByTestId("linkage-row");
    expect(await rows.count()).toBe(1);
    const bad = { ...demoPitchLinkage(), formatVersion: 7 };
    await page.getByTestId("import-linkage").setInputFiles({ name: "broken.linkage.json", mimeType: "application/json", buffer: Buffer.from(JSON.stringify(bad)) });
    await page.getByTestId("import-errors").waitFor();
    expect(await page.getByTestId("import-errors").textContent()).toMatch(/formatVersion/);
    expect(await rows.count()).toBe(1);
    await shot(page, "overview-01-import-refused");

    const good = { ...demoPitchLinkage(), name: "Imported pitch run" };
    await page.getByTestId("import-linkage").setInputFiles({ name: "pitch.linkage.json", mimeType: "application/json", buffer: Buffer.from(serializeLinkage(good)) });
    await expect.poll(() => rows.count()).toBe(2);
    const imported = rows.filter({ hasText: "Imported pitch run" });
    await expect.poll(() => imported.textContent()).toMatch(/2 hazards/); // the demo's wrong joint: no jam nut, small washer
    await shot(page, "overview-02-imported");
  });

  it("the owner changes the design pitch force on the settings page and the check runs again", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/settings`);
    const field = page.getByLabel("Stick, pitch (lbf)");
    await expect.poll(() => field.inputValue()).toBe("167"); // 14 CFR 23.397(b) default (the form fills in once it hydrates)
    await field.fill("0");
    await page.getByTestId("save-design-settings").click();
    await expect.poll(() => page.getByText("Must be above 0").count()).toBe(1);
    await field.fill("200");
    await page.getByTestId("save-design-settings").click();
    await expect.poll(() => page.getByRole("status").textContent()).toMatch(/Saved/);
    const stored = await testDb("builds").where({ id: buildId }).first();
    expect(stored.analysis_settings.pilotForce.pitchStick).toBe(200);
    await shot(page, "overview-03-settings");
    expect(errors).toEqual([]);
  });
});
