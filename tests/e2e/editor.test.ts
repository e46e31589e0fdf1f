/**
 * The linkage editor in Debian Chromium, against the served app: build a control run with the
 * mouse, fill a joint card, watch a finding come and go, reload, export a picture, and meet a
 * save conflict from a second page. Screenshots of every step land in tests/artifacts/editor-*.png.
 */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Locator, Page } from "playwright-core";
import sharp from "sharp";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { canvas, connect, dropPart, openJoint, openPart, saveStatus, waitSaved } from "../support/editor-page";
import { DEMO_BUILD, DEMO_USERS } from "@/db/demo-accounts";
import { EXPORT_SIZE } from "@/editor/export";

let browser: Browser;
let context: BrowserContext;
let page: Page;
let editorUrl = "";
const errors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  context = await browser.newContext({ viewport: { width: 1600, height: 1000 }, acceptDownloads: true });
  page = await context.newPage();
  page.on("pageerror", (e) => errors.push(String(e)));
});
afterAll(() => browser?.close());

const status = saveStatus;

describe("linkage editor in a real browser", () => {
  const name = `Pitch run ${Date.now().toString(36)}`;
  let ids: { stick: string; fwd: string; crank: string; aft: string; horn: string };
  let jointId = "";

  it("the demo builder creates a linkage and opens the editor", async () => {
    const dana = DEMO_USERS[0];
    await signInPage(page, dana.email, dana.password);
    await page.getByTestId("build-card").filter({ has: page.getByTestId("build-name").getByText(DEMO_BUILD.name, { exact: true }) }).click();
    await page.waitForURL(/\/builds\/[0-9a-f-]{36}$/);
    await page.getByTestId("new-linkage").click();
    await page.getByTestId("linkage-name").fill(name);
    await page.getByTestId("create-linkage").click();
    const row = page.getByTestId("linkage-row").filter({ hasText: name });
    await row.waitFor();
    await row.getByRole("link", { name }).click();
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    editorUrl = page.url();
    await expect(status(page).getAttribute("data-status")).resolves.toBe("saved");
    await shot(page, "editor-01-empty");
  });

  it("builds stick → pushrod → bellcrank → pushrod → horn with the mouse", async () => {
    const y = 260;
    ids = {
      stick: await dropPart(page, "stick", 110, y),
      fwd: await dropPart(page, "pushrod", 320, y),
      crank: await dropPart(page, "bellcrank", 530, y),
      aft: await dropPart(page, "pushrod", 740, y),
      horn: await dropPart(page, "controlHorn", 950, y),
    };
    await connect(page, [ids.stick, "attach"], [ids.fwd, "a"]);
    await connect(page, [ids.fwd, "b"], [ids.crank, "in"]);
    await connect(page, [ids.crank, "out"], [ids.aft, "a"]);
    await connect(page, [ids.aft, "b"], [ids.horn, "attach"]);
    expect(await page.locator(".react-flow__edge").count()).toBe(4);
    await shot(page, "editor-02-run-built");
    await waitSaved(page);
  });

  it("fills a joint card: a rod end without a jam nut is flagged, fitting one clears it", async () => {
    const edge = page.locator(".react-flow__edge").nth(1);
    jointId = (await edge.getAttribute("data-id"))!;
    const card = await openJoint(page, jointId);
    await card.getByTestId("joint-form-on-rodEnd").check();
    await card.getByTestId("joint-form-rodEnd__thread").selectOption("1/4-28");
    await card.getByTestId("joint-form-rodEnd__ballBore").fill("0.25");
    await card.getByTestId("joint-form-rodEnd__ratedUltimate").fill("abc");
    // Typed nonsense is explained and not applied.
    await expect(card.getByTestId("joint-form-rodEnd__ratedUltimate-error").textContent()).resolves.toMatch(/not a number/);
    await card.getByTestId("joint-form-rodEnd__ratedUltimate").fill("3000");
    await card.getByTestId("joint-form-engagement__witnessHoleVerified").check();
    const jam = card.locator("[data-testid=subject-findings] [data-code=jam-nut-missing]");
    await jam.waitFor({ timeout: 5000 });
    await expect(page.getByTestId(`joint-${jointId}`).getAttribute("data-severity")).resolves.toBe("hazard");
    await shot(page, "editor-03-jam-nut-missing");
    await card.getByTestId("joint-form-jamNut__fitted").check();
    await card.getByTestId("joint-form-jamNut__tightened").check();
    await expect.poll(() => card.locator("[data-code^=jam-nut]").count(), { timeout: 5000 }).toBe(0);
    await expect(page.getByTestId(`joint-${jointId}`).locator("[data-chip=jamNut]").getAttribute("data-state")).resolves.toBe("solid");
    await shot(page, "editor-04-jam-nut-fitted");
    await waitSaved(page);
  });

  it("shows the joint's checks: a check without its inputs is a to-do, not a pass, until they are entered", async () => {
    const card = page.getByTestId("joint-card");
    const checks = card.getByTestId("joint-checks");
    await checks.waitFor();
    // The parts were placed with starting values: the load through the stick is not the builder's, so no check
    // has a margin and the to-do names the stick's values. // common practice, no source
    await expect.poll(() => checks.getByTestId("joint-todo").textContent(), { timeout: 5000 }).toMatch(/Enter the grip arm, attach arm and axis of ".*" \(still its starting values\)/);
    await expect(checks.locator("[data-check=rodEndRating]").count()).resolves.toBe(0);
    // The builder confirms the stick's values on its card (each is labelled as a starting value until then).
    const part = await openPart(page, ids.stick);
    await expect(part.getByTestId("node-form-props__gripArm-starting").count()).resolves.toBe(1);
    await shot(page, "editor-04a-starting-values");
    await part.getByTestId("btn-confirm-values").click();
    await expect.poll(() => part.getByTestId("starting-values").count()).toBe(0);
    await expect(part.getByTestId("node-form-props__gripArm-starting").count()).resolves.toBe(0);
    await openJoint(page, jointId);
    // The live check runs again after the confirmation: the stick's values leave the to-do and the rod end's
    // rating gets its margin.
    await expect.poll(() => checks.locator("[data-check=rodEndRating]").count(), { timeout: 5000 }).toBe(1);
    await expect(checks.getByTestId("joint-todo").textContent()).resolves.not.toMatch(/starting value/);
    // The rod end's thread in tension needs the body material (ASME B1.1 stress area × the body's Ftu).
    await expect(checks.getByTestId("joint-todo").textContent()).resolves.toMatch(/Enter the rod end's body material/);
    await expect(checks.locator("[data-check=threadTension]").count()).resolves.toBe(0);
    await shot(page, "editor-04b-joint-todo");
    await card.getByTestId("joint-form-rodEnd__bodyMaterial").selectOption("alloySteel");
    await expect.poll(() => checks.locator("[data-check=threadTension]").count(), { timeout: 5000 }).toBe(1);
    // What is left is the bolt: a rod end with no bolt or pin recorded is not checked for it, and says so.
    await expect.poll(() => checks.getByTestId("joint-todo").textContent(), { timeout: 5000 }).not.toMatch(/body material/);
    await expect(checks.getByTestId("joint-todo").textContent()).resolves.toMatch(/bolt or clevis pin that holds this joint/i);
    await waitSaved(page);
  });

  it("reloads and finds everything saved", async () => {
    await page.reload();
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    await expect.poll(() => page.locator(".react-flow__node").count()).toBe(5);
    await expect.poll(() => page.locator(".react-flow__edge").count()).toBe(4); // edges draw once the nodes are measured
    await page.getByTestId(`joint-${jointId}`).click();
    const card = page.getByTestId("joint-card");
    await expect(card.getByTestId("joint-form-jamNut__tightened").isChecked()).resolves.toBe(true);
    await expect(card.getByTestId("joint-form-rodEnd__ratedUltimate").inputValue()).resolves.toBe("3000");
    expect(Number(await page.getByTestId("editor-revision").textContent())).toBeGreaterThan(1);
    await shot(page, "editor-05-reloaded");
  });

  it("exports a PNG of the whole linkage with its title block", async () => {
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("btn-export-png").click()]);
    const file = await download.path();
    const buf = readFileSync(file!);
    expect(buf.subarray(1, 4).toString("latin1")).toBe("PNG");
    const img = sharp(buf);
    const meta = await img.metadata();
    expect(meta.format).toBe("png");
    expect(meta.width).toBe(EXPORT_SIZE.width);
    expect(meta.height).toBe(EXPORT_SIZE.height);
    // Not blank: the diagram area holds a fair share of non-white pixels.
    const { data, info } = await sharp(buf).extract({ left: 0, top: 0, width: EXPORT_SIZE.width, height: 1800 }).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    let ink = 0;
    for (let i = 0; i < data.length; i += info.channels) if (data[i] < 200 || data[i + 1] < 200 || data[i + 2] < 200) ink++;
    expect(ink / (info.width * info.height)).toBeGreaterThan(0.002);
    await sharp(buf).resize({ width: 1200 }).toFile("tests/artifacts/editor-06-export.png");
  });

  it("a stale page meets the conflict dialog with the newer author and the difference", async () => {
    const other = await context.newPage();
    other.on("pageerror", (e) => errors.push(String(e)));
    await other.goto(editorUrl);
    await other.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    // Edit in the second page and let it save.
    await other.getByTestId("tray-travelStop").click();
    await waitSaved(other);
    await shot(other, "editor-07-second-page-saved");
    // The first page is now stale: its edit gets the dialog.
    await page.getByTestId(`node-${ids.horn}`).click();
    await page.getByTestId("node-form-label").fill("Elevator horn, left");
    // Save now — unless the autosave (1.5 s after the edit) got there first on a slow machine and the dialog is already up.
    const dialog = page.getByTestId("conflict-dialog");
    if (!(await dialog.isVisible())) await page.getByTestId("btn-save").click({ trial: false, timeout: 5_000 }).catch(async (e) => { if (!(await dialog.isVisible())) throw e; });
    await dialog.waitFor({ timeout: 10_000 });
    await expect(dialog.getByTestId("conflict-author").textContent()).resolves.toContain(DEMO_USERS[0].name);
    await expect(dialog.getByTestId("conflict-diff").textContent()).resolves.toMatch(/only in theirs.*Travel stop/s);
    await expect(status(page).getAttribute("data-status")).resolves.toBe("conflict");
    await shot(page, "editor-08-conflict");
    // A modal dialog by keyboard: Tab and Shift+Tab go round its three buttons and never reach the page behind.
    const focused = () => page.evaluate(() => document.activeElement?.closest("[data-testid=conflict-dialog]") ? document.activeElement.getAttribute("data-testid") : `outside:${document.activeElement?.tagName}`);
    expect(await focused()).toBe("conflict-later");
    const seen: (string | null)[] = [];
    for (let i = 0; i < 4; i++) { await page.keyboard.press("Tab"); seen.push(await focused()); }
    expect(seen).toEqual(["conflict-load-theirs", "conflict-keep-mine", "conflict-later", "conflict-load-theirs"]);
    await page.keyboard.press("Shift+Tab");
    await page.keyboard.press("Shift+Tab");
    expect(await focused()).toBe("conflict-keep-mine");
    // Escape puts the choice off: the dialog closes, nothing is saved, the focus is not dropped to the page, and the
    // save chip opens it again.
    await page.keyboard.press("Escape");
    await dialog.waitFor({ state: "detached" });
    await expect(status(page).getAttribute("data-status")).resolves.toBe("conflict");
    await expect.poll(() => page.evaluate(() => document.activeElement?.tagName)).not.toBe("BODY");
    await status(page).click();
    await dialog.waitFor();
    await dialog.getByTestId("conflict-keep-mine").click();
    await waitSaved(page);
    await shot(page, "editor-09-kept-mine");
    await other.close();
    expect(errors).toEqual([]);
  });
});
