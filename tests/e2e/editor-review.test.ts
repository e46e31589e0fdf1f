/**
 * The editor for a reviewer and for the builder's records, in Debian Chromium at 1440 × 900:
 * the reviewer (Sam) opens the demo linkage from a deep link, can select and inspect but not change it
 * (the server's graph is compared before and after), sees SI units after switching the preference;
 * the builder (Dana) imports a linkage file (a bad one is refused with its errors), attaches and removes
 * a joint photo, takes a suggested rod end from the build's library, and keeps the picture of the
 * revision for the build log (checked through the API and the database).
 * Screenshots: tests/artifacts/editor-review-*.png.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import sharp from "sharp";
import { APP_URL, launchBrowser, shot, signInPage } from "../support/browser";
import { openEditor as open, waitSaved } from "../support/editor-page";
import { signIn, type Client } from "../support/http";
import { testDb } from "../support/db";
import { testImage } from "../support/upload";
import { DEMO_BUILD, DEMO_USERS } from "@/db/demo-accounts";
import { demoPitchLinkage, DEMO_WRONG_JOINT } from "@/shared/demo";
import { serializeLinkage } from "@/shared/linkage/io";
import { EXPORT_SIZE } from "@/editor/export";
import { READABLE_ZOOM } from "@/editor/view";
import { cardSize } from "@/editor/nodes";
import { portBoxes } from "@/editor/nodes/geometry";

const dana = DEMO_USERS[0];
const sam = DEMO_USERS[1];
const VIEW = { width: 1440, height: 900 };
let browser: Browser;
let samPage: Page;
let danaPage: Page;
let samApi: Client;
let danaApi: Client;
let buildId = "";
let demoLinkageId = "";
const errors: string[] = [];

const editorUrl = (linkageId: string, query = "") => `${APP_URL}/builds/${buildId}/linkages/${linkageId}${query}`;
const graphPath = (linkageId: string) => `/api/builds/${buildId}/linkages/${linkageId}/graph`;

const zoomOf = (p: Page) =>
  p.evaluate(() => {
    const t = (document.querySelector(".react-flow__viewport") as HTMLElement).style.transform;
    return Number(/scale\(([\d.]+)\)/.exec(t)?.[1] ?? NaN);
  });

beforeAll(async () => {
  const build = await testDb("builds").where({ name: DEMO_BUILD.name }).orderBy("created_at").first("id");
  buildId = build.id;
  const l = await testDb("linkages").where({ build_id: buildId, name: demoPitchLinkage().name }).orderBy("created_at").first("id");
  demoLinkageId = l.id;
  samApi = await signIn(sam.email, sam.password);
  danaApi = await signIn(dana.email, dana.password);
  expect((await samApi.request("PATCH", "/api/me", { unitSystem: "US" })).status).toBe(200);

  browser = await launchBrowser();
  samPage = await (await browser.newContext({ viewport: VIEW })).newPage();
  danaPage = await (await browser.newContext({ viewport: VIEW })).newPage();
  for (const p of [samPage, danaPage]) p.on("pageerror", (e) => errors.push(String(e)));
  await signInPage(samPage, sam.email, sam.password);
  await signInPage(danaPage, dana.email, dana.password);
});
afterAll(async () => {
  await samApi?.request("PATCH", "/api/me", { unitSystem: "US" });
  await browser?.close();
  await testDb.destroy();
});

describe("the reviewer in the editor", () => {
  let before: { revision: number; graph: unknown };

  it("opens readable at 1440 × 900, and a ?select= deep link selects and centres the joint", async () => {
    before = (await samApi.request("GET", graphPath(demoLinkageId))).body;
    await open(samPage, editorUrl(demoLinkageId));
    expect(await zoomOf(samPage)).toBeGreaterThanOrEqual(READABLE_ZOOM);
    // The 12 px part labels are at least ~9.5 px on screen.
    const labelPx = await samPage.getByTestId("node-stick").evaluate((el) => el.querySelector("[title]")!.getBoundingClientRect().height);
    expect(labelPx).toBeGreaterThanOrEqual(12);
    // The editor fits the window under the header and the review strip: nothing scrolls off the bottom.
    expect(await samPage.evaluate(() => document.documentElement.scrollHeight - window.innerHeight)).toBeLessThanOrEqual(0);
    await shot(samPage, "editor-review-01-opened");

    await open(samPage, editorUrl(demoLinkageId, "?select=j-stick-fwd"));
    const card = samPage.getByTestId("joint-card");
    await card.waitFor();
    expect(await card.textContent()).toContain("Control stick, attach ↔ Forward pushrod A");
    const badge = await samPage.getByTestId("joint-j-stick-fwd").boundingBox();
    const c = await samPage.getByTestId("canvas").boundingBox();
    expect(Math.abs(badge!.x + badge!.width / 2 - (c!.x + c!.width / 2))).toBeLessThan(40);
    expect(Math.abs(badge!.y + badge!.height / 2 - (c!.y + c!.height / 2))).toBeLessThan(40);
    await shot(samPage, "editor-review-02-deep-link-select");
  });

  it("lays out every part card and port where editor/nodes/geometry.ts computes them (parts out of view are drawn from those numbers)", async () => {
    await open(samPage, editorUrl(demoLinkageId));
    const graph = demoPitchLinkage();
    const measured = await samPage.evaluate(() => {
      const t = (document.querySelector(".react-flow__viewport") as HTMLElement).style.transform;
      const zoom = Number(/scale\(([\d.]+)\)/.exec(t)?.[1] ?? NaN);
      return Array.from(document.querySelectorAll<HTMLElement>(".react-flow__node")).map((el) => {
        const r = el.getBoundingClientRect();
        return {
          id: el.dataset.id!,
          width: el.offsetWidth,
          height: el.offsetHeight,
          ports: Array.from(el.querySelectorAll<HTMLElement>(".react-flow__handle")).map((h) => {
            const b = h.getBoundingClientRect();
            return { id: h.dataset.handleid!, x: (b.left - r.left) / zoom, y: (b.top - r.top) / zoom, width: b.width / zoom, height: b.height / zoom };
          }),
        };
      });
    });
    expect(measured.length).toBe(graph.nodes.length);
    for (const m of measured) {
      const n = graph.nodes.find((x) => x.id === m.id)!;
      const size = cardSize(n);
      expect({ id: m.id, width: m.width, height: m.height }).toEqual({ id: m.id, ...size });
      const boxes = portBoxes(n.kind, size);
      expect(m.ports.map((p) => p.id).sort()).toEqual(boxes.map((b) => b.id).sort());
      for (const p of m.ports) {
        const b = boxes.find((x) => x.id === p.id)!;
        for (const k of ["x", "y", "width", "height"] as const) expect(Math.abs(p[k] - b[k]), `${m.id}.${p.id}.${k}`).toBeLessThan(0.6);
      }
    }
  });

  it("a ?focus=joint: link from review e-mail opens that joint with its thread; an unknown one says so", async () => {
    await open(samPage, editorUrl(demoLinkageId, `?focus=joint:${DEMO_WRONG_JOINT}`));
    await samPage.getByTestId("joint-card").waitFor();
    await samPage.locator(`[data-testid=review-thread][data-subject="joint:${DEMO_WRONG_JOINT}"]`).waitFor();
    await open(samPage, editorUrl(demoLinkageId, "?focus=node:no-such-part"));
    await expect.poll(() => samPage.getByTestId("notice").textContent()).toMatch(/part no-such-part, which is not in revision/);
  });

  it("acknowledging by keyboard: the reason box takes the focus, Escape closes it (not the card) back to its button, and once recorded the focus is on Withdraw", async () => {
    await open(samPage, editorUrl(demoLinkageId, `?focus=joint:${DEMO_WRONG_JOINT}`));
    await samPage.getByTestId("joint-card").waitFor();
    const opener = samPage.locator("[data-testid^=ack-open-]").first();
    await opener.waitFor();
    const code = (await opener.getAttribute("data-testid"))!.slice("ack-open-".length);
    const focused = () => samPage.evaluate(() => document.activeElement?.getAttribute("data-testid") ?? null);
    await opener.focus();
    await samPage.keyboard.press("Enter");
    await expect.poll(focused).toBe(`ack-reason-${code}`);
    expect(await opener.getAttribute("aria-expanded")).toBe("true");
    await samPage.keyboard.press("Escape");
    await expect.poll(focused).toBe(`ack-open-${code}`);
    expect(await samPage.getByTestId(`ack-reason-${code}`).count()).toBe(0);
    expect(await samPage.getByTestId("joint-card").count()).toBe(1); // the card stays open
    await samPage.keyboard.press("Enter");
    await expect.poll(focused).toBe(`ack-reason-${code}`);
    await samPage.keyboard.type("Checked against the part's tested rating (keyboard test)");
    await samPage.keyboard.press("Tab");
    expect(await focused()).toBe(`ack-submit-${code}`);
    await samPage.keyboard.press("Enter");
    await expect.poll(focused).toBe(`ack-withdraw-${code}`);
    // Withdrawn again, so the demo's review state is as it was.
    await samPage.keyboard.press("Enter");
    await samPage.getByTestId(`ack-open-${code}`).waitFor();
  });

  it("on a 390 px phone (the run as a list) a ?select= and a ?focus= link open that joint's card in view; a tap goes back to the whole linkage", async () => {
    const phone = await (await browser.newContext({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true })).newPage();
    phone.on("pageerror", (e) => errors.push(String(e)));
    try {
      await signInPage(phone, sam.email, sam.password);
      for (const q of ["?select=j-stick-fwd", `?focus=joint:${DEMO_WRONG_JOINT}`]) {
        await phone.goto(editorUrl(demoLinkageId, q));
        await phone.locator("[data-testid=linkage-editor][data-view=list]").waitFor({ timeout: 60_000 });
        const card = phone.getByTestId("joint-card");
        await card.waitFor();
        const want = q.includes("focus") ? DEMO_WRONG_JOINT : "j-stick-fwd";
        await expect.poll(() => phone.evaluate(() => document.activeElement?.getAttribute("data-subject"))).toBe(`joint:${want}`);
        // The card's title is on screen, not below the list.
        const t = (await phone.evaluate(() => document.activeElement!.getBoundingClientRect().toJSON())) as DOMRect;
        expect(t.top).toBeGreaterThanOrEqual(0);
        expect(t.bottom).toBeLessThanOrEqual(844);
      }
      await shot(phone, "editor-review-02b-phone-deep-link");

      // The reviewer's buttons on the joint's card are big enough to tap.
      const tall = (testId: string) => phone.locator(`[data-testid^="${testId}"]`).first().evaluate((el) => el.getBoundingClientRect().height);
      await phone.locator("[data-testid^=ack-open-]").first().waitFor();
      expect(await tall("ack-open-")).toBeGreaterThanOrEqual(24);
      expect(await tall("comment-submit")).toBeGreaterThanOrEqual(24);
      // A tap takes the card panel back to the whole linkage (its sign-off and comments), the focus on its heading.
      const back = phone.getByTestId("card-close");
      expect((await back.textContent())?.trim()).toMatch(/Back to the whole linkage/);
      expect(await tall("card-close")).toBeGreaterThanOrEqual(24);
      await back.tap();
      await phone.getByTestId("linkage-overview").waitFor();
      expect(await phone.getByTestId("joint-card").count()).toBe(0);
      await phone.locator(`[data-testid=review-thread][data-subject="linkage:${demoLinkageId}"]`).waitFor();
      await expect.poll(() => phone.evaluate(() => document.activeElement?.getAttribute("data-subject"))).toBe("linkage");
      expect(await tall("signoff-submit")).toBeGreaterThanOrEqual(24);
      await shot(phone, "editor-review-02c-phone-back-to-linkage");
    } finally {
      await phone.context().close();
    }
  });

  it("can select and inspect, but Delete, Backspace, nudge, paste, undo and dragging change nothing", async () => {
    await open(samPage, editorUrl(demoLinkageId));
    expect(await samPage.getByTestId("parts-tray").count()).toBe(0);
    expect(await samPage.getByTestId("btn-keep-picture").count()).toBe(0);
    await expect(samPage.getByTestId("save-status").getAttribute("data-status")).resolves.toBe("readonly");
    const edges = await samPage.locator(".react-flow__edge").count();

    await samPage.getByTestId("joint-j-stick-fwd").click();
    await samPage.getByTestId("joint-card").waitFor();
    // The card is there to read: its fields are disabled.
    await expect(samPage.getByTestId("joint-form-rodEnd__ballBore").isDisabled()).resolves.toBe(true);
    await expect(samPage.getByTestId("joint-form-jamNut__fitted").isDisabled()).resolves.toBe(true);
    for (const key of ["Delete", "Backspace", "Control+x", "Control+z"]) await samPage.keyboard.press(key);

    const node = samPage.getByTestId("node-bellcrank");
    await node.click();
    await samPage.getByTestId("node-form-panel").waitFor();
    const offset = async () => (await node.boundingBox())!.x - (await samPage.getByTestId("node-stick").boundingBox())!.x;
    const offsetBefore = await offset();
    for (const key of ["ArrowRight", "Shift+ArrowDown", "Delete", "Control+c", "Control+v", "Control+d"]) await samPage.keyboard.press(key);
    const at = (await node.boundingBox())!;
    await samPage.mouse.move(at.x + at.width / 2, at.y + 10);
    await samPage.mouse.down();
    await samPage.mouse.move(at.x + at.width / 2 + 120, at.y + 90, { steps: 8 });
    await samPage.mouse.up();
    // A drag on a read-only canvas may pan the view; it never moves a card relative to the others.
    expect(Math.abs((await offset()) - offsetBefore)).toBeLessThan(1);
    expect(await samPage.locator(".react-flow__node").count()).toBe(demoPitchLinkage().nodes.length);
    expect(await samPage.locator(".react-flow__edge").count()).toBe(edges);
    await samPage.waitForTimeout(2500); // longer than the autosave quiet period

    const now = (await samApi.request("GET", graphPath(demoLinkageId))).body;
    expect(now.revision).toBe(before.revision);
    expect(now.graph).toEqual(before.graph);
    const positions = (now.graph as ReturnType<typeof demoPitchLinkage>).nodes.map((n) => [n.id, n.position.x, n.position.y]);
    expect(positions).toEqual(demoPitchLinkage().nodes.map((n) => [n.id, n.position.x, n.position.y]));
    await shot(samPage, "editor-review-03-read-only-after-keys");
  });

  it("shows the joint card in mm and N after switching to SI", async () => {
    expect((await samApi.request("PATCH", "/api/me", { unitSystem: "SI" })).status).toBe(200);
    await open(samPage, editorUrl(demoLinkageId, "?select=j-stick-fwd"));
    const card = samPage.getByTestId("joint-card");
    await card.waitFor();
    await expect(card.locator("label[for=joint-form-rodEnd__ballBore]").textContent()).resolves.toContain("(mm)");
    await expect(card.locator("label[for=joint-form-rodEnd__ratedUltimate]").textContent()).resolves.toContain("(N)");
    await expect(card.getByTestId("joint-form-rodEnd__ballBore").inputValue()).resolves.toBe("6.35"); // 0.25 in
    expect(Number(await card.getByTestId("joint-form-rodEnd__ratedUltimate").inputValue())).toBeCloseTo(4200 * 4.4482216, 0); // 4200 lbf
    await shot(samPage, "editor-review-04-si-units");
    // A finding's own sentence is in SI too (shared/units.ts measuresInText), not inches beside millimetres.
    await open(samPage, editorUrl(demoLinkageId, `?select=${DEMO_WRONG_JOINT}`));
    await samPage.getByTestId("joint-card").waitFor();
    await expect.poll(() => samPage.getByTestId("joint-card").innerText()).toContain("is 11.1 mm across, no larger than the 12.7 mm housing bore");
    expect(await samPage.locator("main").innerText()).not.toContain("0.438 in across");
    expect((await samApi.request("PATCH", "/api/me", { unitSystem: "US" })).status).toBe(200);
  });
});

describe("the builder's records from the editor", () => {
  let linkageId = "";
  const jointId = "j-stick-fwd";

  it("opens the demo run readable beside the parts tray, starting at the stick", async () => {
    await open(danaPage, editorUrl(demoLinkageId));
    expect(await zoomOf(danaPage)).toBeGreaterThanOrEqual(READABLE_ZOOM);
    const c = (await danaPage.getByTestId("canvas").boundingBox())!;
    const stick = (await danaPage.getByTestId("node-stick").boundingBox())!;
    expect(stick.x).toBeGreaterThanOrEqual(c.x);
    expect(stick.y).toBeGreaterThanOrEqual(c.y);
    expect(stick.y + stick.height).toBeLessThanOrEqual(c.y + c.height);
    await shot(danaPage, "editor-review-05-builder-opened");
    // At the readable zoom the surface end of the run is out of view, so those cards are not mounted; a
    // joint from a card in view to one out of view is drawn all the same (from the card layout), and F
    // brings every part into view.
    const mounted = new Set(await danaPage.locator(".react-flow__node").evaluateAll((els) => els.map((el) => (el as HTMLElement).dataset.id!)));
    expect(mounted.size).toBeLessThan(demoPitchLinkage().nodes.length);
    const crossing = demoPitchLinkage().joints.filter((j) => mounted.has(j.from.node) !== mounted.has(j.to.node));
    expect(crossing.length).toBeGreaterThan(0);
    for (const j of crossing) expect(await danaPage.locator(`.react-flow__edge[data-id="${j.id}"]`).count(), j.id).toBe(1);
    await danaPage.getByTestId("canvas").click({ position: { x: 5, y: 5 } });
    await danaPage.keyboard.press("f");
    await expect.poll(() => danaPage.locator(".react-flow__node").count()).toBe(demoPitchLinkage().nodes.length);
  });

  it("imports a linkage file; a bad file is refused with its errors and changes nothing", async () => {
    const r = await danaApi.request("POST", `/api/builds/${buildId}/linkages`, { name: `Records run ${Date.now().toString(36)}`, system: "pitch" });
    expect(r.status).toBe(201);
    linkageId = r.body.linkage.id;
    await open(danaPage, editorUrl(linkageId));
    const input = danaPage.getByTestId("import-input");

    await input.setInputFiles({ name: "broken.linkage.json", mimeType: "application/json", buffer: Buffer.from('{"formatVersion": 1, "nodes": "three", "joints": []') });
    const alert = danaPage.getByTestId("import-errors");
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/not imported.*broken\.linkage\.json/s);
    await input.setInputFiles({ name: "wrong.linkage.json", mimeType: "application/json", buffer: Buffer.from(JSON.stringify({ formatVersion: 1, name: "x", system: "pitch", nodes: [{ id: "a", kind: "wing" }], joints: [] })) });
    await expect.poll(() => alert.textContent()).toMatch(/wrong\.linkage\.json/);
    expect(await danaPage.locator(".react-flow__node").count()).toBe(0);
    await shot(danaPage, "editor-review-05b-import-refused");

    await input.setInputFiles({ name: "larkspur-pitch.linkage.json", mimeType: "application/json", buffer: Buffer.from(serializeLinkage(demoPitchLinkage())) });
    await expect.poll(() => danaPage.locator(".react-flow__node").count()).toBe(demoPitchLinkage().nodes.length);
    expect(await danaPage.getByTestId("import-errors").count()).toBe(0);
    await waitSaved(danaPage);
    const saved = (await danaApi.request("GET", graphPath(linkageId))).body;
    expect(saved.revision).toBe(2);
    expect(saved.graph.joints.map((j: { id: string }) => j.id)).toContain(jointId);
  });

  it("attaches a photo to the joint from its card, shows the thumbnail, and removes it", async () => {
    await open(danaPage, editorUrl(linkageId, `?select=${jointId}`));
    const card = danaPage.getByTestId("joint-card");
    await card.getByTestId("joint-evidence").waitFor();
    await card.getByLabel(/^Add a photo of the joint .+ ↔ .+/).setInputFiles({ name: "witness-hole.jpg", mimeType: "image/jpeg", buffer: await testImage("jpeg", 800, 600) });
    const thumb = card.getByTestId("joint-photo-thumb");
    await thumb.waitFor({ timeout: 15_000 });
    await thumb.scrollIntoViewIfNeeded(); // a lazy thumbnail loads once it is in view, as for a person scrolling the card
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(320);
    const rows = await testDb("joint_photos").where({ linkage_id: linkageId, joint_id: jointId });
    expect(rows).toHaveLength(1);
    await shot(danaPage, "editor-review-06-joint-photo");

    await card.getByTestId("joint-photo-remove").click();
    await expect.poll(() => card.getByTestId("joint-photo-thumb").count()).toBe(0);
    expect(await testDb("joint_photos").where({ linkage_id: linkageId, joint_id: jointId })).toHaveLength(0);
  });

  it("suggests library rod ends by margin, and using one fills the rod-end fields", async () => {
    const card = danaPage.getByTestId("joint-card");
    await card.getByTestId("btn-suggest-part").click();
    const rows = card.getByTestId("suggestion");
    await rows.first().waitFor({ timeout: 10_000 });
    const parts = await rows.evaluateAll((els) => els.map((e) => [e.getAttribute("data-part"), Number(e.getAttribute("data-margin"))] as const));
    // The demo build's library: two 1/4-28 RH rod ends fit (5200 and 3600 lbf, invented ratings); the LH one and the 5/16 one do not.
    expect(parts.map((p) => p[0])).toEqual(["LW-DEMO-RE4H-RH", "LW-DEMO-RE4-RH"]);
    expect(parts[0][1]).toBeGreaterThan(parts[1][1]);
    expect(await rows.first().getByTestId("suggestion-margin").textContent()).toMatch(/^\+\d+\.\d\d$/);
    expect(await card.getByTestId("suggest-required").textContent()).toMatch(/Needs \d+ lbf ultimate/);
    await shot(danaPage, "editor-review-07-suggestions");

    await rows.first().getByTestId("suggestion-use").click();
    await expect.poll(() => card.getByTestId("joint-form-rodEnd__ratedUltimate").inputValue()).toBe("5200");
    await expect(card.getByTestId("joint-form-rodEnd__thread").inputValue()).resolves.toBe("1/4-28");
    await expect(card.getByTestId("joint-form-rodEnd__hand").inputValue()).resolves.toBe("RH");
    await expect(card.getByTestId("joint-form-rodEnd__ballBore").inputValue()).resolves.toBe("0.25");
    await expect(danaPage.getByTestId("save-status").getAttribute("data-status")).resolves.toBe("unsaved");
  });

  it("keeps the picture with the revision for the build log, saving the unsaved change first", async () => {
    // By keyboard: the button stays focused while it works (aria-disabled, not disabled) and after.
    const focused = () => danaPage.evaluate(() => document.activeElement?.getAttribute("data-testid") ?? document.activeElement?.tagName);
    await danaPage.getByTestId("btn-keep-picture").focus();
    await danaPage.keyboard.press("Enter");
    const status = danaPage.getByTestId("picture-status");
    await expect.poll(() => status.getAttribute("data-phase"), { timeout: 30_000 }).not.toBe(null);
    expect(await focused()).toBe("btn-keep-picture");
    await expect.poll(() => status.getAttribute("data-phase"), { timeout: 30_000 }).toBe("kept");
    expect(await focused()).toBe("btn-keep-picture");
    // The chip fits the toolbar's row at 1440 px: "Keys ?" stays on the row of the picture buttons.
    const top = async (id: string) => (await danaPage.getByTestId(id).boundingBox())!.y;
    expect(Math.abs((await top("btn-shortcuts")) - (await top("btn-keep-picture")))).toBeLessThan(4);
    const revision = Number(await danaPage.getByTestId("editor-revision").textContent());
    expect(revision).toBe(3);
    expect(await status.textContent()).toContain(`Kept with revision ${revision}`);
    await shot(danaPage, "editor-review-08-picture-kept");

    // The saved revision carries the suggested part, and its picture is stored.
    const saved = (await danaApi.request("GET", `${graphPath(linkageId)}?revision=${revision}`)).body;
    const rodEnd = saved.graph.joints.find((j: { id: string }) => j.id === jointId).hardware.rodEnd;
    expect(rodEnd).toMatchObject({ partNumber: "LW-DEMO-RE4H-RH", ratedUltimate: 5200, thread: "1/4-28", hand: "RH" });
    const row = await testDb("revision_pictures").where({ linkage_id: linkageId, revision }).first();
    expect(row).toBeTruthy();
    const res = await fetch(`${APP_URL}/api/builds/${buildId}/linkages/${linkageId}/revisions/${revision}/picture`, { headers: { cookie: danaApi.cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("image/png");
    const meta = await sharp(Buffer.from(await res.arrayBuffer())).metadata();
    expect([meta.width, meta.height]).toEqual([EXPORT_SIZE.width, EXPORT_SIZE.height]);
    // The reviewer may look at it but not replace it.
    const refused = await fetch(`${APP_URL}/api/builds/${buildId}/linkages/${linkageId}/revisions/${revision}/picture`, { method: "POST", headers: { cookie: samApi.cookie, "content-type": "image/png" }, body: new Uint8Array(8) });
    expect(refused.status).toBe(403);
    expect(errors).toEqual([]);
  });
});
