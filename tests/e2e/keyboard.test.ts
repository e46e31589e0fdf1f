/**
 * The editor without a mouse, in Debian's Chromium at 1440 × 900: a builder adds three parts from the tray,
 * joins them with the keyboard join, opens a joint's card, fills a hardware field and hears the findings change,
 * goes back to the canvas with Escape, moves a part with the arrow keys (one undo step each) — no mouse event
 * at all. Then every Tab stop of the editor is checked for a visible focus: a screenshot of the element's box
 * focused differs from the same box unfocused. Screenshots: tests/artifacts/keyboard-*.png.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { openEditor, waitSaved } from "../support/editor-page";
import { makeBuild, makeUser, testDb, TEST_PASSWORD } from "../support/db";
import type { LinkageGraph } from "@/shared/linkage/schema";
import { runOrder } from "@/shared/linkage/order";
import { demoPitchLinkage } from "@/shared/demo";

let browser: Browser;
let page: Page;
let url: string;
let linkageId: string;
let buildId: string;
const errors: string[] = [];

/** What has the focus: a test id, a canvas part or joint, a field's label, or the element's text. */
const focused = (p: Page) =>
  p.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return { kind: "body", id: "", label: "", text: "" };
    const rf = el.closest(".react-flow__node, .react-flow__edge");
    const label = (el as HTMLInputElement).labels?.[0]?.textContent?.trim() ?? "";
    return {
      kind: rf ? (rf.classList.contains("react-flow__node") ? "part" : "joint") : el.tagName.toLowerCase(),
      id: rf?.getAttribute("data-id") ?? el.getAttribute("data-testid") ?? el.id ?? "",
      label,
      text: (el.textContent ?? "").trim().slice(0, 60),
    };
  });

/** Tab (or Shift-Tab) until the focus is where `want` says; fails after `max` presses. */
async function tabTo(p: Page, want: (f: Awaited<ReturnType<typeof focused>>) => boolean, max = 120, back = false) {
  for (let i = 0; i < max; i++) {
    await p.keyboard.press(back ? "Shift+Tab" : "Tab");
    if (want(await focused(p))) return;
  }
  throw new Error(`no Tab stop matched within ${max} presses (last: ${JSON.stringify(await focused(p))})`);
}

const savedGraph = async () => {
  const r = await testDb("linkages as l").join("linkage_revisions as r", function () { this.on("r.linkage_id", "l.id").andOn("r.revision", "l.current_revision"); }).where("l.id", linkageId).first("r.graph");
  return r.graph as LinkageGraph;
};

beforeAll(async () => {
  browser = await launchBrowser();
  const owner = await makeUser("e2e-keyboard");
  const b = await makeBuild({ owner });
  linkageId = b.linkageId;
  buildId = b.buildId;
  url = `${APP_URL}/builds/${b.buildId}/linkages/${b.linkageId}`;
  page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
  page.on("pageerror", (e) => errors.push(String(e)));
  await signInPage(page, owner.email, TEST_PASSWORD);
});
afterAll(async () => { await browser?.close(); await testDb.destroy(); });

describe("the editor by keyboard only", () => {
  it("adds three parts, joins them, fills a joint's card and sees its findings change, moves a part", async () => {
    await openEditor(page, url);
    // Three parts from the tray: Tab to each kind's button, Enter places it in view (and selects it).
    for (const kind of ["stick", "pushrod", "controlHorn"]) {
      await tabTo(page, (f) => f.id === `tray-${kind}`);
      await page.keyboard.press("Enter");
    }
    await expect.poll(() => page.locator(".react-flow__node").count()).toBe(3);
    const ids = await page.locator(".react-flow__node").evaluateAll((els) => els.map((e) => e.getAttribute("data-id")!));
    const [stick, pushrod, horn] = ids;

    // The horn is selected (just placed): J opens the keyboard join; its attach port to the pushrod's B end.
    await page.keyboard.press("j");
    await page.getByTestId("join-dialog").waitFor();
    expect((await focused(page)).id).toBe("join-port");
    // Tab stays inside the dialog: Shift+Tab from its first control goes round to its last, Tab back to the first.
    await page.keyboard.press("Shift+Tab");
    expect(await page.evaluate(() => document.activeElement?.getAttribute("data-testid"))).toBe("join-confirm");
    await page.keyboard.press("Tab");
    expect((await focused(page)).id).toBe("join-port");
    await page.keyboard.type("a"); // the port list: "attach — free"
    await page.keyboard.press("Tab");
    await page.keyboard.type("Pushrod 1 B");
    await page.keyboard.press("Tab");
    expect((await focused(page)).id).toBe("join-target");
    await shot(page, "keyboard-01-join");
    await page.keyboard.press("Enter");
    await expect.poll(() => page.locator(".react-flow__edge").count()).toBe(1);
    // The new joint's card opens with the focus on its heading.
    await page.getByTestId("joint-card").waitFor();
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("editor-card-title");
    expect(await page.getByTestId("joint-card").textContent()).toContain("Control horn 1, attach ↔ Pushrod 1 B");
    // On the canvas the joint is named as everywhere else, not React Flow's "Edge from <id> to <id>".
    const edgeLabel = await page.locator(".react-flow__edge").first().getAttribute("aria-label");
    expect(edgeLabel).toMatch(/^Joint Control horn 1, attach ↔ Pushrod 1 B, (no findings|\d+ findings?|1 \w+)/);
    expect(edgeLabel).not.toMatch(/Edge from/);

    // Escape goes back to the joint on the canvas; Shift+Tab to the stick (the run's input, read first along the run),
    // Enter opens it, Escape back, J joins it.
    await page.keyboard.press("Escape");
    expect((await focused(page)).kind).toBe("joint");
    await tabTo(page, (f) => f.kind === "part" && f.id === stick, 20, true);
    await page.keyboard.press("Enter");
    await page.getByTestId("node-form-panel").waitFor();
    await page.keyboard.press("Escape");
    expect(await focused(page)).toMatchObject({ kind: "part", id: stick });
    await page.keyboard.press("j");
    await page.getByTestId("join-dialog").waitFor();
    await page.keyboard.type("a"); // "attach — free"
    await page.keyboard.press("Tab");
    await page.keyboard.type("Pushrod 1 A");
    await page.keyboard.press("Tab");
    await page.keyboard.press("Enter");
    await expect.poll(() => page.locator(".react-flow__edge").count()).toBe(2);
    await page.getByTestId("joint-card").waitFor();
    expect(await page.getByTestId("joint-card").textContent()).toContain("Control stick 1, attach ↔ Pushrod 1 A");

    // Fill a hardware field: "Turns on" a plain bushing. The "no hardware recorded" caution of this joint clears,
    // and the live region says so.
    const jointId = (await savedGraphAfterSave()).joints.find((j) => j.from.node === stick || j.to.node === stick)!.id;
    const before = await page.getByTestId("joint-card").getByTestId("subject-findings").textContent();
    expect(before).toMatch(/no hardware recorded/);
    await tabTo(page, (f) => f.label === "Turns on", 80);
    await page.keyboard.type("plain");
    await expect.poll(() => page.getByTestId("joint-card").textContent(), { timeout: 10_000 }).not.toMatch(/no hardware recorded/);
    await expect.poll(() => page.getByTestId("findings-announcer").textContent()).toMatch(/cleared: \d/);
    await shot(page, "keyboard-02-card-filled");
    await page.keyboard.press("Escape");
    expect(await focused(page)).toMatchObject({ kind: "joint", id: jointId });

    // Arrow keys move the selected part one grid step; each press is its own undo step.
    await tabTo(page, (f) => f.kind === "part" && f.id === horn, 20);
    await page.keyboard.press("Enter");
    await page.keyboard.press("Escape");
    const p0 = (await savedGraphAfterSave()).nodes.find((n) => n.id === horn)!.position;
    await page.keyboard.press("ArrowRight");
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("Control+z");
    const p1 = (await savedGraphAfterSave()).nodes.find((n) => n.id === horn)!.position;
    expect(p1).toEqual({ x: p0.x + 10, y: p0.y });
    expect((await savedGraph()).joints.map((j) => [j.from.node, j.to.node].sort().join("|")).sort()).toEqual([[horn, pushrod].sort().join("|"), [pushrod, stick].sort().join("|")].sort());
    await shot(page, "keyboard-03-done");

    // L switches to the list and back: the focus goes with the selected part, never to the page.
    expect(await focused(page)).toMatchObject({ kind: "part", id: horn });
    await page.keyboard.press("l");
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute("data-run-item"))).toBe(`node:${horn}`);
    await page.keyboard.press("l");
    await expect.poll(async () => (await focused(page)).id).toBe(horn);
    expect((await focused(page)).kind).toBe("part");

    // The Keys sheet keeps Tab inside itself while open; Escape closes it and gives the focus back to "Keys ?".
    await page.getByTestId("btn-shortcuts").focus();
    await page.keyboard.press("Enter");
    await page.getByTestId("shortcuts-sheet").waitFor();
    for (const key of ["Tab", "Tab", "Shift+Tab", "Shift+Tab", "Shift+Tab"]) {
      await page.keyboard.press(key);
      expect(await page.evaluate(() => !!document.activeElement?.closest("[data-testid=shortcuts-sheet]"))).toBe(true);
    }
    await page.keyboard.press("Escape");
    await expect.poll(() => page.getByTestId("shortcuts-sheet").count()).toBe(0);
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute("data-testid"))).toBe("btn-shortcuts");
    expect(errors).toEqual([]);
  }, 120_000);

  it("Tab on the canvas goes along the run (as the list view reads it), bringing each item into view, then on out of the canvas; Shift+Tab comes back in at the run's end", async () => {
    const graph = demoPitchLinkage();
    const [l] = await testDb("linkages").insert({ build_id: buildId, name: "Tab along the run", system: "pitch", current_revision: 1 }).returning("id");
    await testDb("linkage_revisions").insert({ linkage_id: l.id, revision: 1, graph: JSON.stringify(graph) });
    await openEditor(page, `${APP_URL}/builds/${buildId}/linkages/${l.id}`);
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    const onCanvas = (f: Awaited<ReturnType<typeof focused>>) => f.kind === "part" || f.kind === "joint";
    const key = (f: Awaited<ReturnType<typeof focused>>) => `${f.kind === "part" ? "node" : "joint"}:${f.id}`;
    /** Press a key and wait until the focus has moved (an item out of view takes the focus once it is drawn). */
    const pressAndMove = async (k: string) => {
      const before = JSON.stringify(await focused(page));
      await page.keyboard.press(k);
      await expect.poll(async () => JSON.stringify(await focused(page)), { timeout: 3000 }).not.toBe(before);
      return focused(page);
    };
    await tabTo(page, onCanvas);
    const want = runOrder(graph).map((it) => `${it.type}:${it.id}`);
    const seen: string[] = [];
    let f = await focused(page);
    while (onCanvas(f) && seen.length <= want.length) {
      seen.push(key(f));
      f = await pressAndMove("Tab");
    }
    expect(want.length).toBeGreaterThan(15);
    expect(seen).toEqual(want);
    // Past the run's end the focus left the canvas's parts and joints for the next Tab stop, and Shift+Tab comes back at the end.
    expect(onCanvas(f)).toBe(false);
    f = await pressAndMove("Shift+Tab");
    expect(key(f)).toBe(want.at(-1));
    f = await pressAndMove("Shift+Tab");
    expect(key(f)).toBe(want.at(-2));
    expect(errors).toEqual([]);
  }, 120_000);

  it("every Tab stop of the editor shows where the focus is", async () => {
    await openEditor(page, url);
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    const problems: string[] = [];
    const seen = new Set<string>();
    for (let i = 0; i < 70; i++) {
      await page.keyboard.press("Tab");
      const el = await page.evaluateHandle(() => document.activeElement as HTMLElement);
      const f = await focused(page);
      if (f.kind === "body") break;
      const key = `${f.kind}:${f.id}:${f.text}`;
      if (seen.has(key)) break; // wrapped round
      seen.add(key);
      const box = await el.evaluate((e) => {
        const r = e.getBoundingClientRect();
        return { x: r.x, y: r.y, width: r.width, height: r.height };
      });
      if (box.width === 0 || box.height === 0) {
        problems.push(`${key}: no box`);
        continue;
      }
      const pad = 8;
      const x = Math.max(0, box.x - pad), y = Math.max(0, box.y - pad);
      const clip = { x, y, width: Math.min(1440 - x, box.width + 2 * pad), height: Math.min(900 - y, box.height + 2 * pad) };
      if (clip.width <= 0 || clip.height <= 0) {
        problems.push(`${key}: off screen`);
        continue;
      }
      const on = await page.screenshot({ clip });
      await el.evaluate((e) => e.blur());
      const off = await page.screenshot({ clip });
      await el.evaluate((e) => e.focus());
      if (on.equals(off)) problems.push(`${key}: looks the same focused and unfocused`);
    }
    expect(seen.size).toBeGreaterThan(30);
    // The canvas's parts and joints are among the stops.
    expect([...seen].some((k) => k.startsWith("part:"))).toBe(true);
    expect([...seen].some((k) => k.startsWith("joint:"))).toBe(true);
    expect(problems).toEqual([]);
  }, 120_000);
});

/** The saved graph once the autosave has caught up. */
async function savedGraphAfterSave() {
  await waitSaved(page);
  return savedGraph();
}
