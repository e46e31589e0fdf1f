import { open, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder", phone: false });
await page.goto(B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20", { waitUntil: "networkidle" }); await page.waitForTimeout(1000);
for (let i = 0; i < 16; i++) await page.keyboard.press("Tab");
console.log(await page.evaluate(() => { const e = document.activeElement; const l = e.closest("label") || e.labels?.[0]; return e.outerHTML.slice(0, 200) + " || label: " + (l ? l.className + " " + getComputedStyle(l).outlineStyle + " " + getComputedStyle(l).boxShadow : "none"); }));
const box = await page.locator("text=Import a file").first().boundingBox();
await page.screenshot({ path: "/tmp/lw/kb-import-focus.png", clip: { x: box.x - 200, y: box.y - 30, width: 500, height: 90 } });
await browser.close();
