/**
 * Every part kind of the registry (shared/linkage/kinds + editor/nodes/kinds) can be dragged from the parts
 * tray onto the canvas in a real browser: the tray lists each kind with its name and hint, and each drop
 * draws a card of that kind with its name, its key-number lines and one handle per port, and is saved.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, shot, signInPage } from "../support/browser";
import { dropPart, waitSaved } from "../support/editor-page";
import { DEMO_BUILD, DEMO_USERS } from "@/db/demo-accounts";
import { KIND_LIST, PORTS } from "@/shared/linkage/kinds";

let browser: Browser;
let page: Page;
const errors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1600, height: 1000 } })).newPage();
  page.on("pageerror", (e) => errors.push(String(e)));
});
afterAll(() => browser?.close());

describe("each registered part kind in the editor", () => {
  it("is in the tray, drops onto the canvas as its own card with its ports, and is saved", async () => {
    const dana = DEMO_USERS[0];
    await signInPage(page, dana.email, dana.password);
    await page.getByTestId("build-card").filter({ has: page.getByTestId("build-name").getByText(DEMO_BUILD.name, { exact: true }) }).click();
    await page.waitForURL(/\/builds\/[0-9a-f-]{36}$/);
    const name = `Every kind ${Date.now().toString(36)}`;
    await page.getByTestId("new-linkage").click();
    await page.getByTestId("linkage-name").fill(name);
    await page.getByTestId("create-linkage").click();
    const row = page.getByTestId("linkage-row").filter({ hasText: name });
    await row.waitFor();
    await row.getByRole("link", { name }).click();
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });

    const canvas = page.getByTestId("canvas");
    const box = (await canvas.boundingBox())!;
    const cols = 4;
    for (let i = 0; i < KIND_LIST.length; i++) {
      const { kind, name: kindName, hint } = KIND_LIST[i];
      const tray = page.getByTestId(`tray-${kind}`);
      await expect(tray.textContent()).resolves.toBe(`${kindName}${hint}`);
      const x = 110 + (i % cols) * Math.min(210, (box.width - 200) / (cols - 1));
      const y = 90 + Math.floor(i / cols) * 170;
      const id = await dropPart(page, kind, x, y);
      const card = page.getByTestId(`node-${id}`);
      await expect(card.getAttribute("data-kind")).resolves.toBe(kind);
      await expect(card.textContent()).resolves.toContain(kindName);
      for (const port of PORTS[kind]) await expect(page.getByTestId(`port-${id}-${port}`).count()).resolves.toBe(1);
      await expect(card.locator(".react-flow__handle").count()).resolves.toBe(PORTS[kind].length);
    }
    await waitSaved(page);
    await shot(page, "editor-kinds-every-kind");
    // Reloaded, the saved linkage still holds one part of every kind.
    await page.reload();
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    const kinds = await page.locator("[data-kind]").evaluateAll((els) => els.map((e) => e.getAttribute("data-kind")));
    expect([...new Set(kinds)].sort()).toEqual(KIND_LIST.map((d) => d.kind).sort());
    expect(errors).toEqual([]);
  }, 180_000); // 18 kinds dropped one by one: 24 s alone, several times that on the shared 2-core machine
});
