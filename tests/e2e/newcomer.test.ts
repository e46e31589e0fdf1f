/**
 * A newcomer's first run, in Debian Chromium at 1600 × 1000: a new account, a first build, and its empty
 * linkage list offering a starting run, drawing from nothing, or a file. (1) The starting run opens in the
 * editor with every joint's hardware blank and the check asking for it. (2) With the mouse only, the
 * newcomer draws stick → pushrod → horn → elevator, fills one joint card and sees its findings change; the
 * time from sign-up to that finding is printed (a report, not a target). Screenshots: tests/artifacts/newcomer-*.png.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot } from "../support/browser";
import { connect, dropPart, openJoint, waitSaved } from "../support/editor-page";
import { testDb } from "../support/db";
import { confirmToken } from "../support/http";
import { starterPitchRun } from "@/shared/starter";

let browser: Browser;
let page: Page;
const email = `newcomer-${Date.now().toString(36)}@example.test`;
const started = Date.now();

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1600, height: 1000 } })).newPage();
});
afterAll(async () => {
  await testDb("users").where({ email }).delete().catch(() => {});
  await browser?.close();
  await testDb.destroy();
});

const finding = (code: string) => page.getByTestId("findings").locator(`[data-testid=finding][data-code="${code}"]`);

describe("a newcomer's first run", () => {
  it("signs up, makes a build, and is offered a starting run, drawing from nothing, or a file", async () => {
    await page.goto(`${APP_URL}/sign-up`);
    await page.getByLabel("Your name").fill("Robin Newcomer");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill("a long enough password");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.getByTestId("sign-up-sent").getByText("Check your e-mail to finish creating your account.").waitFor();
    await shot(page, "newcomer-00-check-your-email");
    // The link from the e-mail (the local sink) makes the account; sign-in says so, then the builds list.
    await page.goto(`${APP_URL}/sign-up/confirm/${await confirmToken(email)}`);
    await page.waitForURL(/\/sign-in\?confirmed=1/);
    await page.getByTestId("account-confirmed").waitFor();
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill("a long enough password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/builds$/);
    await page.getByRole("link", { name: "Start your first build" }).click();
    await page.getByLabel("Build name").fill("My first two-seater");
    await page.getByLabel("Model or kit").fill("plans-built low wing");
    await page.getByRole("button", { name: "Create build" }).click();
    await page.waitForURL(/\/builds\/[0-9a-f-]{36}$/);
    const choices = page.getByTestId("starting-choices");
    await choices.waitFor();
    expect(await choices.getByRole("button").allTextContents()).toEqual(["Start from a typical pitch run", "Draw from nothing"]);
    expect(await page.getByTestId("import-linkage").count()).toBe(1);
    await shot(page, "newcomer-01-empty-build");
  });

  it("opens the starting run in the editor, every joint's hardware blank and asked for", async () => {
    const buildUrl = page.url();
    await page.getByTestId("start-from-starter").click();
    await page.waitForURL(/\/linkages\/[0-9a-f-]{36}/);
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    const starter = starterPitchRun();
    const id = page.url().match(/linkages\/([0-9a-f-]{36})/)![1];
    const saved = await testDb("linkage_revisions").where({ linkage_id: id, revision: 1 }).first("graph");
    expect(saved.graph).toEqual(starter);
    await expect.poll(() => finding("joint-hardware-missing").count(), { timeout: 10_000 }).toBe(starter.joints.length);
    expect(await page.locator("[data-testid=finding][data-severity=hazard]").count()).toBe(0);
    await shot(page, "newcomer-02-starting-run");
    await page.goto(buildUrl);
  });

  it("draws a run with the mouse only, fills one joint card and sees its findings change", async () => {
    await page.getByTestId("new-linkage").click();
    await page.getByTestId("linkage-name").fill("Drawn by hand");
    await page.getByTestId("create-linkage").click();
    const row = page.getByTestId("linkage-row").filter({ hasText: "Drawn by hand" });
    await row.waitFor();
    await row.getByRole("link", { name: "Drawn by hand" }).click();
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });

    const stick = await dropPart(page, "stick", 140, 220);
    const rod = await dropPart(page, "pushrod", 430, 220);
    const horn = await dropPart(page, "controlHorn", 720, 220);
    const surface = await dropPart(page, "controlSurface", 960, 220);
    await connect(page, [stick, "attach"], [rod, "a"]);
    await connect(page, [rod, "b"], [horn, "attach"]);
    await connect(page, [horn, "surface"], [surface, "horn"]);
    await waitSaved(page);
    const linkageId = page.url().match(/linkages\/([0-9a-f-]{36})/)![1];
    const saved = await testDb("linkages as l").join("linkage_revisions as r", function () { this.on("r.linkage_id", "l.id").andOn("r.revision", "l.current_revision"); }).where("l.id", linkageId).first("r.graph");
    const joint = saved.graph.joints.find((j: { from: { node: string }; to: { node: string } }) => [j.from.node, j.to.node].includes(stick) && [j.from.node, j.to.node].includes(rod));
    expect(joint).toBeDefined();
    const subject = `joint:${joint.id}`;
    await expect.poll(() => page.getByTestId("findings").locator(`[data-testid=finding][data-code=joint-hardware-missing][data-subject="${subject}"]`).count()).toBe(1);

    // The joint card: a rod end with no jam nut recorded — the check now asks for the jam nut instead of all hardware.
    const card = await openJoint(page, joint.id);
    await card.getByTestId("joint-form-on-rodEnd").check();
    await card.getByTestId("joint-form-rodEnd__thread").selectOption("1/4-28");
    await card.getByTestId("joint-form-rodEnd__ballBore").fill("0.25");
    await card.getByTestId("joint-form-rodEnd__ballBore").press("Tab");
    await expect.poll(() => page.getByTestId("findings").locator(`[data-testid=finding][data-code=joint-hardware-missing][data-subject="${subject}"]`).count(), { timeout: 10_000 }).toBe(0);
    await expect.poll(() => page.getByTestId("findings").locator(`[data-testid=finding][data-code=jam-nut-missing][data-subject="${subject}"]`).count()).toBe(1);
    await waitSaved(page);
    await shot(page, "newcomer-03-first-joint");
    console.log(`newcomer: sign-up to the first joint's findings took ${((Date.now() - started) / 1000).toFixed(1)} s in this browser test (mouse only)`);
  });
});
