/** Build records in a real browser: a photo uploaded to a joint shows as a thumbnail; log, parts and hardware pages render. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { testImage } from "../support/upload";
import { demoPitchLinkage } from "@/shared/demo";
import { analyze } from "@/shared/analysis";

let browser: Browser;
let page: Page;
let buildId: string, linkageId: string;
const errors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  const builder = await makeUser("e2e-records");
  ({ buildId, linkageId } = await makeBuild({ owner: builder }));
  const graph = demoPitchLinkage();
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).update({ graph: JSON.stringify(graph), analysis: JSON.stringify(analyze(graph)) });
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  page.on("pageerror", (e) => errors.push(String(e)));
  await signInPage(page, builder.email, TEST_PASSWORD);
});
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

describe("build records in the browser", () => {
  it("uploads a photo to a joint on the checklist and shows its thumbnail; ticks an item", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/checklist/${linkageId}`);
    const joint = page.getByTestId("checklist-joint-j-stick-fwd");
    await joint.waitFor();
    expect(await page.getByTestId("checklist-item").count()).toBe(36); // the demo linkage's checklist (tests/shared/records)
    await joint.getByLabel("Add a photo of the joint Control stick, attach ↔ Forward pushrod A").setInputFiles({ name: "jam-nut.jpg", mimeType: "image/jpeg", buffer: await testImage("jpeg", 1000, 750) });
    const thumb = joint.getByTestId("joint-photo-thumb");
    await thumb.waitFor({ timeout: 15_000 });
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(320); // server thumbnail, 320 px box
    expect(await thumb.getAttribute("src")).toMatch(/\/files\/[0-9a-f-]{36}\?thumb=1$/);

    await joint.getByLabel(/Jam nut on the 1\/4-28 RH rod end/).check();
    await expect.poll(() => page.getByTestId("checklist-progress").textContent()).toBe("1 of 36 ticked");
    await expect.poll(() => joint.getByText(/Ticked by Test e2e-records/).count()).toBe(1);
    await shot(page, "records-01-checklist-photo");
  });

  it("shows the log with a new entry, its hours chart, the parts library and the hardware list", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/log`);
    await page.getByText("The log is empty").waitFor();
    await page.getByRole("button", { name: "Write the first entry" }).click();
    await page.getByLabel("Title").fill("Rigged the elevator");
    await page.getByLabel("Hours").fill("2.5");
    await page.getByLabel("Pitch").check();
    await page.getByLabel("Photos and documents").setInputFiles({ name: "elevator.png", mimeType: "image/png", buffer: await testImage("png", 600, 400) });
    await page.getByText("elevator.png").waitFor();
    await page.getByRole("button", { name: "Save entry" }).click();
    await page.getByTestId("log-entry").waitFor();
    await page.getByTestId("hours-chart").locator(".recharts-bar-rectangle").first().waitFor();
    expect(await page.getByTestId("hours-by-system").textContent()).toContain("2.5 h");
    await shot(page, "records-02-log");

    await page.goto(`${APP_URL}/builds/${buildId}/parts`);
    await page.getByText("No parts in this library yet").waitFor();
    await page.getByLabel("Part number").fill("E2E-RE4");
    await page.getByLabel("thread").selectOption("1/4-28");
    await page.getByLabel("hand").selectOption("LH");
    await page.getByLabel("ball bore (in)").fill("0.25");
    await page.getByLabel("rated ultimate (lbf)").fill("4200"); // invented rating, no source
    await page.getByRole("button", { name: "Add to library" }).click();
    await page.getByTestId("part-row").waitFor();
    await shot(page, "records-03-parts");

    await page.goto(`${APP_URL}/builds/${buildId}/hardware`);
    await page.getByTestId("hardware-row").first().waitFor();
    const link = page.getByRole("link", { name: /Pitch run: Control stick, attach ↔ Forward pushrod A/ }).first();
    expect(await link.getAttribute("href")).toBe(`/builds/${buildId}/linkages/${linkageId}?select=j-stick-fwd`);
    await shot(page, "records-04-hardware");
    expect(errors).toEqual([]);
  });
});
