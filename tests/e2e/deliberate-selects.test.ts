/**
 * Selects that change stored data, driven by the keyboard in Chromium at 1280 × 900 (on a closed select, Chrome on
 * Linux fires a change for every arrow key): a member's role changes only with Save beside the select, the owner's
 * own role select is disabled with its reason, and a hardware line's state is saved once, with Enter or on leaving
 * the select, not once for each state arrowed past.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, signInPage } from "../support/browser";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import { demoPitchLinkage } from "@/shared/demo";
import { analyze } from "@/shared/analysis";

let browser: Browser;
let page: Page;
let buildId: string, linkageId: string;
let builder: { id: string; name: string };
const errors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  const owner = await makeUser("e2e-selects");
  builder = await makeUser("e2e-selects-builder");
  ({ buildId, linkageId } = await makeBuild({ owner, builder }));
  const graph = demoPitchLinkage();
  await testDb("linkage_revisions").where({ linkage_id: linkageId, revision: 1 }).update({ graph: JSON.stringify(graph), analysis: JSON.stringify(analyze(graph)) });
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  page.on("pageerror", (e) => errors.push(String(e)));
  await signInPage(page, owner.email, TEST_PASSWORD);
});
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

const roleOf = async (userId: string) => (await testDb("memberships").where({ build_id: buildId, user_id: userId }).first("role")).role as string;
const auditCount = async (action: string) => Number((await testDb("audit_events").where({ build_id: buildId, action }).count("* as n"))[0].n);

describe("deliberate selects", () => {
  it("members: arrowing through a role saves nothing; Save beside it does; Escape puts it back; the owner's own role is disabled with a reason", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/members`);
    const own = page.getByRole("combobox", { name: /^Role of Test e2e-selects$/ });
    expect(await own.isDisabled()).toBe(true);
    expect(await page.getByText("Your own role: another owner can change it.").count()).toBe(1);
    expect(await own.getAttribute("aria-describedby")).toBeTruthy();

    const role = page.getByRole("combobox", { name: `Role of ${builder.name}` });
    await role.focus();
    await page.keyboard.press("ArrowDown"); // builder → reviewer
    await page.keyboard.press("ArrowDown"); // reviewer → viewer
    await page.waitForTimeout(500);
    expect(await roleOf(builder.id)).toBe("builder");
    expect(await auditCount("member.role")).toBe(0);
    await page.keyboard.press("Escape");
    await expect.poll(() => role.inputValue()).toBe("builder");
    expect(await page.getByTestId("role-change").count()).toBe(0);

    await role.focus();
    await page.keyboard.press("ArrowDown");
    await page.getByRole("button", { name: "Save: Reviewer" }).click();
    await expect.poll(() => roleOf(builder.id)).toBe("reviewer");
    expect(await auditCount("member.role")).toBe(1);
    await expect.poll(() => page.getByTestId("role-change").count()).toBe(0);
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute("aria-label"))).toBe(`Role of ${builder.name}`);
  });

  it("hardware: arrowing through a line's state saves once, with Enter; leaving the select saves what it shows", async () => {
    await page.goto(`${APP_URL}/builds/${buildId}/hardware`);
    const state = page.locator("select[data-state-key]").first();
    await state.waitFor();
    const key = await state.getAttribute("data-state-key");
    await state.focus();
    await page.keyboard.press("ArrowDown"); // to order → ordered
    await page.keyboard.press("ArrowDown"); // ordered → received
    await page.waitForTimeout(500);
    expect(await auditCount("hardware.state")).toBe(0);
    await page.keyboard.press("Enter");
    await expect.poll(() => auditCount("hardware.state")).toBe(1);
    expect((await testDb("hardware_states").where({ build_id: buildId, part_key: key }).first("state")).state).toBe("received");

    const again = page.locator(`select[data-state-key="${key}"]`);
    await again.focus();
    await page.keyboard.press("ArrowDown"); // received → installed
    await page.keyboard.press("Tab");
    await expect.poll(() => auditCount("hardware.state")).toBe(2);
    expect((await testDb("hardware_states").where({ build_id: buildId, part_key: key }).first("state")).state).toBe("installed");
    expect(errors).toEqual([]);
  });
});
