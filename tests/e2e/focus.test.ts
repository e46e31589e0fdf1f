/**
 * Where the focus goes on the build pages, by keyboard, in Chromium at 1440 × 900: a form or popover opened by a
 * button closes with Escape (and Cancel) and gives the focus back to that button; nothing sends it to <body>.
 * Also: the checklist's "+ Photo" shows a focus ring when Tab reaches its file input.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { demoPitchLinkage } from "@/shared/demo";
import { analyze } from "@/shared/analysis";

let browser: Browser;
let page: Page;
let buildId: string, linkageId: string;
const errors: string[] = [];

/** The focused element: its tag, test id, aria-label and text. */
const focused = () =>
  page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return { tag: "body", testId: "", label: "", text: "" };
    return { tag: el.tagName.toLowerCase(), testId: el.getAttribute("data-testid") ?? "", label: el.getAttribute("aria-label") ?? "", text: (el.textContent ?? "").trim().slice(0, 60) };
  });

beforeAll(async () => {
  browser = await launchBrowser();
  const owner = await makeUser("e2e-focus");
  ({ buildId, linkageId } = await makeBuild({ owner }));
  const graph = demoPitchLinkage();
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).update({ graph: JSON.stringify(graph), analysis: JSON.stringify(analyze(graph)) });
  page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
  page.on("pageerror", (e) => errors.push(String(e)));
  await signInPage(page, owner.email, TEST_PASSWORD);
});
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

describe("focus on the build pages", () => {
  it("checklist: Tab onto + Photo draws a ring round it; Escape in a note gives the focus back to Add a note", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/checklist/${linkageId}`);
    const joint = page.getByTestId("checklist-joint-j-stick-fwd");
    await joint.waitFor();
    const note = joint.getByRole("button", { name: "Add a note" }).last();
    await note.focus();
    await page.keyboard.press("Tab");
    expect((await focused()).label).toMatch(/^Add a photo of the joint/);
    const ring = await joint.locator("label", { hasText: "+ Photo" }).evaluate((l) => {
      const s = getComputedStyle(l);
      return { style: s.outlineStyle, width: parseFloat(s.outlineWidth) };
    });
    expect(ring.style).not.toBe("none");
    expect(ring.width).toBeGreaterThanOrEqual(2);
    await shot(page, "focus-01-photo");

    await note.focus();
    await page.keyboard.press("Enter");
    expect((await focused()).tag).toBe("input");
    await page.keyboard.press("Escape");
    await expect.poll(async () => (await focused()).text).toBe("Add a note");
  });

  it("overview: New linkage and Rename close with Escape and Cancel, the focus back on their button", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}`);
    const opener = page.getByTestId("new-linkage");
    await opener.focus();
    await page.keyboard.press("Enter");
    await expect.poll(async () => (await focused()).testId).toBe("linkage-name");
    await page.keyboard.press("Escape");
    await expect.poll(async () => (await focused()).testId).toBe("new-linkage");
    await page.keyboard.press("Enter");
    await page.getByRole("button", { name: "Cancel" }).click();
    await expect.poll(async () => (await focused()).testId).toBe("new-linkage");

    const rename = page.getByTestId("linkage-row").getByRole("button", { name: "Rename" }).last();
    await rename.focus();
    await page.keyboard.press("Enter");
    await expect.poll(async () => (await focused()).label).toBe("New name");
    await page.keyboard.press("Escape");
    await expect.poll(async () => (await focused()).text).toBe("Rename");
    await page.keyboard.press("Enter");
    await page.getByRole("button", { name: "Cancel" }).click();
    await expect.poll(async () => (await focused()).text).toBe("Rename");
  });

  it("build log: New entry puts the focus in the first field; Escape and Cancel close it back on New entry", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/log`);
    const opener = page.getByRole("button", { name: "New entry" });
    await opener.focus();
    await page.keyboard.press("Enter");
    await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe("e-date");
    await page.keyboard.press("Tab");
    await page.keyboard.press("Escape");
    await expect.poll(async () => (await focused()).text).toBe("New entry");
    await page.keyboard.press("Enter");
    await page.getByRole("button", { name: "Cancel" }).click();
    await expect.poll(async () => (await focused()).text).toBe("New entry");
  });

  it("export: Escape and Cancel close the estimate back on its button; starting the export keeps the focus off <body>", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/log`);
    const opener = page.getByTestId("log-pdf");
    await opener.focus();
    await page.keyboard.press("Enter");
    await page.getByTestId("export-estimate").waitFor();
    await page.keyboard.press("Escape");
    await expect.poll(() => page.getByTestId("export-panel").count()).toBe(0);
    expect((await focused()).testId).toBe("log-pdf");

    await page.keyboard.press("Enter");
    await page.getByTestId("export-estimate").waitFor();
    await page.getByRole("button", { name: "Cancel" }).click();
    await expect.poll(async () => (await focused()).testId).toBe("log-pdf");

    await page.keyboard.press("Enter");
    await page.getByRole("button", { name: "Make the PDF" }).focus();
    await page.keyboard.press("Enter");
    await page.getByTestId("export-job").waitFor();
    expect((await focused()).tag).not.toBe("body");
    // While it is made, and once it is done, the focus is still on something.
    await expect.poll(() => page.getByTestId("export-job").getAttribute("data-status"), { timeout: 30_000 }).toBe("done");
    expect((await focused()).tag).not.toBe("body");
    await shot(page, "focus-02-export");
    expect(errors).toEqual([]);
  });
});
