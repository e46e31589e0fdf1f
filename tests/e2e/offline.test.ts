/**
 * A builder at the aircraft without network, in Debian's Chromium at phone size: the checklist opened once
 * keeps working offline (the page comes from the service worker's copy, after a reload too); ticks, a note
 * and a joint photo made offline are kept on the device and all reach the server when the network returns.
 * An item a reviewer changed meanwhile is not overwritten: it is shown as a conflict, and "Keep mine" sends it.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { signIn, type Client } from "../support/http";
import { addRevision } from "../support/review";
import { testImage } from "../support/upload";
import { demoPitchLinkage } from "@/shared/demo";

let browser: Browser;
let ctx: BrowserContext;
let page: Page;
let reviewer: Client;
let buildId: string, linkageId: string;
const errors: string[] = [];
const L = () => `/api/builds/${buildId}/linkages/${linkageId}`;
const tickRow = (jointId: string, code: string) => testDb("checklist_items").where({ linkage_id: linkageId, revision: 2, joint_id: jointId, item_code: code }).first();

beforeAll(async () => {
  browser = await launchBrowser();
  const [o, r] = await Promise.all([makeUser("e2e-offline-owner"), makeUser("e2e-offline-reviewer")]);
  ({ buildId, linkageId } = await makeBuild({ owner: o, reviewer: r }));
  await addRevision(linkageId, demoPitchLinkage(), o.id);
  reviewer = await signIn(r.email);
  ctx = await browser.newContext({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, serviceWorkers: "allow" });
  page = await ctx.newPage();
  page.on("pageerror", (e) => errors.push(String(e)));
  await signInPage(page, o.email, TEST_PASSWORD);
});
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

describe("the checklist without network", () => {
  it("keeps ticks, notes and photos made offline and sends them when the network returns; a conflict is shown, never dropped", async () => {
    const url = `${APP_URL}/builds/${buildId}/checklist/${linkageId}`;
    await page.goto(url);
    // Once the service worker is active, a load through it fills its copy of the page, its scripts and its data.
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => true));
    await page.reload();
    await page.waitForFunction(() => !!navigator.serviceWorker?.controller, null, { timeout: 15_000 });
    await page.waitForLoadState("networkidle");
    await page.getByTestId("checklist-progress").waitFor();

    await ctx.setOffline(true);
    await page.reload(); // from the service worker's copy
    await page.getByTestId("checklist-progress").waitFor();
    const joint = page.getByTestId("checklist-joint-j-stick-fwd");
    await joint.locator('[data-code="jam-nut"] input[type=checkbox]').check();
    await joint.locator('[data-code="witness-hole"] input[type=checkbox]').check();
    await joint.locator('[data-code="jam-nut"]').getByRole("button", { name: "Add a note" }).click();
    await joint.locator('[data-code="jam-nut"]').getByRole("textbox").fill("Torque stripe intact, jam nut tight by hand check");
    await joint.locator('[data-code="jam-nut"]').getByRole("button", { name: "Save note" }).click();
    await joint.locator('input[type=file]').setInputFiles({ name: "stick end offline.jpg", mimeType: "image/jpeg", buffer: await testImage("jpeg", 320, 240) });
    await page.getByTestId("joint-photo-queued").waitFor();
    await expect.poll(() => page.getByTestId("offline-waiting").textContent(), { timeout: 10_000 }).toMatch(/3 changes waiting/);
    // A note on the aft joint too, which the reviewer changes meanwhile from another device.
    const aft = page.getByTestId("checklist-joint-j-aft-horn");
    await aft.locator('[data-code="retaining-washer"]').getByRole("button", { name: "Add a note" }).click();
    await aft.locator('[data-code="retaining-washer"]').getByRole("textbox").fill("Washer still 0.438 in: order AN970");
    await aft.locator('[data-code="retaining-washer"]').getByRole("button", { name: "Save note" }).click();
    // Counted once it is written to the device's store: reloading before then would test nothing but the race.
    await expect.poll(() => page.getByTestId("offline-waiting").textContent(), { timeout: 10_000 }).toMatch(/4 changes waiting/);
    await page.reload(); // what was kept survives a reload without network
    await expect.poll(() => page.getByTestId("item-pending").count(), { timeout: 10_000 }).toBe(3);
    await shot(page, "offline-01-kept");
    expect(await tickRow("j-stick-fwd", "jam-nut")).toBeUndefined(); // nothing reached the server yet
    expect((await reviewer.request("PUT", `${L()}/checklist`, { revision: 2, jointId: "j-aft-horn", code: "retaining-washer", ticked: false, note: "Reviewer: larger washer fitted, see photo" })).status).toBe(200);

    await ctx.setOffline(false);
    await expect.poll(async () => (await tickRow("j-stick-fwd", "jam-nut"))?.note ?? null, { timeout: 15_000 }).toBe("Torque stripe intact, jam nut tight by hand check");
    expect((await tickRow("j-stick-fwd", "jam-nut")).ticked_at).not.toBeNull();
    await expect.poll(async () => (await tickRow("j-stick-fwd", "witness-hole"))?.ticked_at ?? null, { timeout: 15_000 }).not.toBeNull();
    await expect.poll(async () => (await testDb("joint_photos as jp").join("files as f", "f.id", "jp.file_id").where({ "jp.linkage_id": linkageId, "jp.joint_id": "j-stick-fwd" }).select("f.name")).map((r: { name: string }) => r.name), { timeout: 15_000 }).toContain("stick end offline.jpg");
    // The reviewer's note was not overwritten: the conflict waits for a choice.
    await page.getByTestId("item-conflict").waitFor({ timeout: 15_000 });
    expect((await tickRow("j-aft-horn", "retaining-washer")).note).toBe("Reviewer: larger washer fitted, see photo");
    await shot(page, "offline-02-conflict");
    await page.getByTestId("conflict-keep-mine").click();
    await expect.poll(async () => (await tickRow("j-aft-horn", "retaining-washer")).note, { timeout: 10_000 }).toBe("Washer still 0.438 in: order AN970");
    await expect.poll(() => page.getByTestId("offline-banner").count(), { timeout: 10_000 }).toBe(0);
    expect(errors).toEqual([]);
  }, 120_000);
});
