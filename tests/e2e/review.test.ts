/**
 * Review in Debian Chromium against the served app: the reviewer (Sam) comments on a joint; the builder
 * (Dana) sees the marker on the canvas, fixes the hardware and replies; the reviewer resolves the thread
 * and signs off; the builder edits again and the sign-off shows stale. Screenshots: tests/artifacts/review-*.png.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { openEditor, openJoint, waitSaved } from "../support/editor-page";
import { signIn } from "../support/http";
import { DEMO_USERS } from "@/db/demo-accounts";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";

const dana = DEMO_USERS[0];
const sam = DEMO_USERS[1];
let browser: Browser;
let samPage: Page;
let danaPage: Page;
let editorUrl = "";
let buildId = "";
const errors: string[] = [];
const COMMENT = "The washer under the bolt head is smaller than the rod-end eye, and there is no jam nut.\nSee https://example.test/retaining-washers";

async function openReview(p: Page) {
  await openEditor(p, editorUrl);
  await p.getByTestId(`joint-${DEMO_WRONG_JOINT}`).waitFor();
}
const thread = (p: Page) => p.locator(`[data-testid=review-thread][data-subject="joint:${DEMO_WRONG_JOINT}"]`);

beforeAll(async () => {
  // A fresh build of Dana's with the demo pitch run, and Sam as its reviewer.
  const api = await signIn(dana.email, dana.password);
  const b = await api.request("POST", "/api/builds", { name: `Review run ${Date.now().toString(36)}`, model: "Larkspur LX-2" });
  buildId = b.body.build.id;
  expect((await api.request("POST", `/api/builds/${buildId}/members`, { email: sam.email, role: "reviewer" })).status).toBe(201);
  const l = await api.request("POST", `/api/builds/${buildId}/linkages`, { name: "Pitch under review", system: "pitch", graph: demoPitchLinkage() });
  expect(l.status).toBe(201);
  editorUrl = `${APP_URL}/builds/${buildId}/linkages/${l.body.linkage.id}`;

  browser = await launchBrowser();
  const a = await browser.newContext({ viewport: { width: 1600, height: 1000 } });
  const d = await browser.newContext({ viewport: { width: 1600, height: 1000 } });
  samPage = await a.newPage();
  danaPage = await d.newPage();
  for (const p of [samPage, danaPage]) p.on("pageerror", (e) => errors.push(String(e)));
  await signInPage(samPage, sam.email, sam.password);
  await signInPage(danaPage, dana.email, dana.password);
});
afterAll(() => browser?.close());

describe("review and sign-off in a real browser", () => {
  it("the reviewer comments on the wrong joint", async () => {
    await openReview(samPage);
    await samPage.getByTestId(`joint-${DEMO_WRONG_JOINT}`).click();
    await thread(samPage).waitFor();
    await thread(samPage).getByTestId("comment-body").fill(COMMENT);
    await thread(samPage).getByTestId("comment-submit").click();
    const c = thread(samPage).getByTestId("comment");
    await c.first().waitFor();
    expect(await c.first().innerText()).toContain("no jam nut");
    // The focus stays in the (emptied) comment box, not on the page; one thread is said in the singular.
    await expect.poll(() => samPage.evaluate(() => document.activeElement?.getAttribute("data-testid"))).toBe("comment-body");
    expect(await thread(samPage).getByTestId("shown-count").textContent()).toBe("1 thread shown.");
    // Rendered as text, the address as a safe link.
    const link = c.first().locator("a");
    expect(await link.getAttribute("href")).toBe("https://example.test/retaining-washers");
    expect(await link.getAttribute("rel")).toContain("noopener");
    await samPage.getByTestId(`review-marker-joint-${DEMO_WRONG_JOINT}`).waitFor();
    // The reviewer cannot edit the joint card.
    expect(await samPage.getByTestId("joint-form-jamNut__fitted").isDisabled().catch(() => true)).toBe(true);
    await shot(samPage, "review-01-reviewer-comments");
  });

  it("the builder sees the marker, fixes the hardware and replies", async () => {
    await openReview(danaPage);
    const marker = danaPage.getByTestId(`review-marker-joint-${DEMO_WRONG_JOINT}`);
    await marker.waitFor({ timeout: 10_000 });
    expect(await marker.getAttribute("data-count")).toBe("1");
    expect(await danaPage.getByTestId("review-bar-open").getAttribute("data-count")).toBe("1");
    await shot(danaPage, "review-02-builder-sees-marker");

    const card = await openJoint(danaPage, DEMO_WRONG_JOINT);
    await thread(danaPage).getByTestId("comment").first().waitFor();
    await card.getByTestId("joint-form-jamNut__fitted").check();
    await card.getByTestId("joint-form-jamNut__tightened").check();
    await card.getByTestId("joint-form-washerUnderHead__outsideDiameter").fill("0.625");
    await waitSaved(danaPage);
    await expect.poll(() => danaPage.locator('[data-testid=finding][data-severity=hazard]').count(), { timeout: 10_000 }).toBe(0);

    await thread(danaPage).getByTestId("thread-reply").click();
    await thread(danaPage).getByTestId("reply-body").fill("Fitted a jam nut and a 0.625 in washer under the head.");
    await thread(danaPage).getByTestId("reply-submit").click();
    await expect.poll(() => thread(danaPage).getByTestId("comment").count(), { timeout: 10_000 }).toBe(2);
    await shot(danaPage, "review-03-builder-fixed-and-replied");
  });

  it("the reviewer resolves the thread and signs off the fixed revision", async () => {
    await openReview(samPage);
    await samPage.getByTestId(`joint-${DEMO_WRONG_JOINT}`).click();
    await expect.poll(() => thread(samPage).getByTestId("comment").count(), { timeout: 10_000 }).toBe(2);
    expect(await thread(samPage).innerText()).toContain("Fitted a jam nut");
    await thread(samPage).getByTestId("thread-resolve").click();
    await thread(samPage).locator('[data-testid=review-thread-item][data-resolved="yes"]').waitFor();
    await samPage.getByTestId(`review-marker-joint-${DEMO_WRONG_JOINT}`).waitFor({ state: "detached", timeout: 10_000 });

    // Nothing selected: the linkage's review panel with the sign-off form.
    await samPage.getByTestId("canvas").click({ position: { x: 30, y: 30 } });
    await samPage.keyboard.press("Escape");
    const panel = samPage.getByTestId("review-panel");
    await panel.waitFor();
    await panel.getByTestId("signoff-statement").fill("Revision inspected joint by joint; the horn joint now has its jam nut and retaining washer.");
    await panel.getByTestId("signoff-submit").click();
    await samPage.locator('[data-testid=review-bar] [data-testid=signoff-status][data-state="signed"]').waitFor({ timeout: 10_000 });
    await panel.getByTestId("history-toggle").click();
    await panel.getByTestId("diff-view").waitFor();
    expect(await panel.getByTestId("diff-view").innerText()).toContain("hardware.washerUnderHead.outsideDiameter");
    await shot(samPage, "review-04-reviewer-resolved-and-signed");
  });

  it("the builder edits again and the sign-off shows stale", async () => {
    await openReview(danaPage);
    await danaPage.locator('[data-testid=review-bar] [data-testid=signoff-status][data-state="signed"]').waitFor({ timeout: 10_000 });
    await danaPage.getByTestId("joint-j-stick-fwd").click();
    await danaPage.getByTestId("joint-card").getByTestId("joint-form-torque").fill("65");
    await waitSaved(danaPage);
    const stale = danaPage.locator('[data-testid=review-bar] [data-testid=signoff-status][data-state="stale"]');
    await stale.waitFor({ timeout: 15_000 });
    expect(await stale.innerText()).toMatch(/stale/i);
    // With nothing selected the review panel opens on what changed since that sign-off.
    await danaPage.keyboard.press("Escape"); // from the card's field back to the joint
    await danaPage.keyboard.press("Escape"); // and the selection cleared
    const since = danaPage.getByTestId("since-signoff");
    await since.getByTestId("diff-view").waitFor({ timeout: 10_000 });
    expect(await since.innerText()).toContain("hardware.torque");
    await shot(danaPage, "review-05-signoff-stale");

    await danaPage.goto(`${APP_URL}/builds/${buildId}`);
    const item = danaPage.getByTestId("overview-review-item").first();
    await item.waitFor();
    expect(await item.getByTestId("signoff-status").getAttribute("data-state")).toBe("stale");
    expect(await item.getByTestId("overview-open-threads").getAttribute("data-count")).toBe("0");
    await shot(danaPage, "review-06-overview");
    expect(errors).toEqual([]);
  });
});
