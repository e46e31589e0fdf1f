import { open, audit, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder" });
const L = B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/linkages/2b0de79f-ace0-4e44-88d3-aa5a9321e01a";
await page.goto(L, { waitUntil: "networkidle" }); await page.waitForTimeout(1500);
// findings panel
const f = await page.evaluate(() => [...document.querySelectorAll("*")].filter(e => /FINDINGS/i.test(e.textContent) && e.children.length < 3).map(e => e.tagName + ":" + e.textContent.slice(0, 60)).slice(0, 5));
console.log(f);
const hz = await page.locator("text=/hazard/i").allTextContents(); console.log(hz.slice(0, 20));
await page.locator('[data-run-item="joint:j-aft-horn"]').tap();
await page.waitForTimeout(1000);
console.log("scrollY", await page.evaluate(() => scrollY), "active", await page.evaluate(() => document.activeElement?.outerHTML.slice(0, 120)));
await page.screenshot({ path: "/tmp/lw/ed-joint-tap.png" });
await page.screenshot({ path: "/tmp/lw/ed-joint-full.png", fullPage: true });
await audit(page, "joint card");
await browser.close();
