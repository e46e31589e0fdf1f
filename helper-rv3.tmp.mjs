import { open, audit, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "sam@demo.linkwright.test", pw: "larkspur-reviewer" });
const L = B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/linkages/2b0de79f-ace0-4e44-88d3-aa5a9321e01a";
await page.goto(L, { waitUntil: "networkidle" }); await page.waitForTimeout(1500);
const sign = page.getByRole("button", { name: /Sign off/ });
console.log("sign-off initially:", await sign.count(), await sign.first().boundingBox());
await page.screenshot({ path: "/tmp/lw/rv-signoff-full.png", fullPage: true });
const it = page.locator('[data-run-item="joint:j-aft-horn"]');
await it.tap(); await page.waitForTimeout(600);
console.log("pressed attr", await it.getAttribute("aria-pressed"), await it.getAttribute("aria-current"), await it.getAttribute("aria-selected"));
await it.tap(); await page.waitForTimeout(600);
console.log("after second tap sign-off:", await sign.count());
// tap a blank area of the page
await page.touchscreen.tap(200, 830); await page.waitForTimeout(500);
console.log("after blank tap:", await sign.count());
// try the Escape key as fallback
await page.keyboard.press("Escape"); await page.waitForTimeout(500);
console.log("after Escape:", await sign.count());
await browser.close();
