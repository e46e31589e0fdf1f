/** Build records in a real browser: a photo uploaded to a joint shows as a thumbnail; log, parts and hardware pages render. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { signIn } from "../support/http";
import { testImage } from "../support/upload";
import { demoPitchLinkage } from "@/shared/demo";
import { analyze } from "@/shared/analysis";
import { checklistFor } from "@/shared/records/checklist";

let browser: Browser;
let page: Page;
let buildId: string, linkageId: string;
let builderEmail = "";
const errors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  const builder = await makeUser("e2e-records");
  ({ buildId, linkageId } = await makeBuild({ owner: builder }));
  builderEmail = builder.email;
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
    // Every item the demo linkage's checklist has (shared/records/checklist.ts, checked item by item in tests/shared/records).
    const items = checklistFor(demoPitchLinkage()).length;
    expect(await page.getByTestId("checklist-item").count()).toBe(items);
    await joint.getByLabel("Add a photo of the joint Control stick, attach ↔ Forward pushrod A").setInputFiles({ name: "jam-nut.jpg", mimeType: "image/jpeg", buffer: await testImage("jpeg", 1000, 750) });
    const thumb = joint.getByTestId("joint-photo-thumb");
    await thumb.waitFor({ timeout: 15_000 });
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(320); // server thumbnail, 320 px box
    expect(await thumb.getAttribute("src")).toMatch(/\/files\/[0-9a-f-]{36}\?thumb=1$/);

    await joint.getByLabel(/Jam nut on the 1\/4-28 RH rod end/).check();
    await expect.poll(() => page.getByTestId("checklist-progress").textContent()).toBe(`1 of ${items} ticked`);
    await expect.poll(() => joint.getByText(/Ticked by Test e2e-records/).count()).toBe(1);
    await shot(page, "records-01-checklist-photo");
  });

  it("the checklist index gives each linkage's ticks out of its total, as the linkage's own list does", async () => {
    const items = checklistFor(demoPitchLinkage()).length;
    await page.goto(`${APP_URL}/builds/${buildId}/checklist`);
    expect(await page.getByTestId("checklist-linkage-progress").textContent()).toBe(`1 of ${items} ticked`);
  });

  it("shows the log with a new entry, its hours chart, the parts library and the hardware list", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/log`);
    await page.getByText("The log is empty").waitFor();
    await page.getByRole("button", { name: "Write the first entry" }).click();
    // Saved without a title, the form says what to do in words (not the field's key).
    await page.getByRole("button", { name: "Save entry" }).click();
    await page.getByText("Enter a title").waitFor();
    expect(await page.getByText("title is required").count()).toBe(0);
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

    // An entry tied to a revision whose picture was never kept says so, and asks for no picture.
    const api = await signIn(builderEmail, TEST_PASSWORD);
    const tied = await api.request("POST", `/api/builds/${buildId}/log`, { date: "2026-01-02", hours: 1, title: "Checked the pitch run", linkageId, revision: 1 });
    expect(tied.status).toBe(201);
    const pictureAsks: string[] = [];
    const onRequest = (r: { url(): string }) => { if (/\/revisions\/\d+\/picture/.test(r.url())) pictureAsks.push(r.url()); };
    page.on("request", onRequest);
    await page.reload();
    const entry = page.getByTestId("log-entry").filter({ hasText: "Checked the pitch run" });
    await entry.getByTestId("log-no-picture").waitFor();
    expect(await entry.getByTestId("log-no-picture").textContent()).toMatch(/^No picture was kept for revision 1\. .*Keep for the log/);
    expect(await entry.locator("img").count()).toBe(0);
    await page.waitForLoadState("networkidle");
    page.off("request", onRequest);
    expect(pictureAsks).toEqual([]);

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

    // Every select shows its whole value, at desktop and phone width.
    const unreadable = () => page.locator("select").evaluateAll((els) => els.flatMap((el) => {
      const s = el as HTMLSelectElement;
      const cs = getComputedStyle(s);
      const ctx = document.createElement("canvas").getContext("2d")!;
      ctx.font = `${cs.fontWeight} ${cs.fontSize} ${cs.fontFamily}`;
      const text = s.options[s.selectedIndex]?.text ?? "";
      const need = ctx.measureText(text).width + parseFloat(cs.paddingLeft) + parseFloat(cs.paddingRight) + 16; // the arrow
      return s.clientWidth < need ? [`${s.getAttribute("aria-label")}: "${text}" in ${s.clientWidth} px`] : [];
    }));
    expect(await unreadable()).toEqual([]);
    await page.setViewportSize({ width: 390, height: 844 });
    expect(await unreadable()).toEqual([]);
    await page.setViewportSize({ width: 1280, height: 900 });

    // A state changed by keyboard (arrow, then Enter) is saved and the focus stays on its select through the save and the refetch.
    const state = page.locator("select[data-state-key]").first();
    const lineKey = (await state.getAttribute("data-state-key"))!;
    await state.focus();
    const hardwareCall = (method: string) => page.waitForResponse((r) => r.url().endsWith(`/api/builds/${buildId}/hardware`) && r.request().method() === method);
    const [saved, refetched] = [hardwareCall("PUT"), hardwareCall("GET")];
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("Enter");
    expect((await saved).status()).toBe(200);
    await (await refetched).finished();
    await page.waitForTimeout(300); // the refetch's render
    expect(await page.evaluate(() => document.activeElement?.getAttribute("data-state-key"))).toBe(lineKey);
    expect(await page.locator(`select[data-state-key="${lineKey}"]`).inputValue()).toBe("ordered");
    const lines = (await api.request("GET", `/api/builds/${buildId}/hardware`)).body.lines as { key: string; state: string }[];
    expect(lines.find((l) => l.key === lineKey)?.state).toBe("ordered");
    expect(errors).toEqual([]);
  });
});
