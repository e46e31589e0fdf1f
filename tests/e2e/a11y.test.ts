/**
 * Every page by screen reader rules and at phone width, in Debian's Chromium: axe-core (from npm) finds no
 * WCAG 2.0 / 2.1 / 2.2 A or AA violation at 1366 and 390 px wide, signed in as the demo's owner, reviewer and
 * site admin (and signed out on the sign-in pages); and no page is wider than a 390 px screen
 * (document.documentElement.scrollWidth against the viewport's width, not window.innerWidth, which a phone's
 * viewport stretches to fit a page that is too wide). Every page starts with a skip link to its main landmark.
 * A role's pages are checked in two tabs of its one signed-in context at once (TABS): most of a page's
 * time is the wait for its network to settle, which the other tab's page fills.
 */
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { testDb } from "../support/db";
import { DEMO_BUILD, DEMO_USERS } from "@/db/demo-accounts";
import { analyze } from "@/shared/analysis";
import { checklistFor } from "@/shared/records/checklist";
import type { LinkageGraph } from "@/shared/linkage/schema";

const AXE = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");
const TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22a", "wcag22aa"];
const WIDTHS = [1366, 390] as const;
const TABS = 3; // pages wait on the network as well as the CPU: a third tab keeps both cores busy

let browser: Browser;
let buildId: string;
let linkageId: string;
/** Codes and ids that must never reach a person: finding and checklist codes, hyphenated part and joint ids, uuids. */
let forbidden: string[] = [];
let commentId: string | null = null;
const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i;

type Violation = { id: string; impact: string; help: string; nodes: { target: string[]; failureSummary?: string }[] };

/** Loads a page, waits until it has settled (the editor until its view is drawn), runs axe, measures the width. */
async function check(page: Page, url: string) {
  await page.goto(`${APP_URL}${url}`, { waitUntil: "networkidle" });
  if (url.includes("/linkages/")) {
    await page.getByTestId("linkage-editor").waitFor({ timeout: 60_000 });
    await page.waitForFunction(() => document.querySelector("[data-testid=run-list]") || document.querySelector("[data-testid=canvas][data-view=ready]"), null, { timeout: 15_000 });
  }
  await page.evaluate(AXE);
  const violations = (await page.evaluate(
    (tags) =>
      // @ts-expect-error axe is the script evaluated above
      window.axe.run(document, { runOnly: { type: "tag", values: tags }, resultTypes: ["violations"] }).then((r: { violations: Violation[] }) =>
        r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 5).map((n) => ({ target: n.target, failureSummary: n.failureSummary })) })),
      ),
    TAGS,
  )) as Violation[];
  const text = await page.evaluate(() => document.body.innerText);
  // A code standing alone; inside a file name a person chose ("witness-hole.jpg") it is their text, not ours.
  const codes = forbidden.filter((c) => new RegExp(`(^|[^\\w.-])${c}($|[^\\w.-])`).test(text));
  if (UUID.test(text)) codes.push(`an id (${text.match(UUID)![0]})`);
  // Against the window the page was given: on a phone (isMobile) Chromium widens window.innerWidth to a page that
  // is too wide, so that measure never catches one.
  const widths = { scroll: await page.evaluate(() => document.documentElement.scrollWidth), view: page.viewportSize()!.width };
  const skip = await page.evaluate(() => {
    const a = document.querySelector("a.skip-link");
    return { first: document.body.querySelector("a, button, input, select, textarea, [tabindex]") === a, target: !!document.getElementById("main") };
  });
  return { violations, widths, skip, codes };
}

/**
 * Runs `each` on every URL, TABS pages of the context at a time (each tab takes the next URL when it is done),
 * and gives the results back in the order of `urls`.
 */
async function inTabs<T>(ctx: BrowserContext, first: Page, urls: string[], each: (page: Page, url: string) => Promise<T>): Promise<T[]> {
  const out: T[] = new Array(urls.length);
  let next = 0;
  const pages = [first, ...(await Promise.all(Array.from({ length: Math.min(TABS, urls.length) - 1 }, () => ctx.newPage())))];
  await Promise.all(pages.map(async (page) => {
    while (next < urls.length) {
      const i = next++;
      out[i] = await each(page, urls[i]);
    }
  }));
  return out;
}

async function signedIn(email: string, password: string, width: number): Promise<{ ctx: BrowserContext; page: Page }> {
  const ctx = await browser.newContext({ viewport: { width, height: width < 500 ? 844 : width < 1000 ? 1180 : 900 }, hasTouch: width < 1000, isMobile: width < 1000 });
  const page = await ctx.newPage();
  await signInPage(page, email, password);
  return { ctx, page };
}

beforeAll(async () => {
  browser = await launchBrowser();
  const b = await testDb("builds").where({ name: DEMO_BUILD.name }).orderBy("created_at").first("id");
  buildId = b.id;
  const l = await testDb("linkages").where({ build_id: buildId }).orderBy("created_at").first("id");
  linkageId = l.id;
  const revs = await testDb("linkages as l").join("linkage_revisions as r", "r.linkage_id", "l.id").where("l.build_id", buildId).select("r.graph");
  const set = new Set<string>();
  for (const { graph } of revs as { graph: LinkageGraph }[]) {
    const report = analyze(graph);
    for (const f of report.findings) set.add(f.code);
    for (const i of checklistFor(graph, report)) set.add(i.code);
    for (const x of [...graph.nodes, ...graph.joints]) if (x.id.includes("-")) set.add(x.id);
  }
  // An open thread on a joint, so the review panel's list of open threads (by name) is on the page too.
  const reviewer = await testDb("users").where({ email: DEMO_USERS[1].email }).first("id");
  const [c] = await testDb("comments").insert({ build_id: buildId, linkage_id: linkageId, subject_type: "joint", subject_id: "j-aft-horn", author_id: reviewer.id, body: "Jam nut? (a11y sweep)", revision: 1 }).returning("id");
  commentId = c.id;
  forbidden = [...set].filter((c) => c.includes("-")); // a one-word code ("torque") is also a plain word
  expect(forbidden).toContain("jam-nut-missing");
});
afterAll(async () => {
  await browser?.close();
  if (commentId) await testDb("comments").where({ id: commentId }).del();
  await testDb.destroy();
});

const buildPages = () => ["", "/log", "/files", "/hardware", "/parts", "/checklist", `/checklist/${linkageId}`, "/members", "/settings", "/activity", `/linkages/${linkageId}`].map((p) => `/builds/${buildId}${p}`);

const ROLES = [
  { who: "owner", user: DEMO_USERS[0], pages: () => ["/builds", "/builds/new", "/parts", "/account", ...buildPages()] },
  { who: "reviewer", user: DEMO_USERS[1], pages: () => ["/builds", ...buildPages()] },
  { who: "site admin", user: DEMO_USERS[3], pages: () => ["/builds", "/admin/users", "/admin/mail", "/parts"] },
];

describe("axe-core and phone width on every page", () => {
  // Every role at phone width, the owner and the site admin at desktop width too, and the owner on a tablet
  // (820 × 1180). The reviewer's pages are the owner's with fewer controls: what is the reviewer's own (the
  // sign-off and review panels) is checked at 390 px, where it is also checked for width — the sweep stays
  // inside npm test's 15 minutes.
  for (const width of [...WIDTHS, 820]) {
    for (const role of width === 820 ? ROLES.slice(0, 1) : width === 390 ? ROLES : ROLES.filter((r) => r.who !== "reviewer")) {
      it(`as the ${role.who} at ${width} px: no WCAG A/AA violation, nothing wider than the screen, a skip link first, no code or id shown`, async () => {
        const { ctx, page } = await signedIn(role.user.email, role.user.password, width);
        let problems: string[] = [];
        try {
          const found = await inTabs(ctx, page, role.pages(), async (tab, url) => {
            const r = await check(tab, url);
            const here: string[] = [];
            for (const v of r.violations) here.push(`${url}: ${v.id} (${v.impact}) ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
            if (r.codes.length) here.push(`${url}: shows ${r.codes.join(", ")} to a person`);
            if (r.widths.scroll > r.widths.view) here.push(`${url}: ${r.widths.scroll} px wide in a ${r.widths.view} px window`);
            if (!r.skip.first || !r.skip.target) here.push(`${url}: the skip link is not the first stop, or there is no #main`);
            if (width === 390 && here.length) await shot(tab, `a11y-${role.who.replace(" ", "-")}-${width}-${url.split("/").slice(3).join("-") || "home"}`);
            return here;
          });
          problems = found.flat();
        } finally {
          await ctx.close();
        }
        expect(problems).toEqual([]);
      }, 240_000);
    }
  }

  it("signed out, the sign-in and sign-up pages at both widths", async () => {
    const problems: string[] = [];
    for (const width of WIDTHS) {
      const ctx = await browser.newContext({ viewport: { width, height: 844 } });
      const page = await ctx.newPage();
      const urls = ["/sign-in", "/sign-up", "/verify", "/sign-in?password=changed", "/sign-in?confirmed=1", `/sign-up/confirm/${"A".repeat(43)}`];
      const found = await inTabs(ctx, page, urls, async (tab, url) => {
        const r = await check(tab, url);
        const here: string[] = [];
        for (const v of r.violations) here.push(`${url}@${width}: ${v.id} ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
        if (r.widths.scroll > r.widths.view) here.push(`${url}@${width}: ${r.widths.scroll} px wide`);
        return here;
      });
      problems.push(...found.flat());
      await ctx.close();
    }
    expect(problems).toEqual([]);
  }, 60_000);

  it("the check itself works: a planted image without a text alternative and a too-wide box are both caught", async () => {
    const { ctx, page } = await signedIn(DEMO_USERS[0].email, DEMO_USERS[0].password, 390);
    await page.goto(`${APP_URL}/builds`, { waitUntil: "networkidle" });
    // Planted after the page has settled, in a box of its own (a re-render of the page's main must not take it away).
    await page.evaluate(() => {
      const box = document.createElement("div");
      const img = document.createElement("img");
      img.src = "/icon.svg";
      box.append(img);
      const wide = document.createElement("div");
      wide.style.width = "600px";
      wide.style.height = "1px";
      box.append(wide);
      document.body.append(box);
    });
    await page.locator("img[src='/icon.svg']:not([alt])").first().waitFor({ state: "attached" });
    await page.evaluate(AXE);
    const ids = (await page.evaluate(() =>
      // @ts-expect-error axe is the script evaluated above
      window.axe.run(document, { runOnly: { type: "tag", values: ["wcag2a"] } }).then((r: { violations: { id: string }[] }) => r.violations.map((v) => v.id)),
    )) as string[];
    expect(ids).toContain("image-alt");
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeGreaterThan(390);
    // A phone's viewport stretches to the page: window.innerWidth is no measure of "wider than the screen".
    expect(await page.evaluate(() => window.innerWidth)).toBeGreaterThan(390);
    await ctx.close();
  });

  it("on a phone the joint card's fields are a thumb's size with 16 px text (a phone zooms into smaller text on focus); with a mouse they stay dense", async () => {
    /** The smallest and largest field height and text size on the joint card, and the lowest row of a tick box's label. */
    const sizes = async (width: number) => {
      const { ctx, page } = await signedIn(DEMO_USERS[0].email, DEMO_USERS[0].password, width);
      try {
        await page.goto(`${APP_URL}/builds/${buildId}/linkages/${linkageId}?select=j-aft-horn`);
        const card = page.getByTestId("joint-card");
        await card.waitFor({ timeout: 60_000 });
        await card.locator("[data-testid^=joint-form-]").first().waitFor();
        return await card.evaluate((el) => {
          const shown = (e: Element) => e.getBoundingClientRect().height > 0;
          const fields = [...el.querySelectorAll("input:not([type=checkbox]):not([type=radio]):not([type=hidden]):not([type=file]), select, textarea")].filter(shown);
          const name = (f: Element) => f.getAttribute("data-testid") ?? f.getAttribute("aria-label") ?? f.outerHTML.slice(0, 80);
          const h = fields.map((f) => f.getBoundingClientRect().height);
          const font = fields.map((f) => parseFloat(getComputedStyle(f).fontSize));
          const boxes = [...el.querySelectorAll("input[type=checkbox]")].filter(shown);
          const boxRows = boxes.map((b) => (b.closest("label") ?? b).getBoundingClientRect().height);
          return {
            n: fields.length, boxes: boxes.length, maxH: Math.max(...h.filter((_, i) => fields[i].tagName !== "TEXTAREA")), maxFont: Math.max(...font),
            under44: fields.flatMap((f, i) => (h[i] < 44 ? [`${name(f)} ${h[i]} px`] : [])),
            under16: fields.flatMap((f, i) => (font[i] < 16 ? [`${name(f)} ${font[i]} px text`] : [])),
            lowBoxRows: boxes.flatMap((b, i) => (boxRows[i] < 44 ? [`${name(b)} ${boxRows[i]} px`] : [])),
          };
        });
      } finally {
        await ctx.close();
      }
    };
    const phone = await sizes(390);
    expect(phone.n).toBeGreaterThan(10);
    expect(phone.boxes).toBeGreaterThan(3);
    expect(phone.under44).toEqual([]); // common practice, no source: a 44 px thumb target
    expect(phone.under16).toEqual([]);
    expect(phone.lowBoxRows).toEqual([]);
    const desk = await sizes(1366);
    expect(desk.n).toBe(phone.n);
    expect(desk.maxH).toBeLessThan(32); // one-line fields (a text box of two lines is taller)
    expect(desk.maxFont).toBeLessThan(16);
  }, 120_000);

  it("the skip link takes the keyboard past the header to the page's main content", async () => {
    const { ctx, page } = await signedIn(DEMO_USERS[0].email, DEMO_USERS[0].password, 1366);
    await page.goto(`${APP_URL}/builds/${buildId}/hardware`);
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => document.activeElement?.textContent)).toMatch(/Skip to the main content/);
    await page.keyboard.press("Enter");
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("main");
    await ctx.close();
  });
});
