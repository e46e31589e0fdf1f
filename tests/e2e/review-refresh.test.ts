/**
 * The review panels follow the editor without polling: idle, the page asks the review API nothing;
 * after the editor saves a revision, the same page's review bar and panel show the sign-off stale and
 * fetch the findings again at once. Screenshot: tests/artifacts/review-refresh-*.png.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { signIn } from "../support/http";
import { openEditor, waitSaved } from "../support/editor-page";
import { DEMO_USERS } from "@/db/demo-accounts";
import { demoPitchLinkage } from "@/shared/demo";

const dana = DEMO_USERS[0];
const sam = DEMO_USERS[1];
const REVIEW_API = /^\/api\/builds\/[^/]+\/linkages\/[^/]+\/(comments|acknowledgements|signoffs|revisions)$/;
let browser: Browser;
let page: Page;
let editorUrl = "";
const errors: string[] = [];
/** Review API requests the page made, with when. */
const asked: { what: string; at: number }[] = [];

beforeAll(async () => {
  const danaApi = await signIn(dana.email, dana.password);
  const samApi = await signIn(sam.email, sam.password);
  const b = await danaApi.request("POST", "/api/builds", { name: `Refresh run ${Date.now().toString(36)}`, model: "Larkspur LX-2" });
  const buildId = b.body.build.id;
  expect((await danaApi.request("POST", `/api/builds/${buildId}/members`, { email: sam.email, role: "reviewer" })).status).toBe(201);
  const l = await danaApi.request("POST", `/api/builds/${buildId}/linkages`, { name: "Pitch signed", system: "pitch", graph: demoPitchLinkage() });
  const L = `/api/builds/${buildId}/linkages/${l.body.linkage.id}`;
  // The reviewer acknowledges every hazard of revision 1 and signs it off.
  const { findings } = (await samApi.request("GET", `${L}/acknowledgements`)).body;
  for (const f of findings.filter((x: { severity: string; acknowledgement: unknown }) => x.severity === "hazard" && !x.acknowledgement)) {
    expect((await samApi.request("POST", `${L}/acknowledgements`, { code: f.code, subject: f.subject, reason: "Accepted for this test run." })).status).toBe(201);
  }
  expect((await samApi.request("POST", `${L}/signoffs`, { revision: 1, statement: "Revision 1 inspected." })).status).toBe(201);
  editorUrl = `${APP_URL}/builds/${buildId}/linkages/${l.body.linkage.id}`;

  browser = await launchBrowser();
  page = await (await browser.newContext({ viewport: { width: 1600, height: 1000 } })).newPage();
  page.on("pageerror", (e) => errors.push(String(e)));
  page.on("request", (r) => {
    const m = REVIEW_API.exec(new URL(r.url()).pathname);
    if (m && r.method() === "GET") asked.push({ what: m[1], at: Date.now() });
  });
  await signInPage(page, dana.email, dana.password);
});
afterAll(() => browser?.close());

describe("review panels and the editor's saves", () => {
  it("an idle editor page does not poll the review API", async () => {
    await openEditor(page, editorUrl);
    await page.locator('[data-testid=review-bar] [data-testid=signoff-status][data-state="signed"]').waitFor({ timeout: 15_000 });
    // Nothing selected: the linkage's review panel, with the sign-off listed as current.
    await page.getByTestId("canvas").click({ position: { x: 30, y: 30 } });
    await page.keyboard.press("Escape");
    await page.getByTestId("review-panel").locator('[data-testid=signoff-item][data-stale="no"]').waitFor({ timeout: 10_000 });
    await page.waitForTimeout(1500); // the first fetches settle
    const before = asked.length;
    await page.waitForTimeout(9000); // two and more rounds of the 4 s poll this replaces
    expect(asked.slice(before), "review requests while idle").toEqual([]);
  });

  it("a save from the editor updates the same page's review bar and panel at once", async () => {
    const savedAt = Date.now();
    await page.getByTestId("tray-travelStop").click();
    await waitSaved(page);
    await page.locator('[data-testid=review-bar] [data-testid=signoff-status][data-state="stale"]').waitFor({ timeout: 5000 });
    await page.keyboard.press("Escape"); // the new part was selected: back to the linkage's panel
    await page.getByTestId("review-panel").locator('[data-testid=signoff-item][data-stale="yes"]').waitFor({ timeout: 5000 });
    const after = new Set(asked.filter((a) => a.at >= savedAt).map((a) => a.what));
    expect([...after].sort()).toEqual(expect.arrayContaining(["acknowledgements", "signoffs"]));
    await shot(page, "review-refresh-01-stale-after-save");
    expect(errors).toEqual([]);
  });
});
