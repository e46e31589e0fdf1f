/**
 * Cable runs in the editor, in Debian Chromium: the builder draws a pedal, one cable and the rudder horn, sees
 * the check say a lone cable would have to push, takes the return cable offered on the card of the joint just
 * drawn (key R) and the finding clears; a cable's own card offers it too (button); then opens the demo's yaw run, finds the right turnbuckle's hazard (five threads showing, at most
 * three allowed: AC 43.13-1B), corrects it on the turnbuckle's card and the hazard clears after saving.
 * Screenshots: tests/artifacts/cables-*.png.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, shot, signInPage } from "../support/browser";
import { connect, dropPart, openJoint, waitSaved } from "../support/editor-page";
import { testDb } from "../support/db";
import { DEMO_BUILD, DEMO_USERS } from "@/db/demo-accounts";
import { DEMO_RUDDER_FAULT_PART, demoRudderLinkage } from "@/shared/demo-rudder";

let browser: Browser;
let page: Page;
const errors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1600, height: 1000 } })).newPage();
  page.on("pageerror", (e) => errors.push(String(e)));
  const dana = DEMO_USERS[0];
  await signInPage(page, dana.email, dana.password);
});
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

const finding = (code: string) => page.locator(`[data-testid=finding][data-code="${code}"]`);

async function demoBuild() {
  await page.getByTestId("build-card").filter({ has: page.getByTestId("build-name").getByText(DEMO_BUILD.name, { exact: true }) }).first().click();
  await page.waitForURL(/\/builds\/[0-9a-f-]{36}$/);
}

describe("drawing a cable circuit", () => {
  it("offers the return cable for a lone cable, and the 'cable would push' hazard clears once it is added", async () => {
    await demoBuild();
    const name = `Rudder cables ${Date.now().toString(36)}`;
    await page.getByTestId("new-linkage").click();
    await page.getByTestId("linkage-name").fill(name);
    await page.getByTestId("linkage-system").selectOption("yaw");
    await page.getByTestId("create-linkage").click();
    const row = page.getByTestId("linkage-row").filter({ hasText: name });
    await row.waitFor();
    await row.getByRole("link", { name }).click();
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });

    const pedal = await dropPart(page, "cablePedal", 160, 200);
    const cable = await dropPart(page, "cable", 520, 200);
    const horn = await dropPart(page, "controlHorn", 900, 200);
    await connect(page, [pedal, "attach"], [cable, "a"]);
    await connect(page, [cable, "b"], [horn, "attach"]);
    await expect.poll(() => finding("cable-pushes").count(), { timeout: 10_000 }).toBe(1);

    // The joint just drawn is selected, and its card offers the return cable at once; R takes the offer.
    const offer = page.getByTestId("return-cable-offer");
    await offer.waitFor();
    expect(await offer.getAttribute("data-cable")).toBe(cable);
    // A terminal's card asks for what holds it, not for a rod end.
    await expect.poll(() => page.getByTestId("joint-card").getByTestId("joint-todo").textContent(), { timeout: 10_000 }).toMatch(/bolt or clevis pin that holds this joint/i);
    await shot(page, "cables-01-return-offered");
    await page.keyboard.press("r");
    await expect.poll(() => page.locator("[data-kind=cable]").count()).toBe(2);
    await expect.poll(() => finding("cable-pushes").count(), { timeout: 10_000 }).toBe(0);
    await expect.poll(() => finding("linkage-loop").count()).toBe(0);
    expect(await offer.count()).toBe(0);
    await waitSaved(page);
    const saved = await testDb("linkages as l").join("linkage_revisions as r", function () { this.on("r.linkage_id", "l.id").andOn("r.revision", "l.current_revision"); }).where("l.name", name).first("r.graph");
    expect(saved.graph.nodes.filter((n: { kind: string }) => n.kind === "cable")).toHaveLength(2);
    await shot(page, "cables-02-circuit-closed");

    // Undone, the cable's own card offers it again, and its button makes it.
    await page.keyboard.press("Control+z");
    await expect.poll(() => page.locator("[data-kind=cable]").count()).toBe(1);
    await page.getByTestId(`node-${cable}`).click();
    await offer.getByTestId("btn-return-cable").click();
    await expect.poll(() => page.locator("[data-kind=cable]").count()).toBe(2);
    await expect.poll(() => finding("cable-pushes").count(), { timeout: 10_000 }).toBe(0);
    await waitSaved(page);
  });
});

describe("the demo's yaw run", () => {
  it("shows the turnbuckle's hazard on its joint's card and its own, and correcting its threads clears it", async () => {
    await page.goto(page.url().replace(/\/linkages\/.*$/, ""));
    await page.getByTestId("linkage-row").filter({ hasText: demoRudderLinkage().name }).first().getByRole("link").first().click();
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    await expect.poll(() => finding("turnbuckle-threads-showing").count(), { timeout: 10_000 }).toBe(1);
    // The joint at the turnbuckle's aft end shows that end's threads and its safetying, not rod-end fields.
    const card = await openJoint(page, "rd-j-horn-right");
    const threads = card.getByTestId(`turnbuckle-threads-${DEMO_RUDDER_FAULT_PART}-b`);
    expect(await threads.inputValue()).toBe("5");
    expect(await card.getByTestId(`turnbuckle-locking-${DEMO_RUDDER_FAULT_PART}`).inputValue()).toBe("clip");
    expect(await card.getByText("Rod-end bearing").count()).toBe(0);
    await threads.fill("4");
    await expect.poll(() => finding("turnbuckle-threads-showing").count(), { timeout: 10_000 }).toBe(1); // still over 3
    // Corrected on the turnbuckle's own card (the same value: one home), the hazard clears.
    await finding("turnbuckle-threads-showing").click();
    const form = page.getByTestId("node-form");
    await form.waitFor();
    const field = form.getByLabel("Threads showing at B");
    expect(await field.inputValue()).toBe("4");
    await field.fill("3");
    await field.press("Tab");
    await expect.poll(() => finding("turnbuckle-threads-showing").count(), { timeout: 10_000 }).toBe(0);
    expect(await (await openJoint(page, "rd-j-horn-right")).getByTestId(`turnbuckle-threads-${DEMO_RUDDER_FAULT_PART}-b`).inputValue()).toBe("3");
    await waitSaved(page);
    await shot(page, "cables-03-turnbuckle-fixed");
    const row = await testDb("linkages as l").join("linkage_revisions as r", function () { this.on("r.linkage_id", "l.id").andOn("r.revision", "l.current_revision"); })
      .where("l.name", demoRudderLinkage().name).orderBy("l.created_at").first("r.graph", "r.analysis");
    expect(row.graph.nodes.find((n: { id: string }) => n.id === DEMO_RUDDER_FAULT_PART).props.threadsShowingB).toBe(3);
    expect(row.analysis.summary.hazard).toBe(0);

    // Its checklist screen: a group per cable part, the tension item with the reading on the cable's card.
    await page.goto(page.url().replace(/\/linkages\/([0-9a-f-]{36}).*$/, "/checklist/$1"));
    const left = page.getByTestId("checklist-part-rd-cable-left");
    await left.waitFor();
    await expect(left.textContent()).resolves.toContain("On the cable's card: 30 lbf at 68 °F.");
    for (const id of ["rd-cable-right", "rd-tb-left", DEMO_RUDDER_FAULT_PART, "rd-pulley", "rd-fairlead"])
      await expect(page.getByTestId(`checklist-part-${id}`).count()).resolves.toBe(1);
    await shot(page, "cables-04-checklist");
    expect(errors).toEqual([]);
  });
});
