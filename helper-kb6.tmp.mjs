import { open, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder", phone: false });
const BU = B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20";
const L = BU + "/linkages/2b0de79f-ace0-4e44-88d3-aa5a9321e01a";
const act = () => page.evaluate(() => { const e = document.activeElement; const cs = getComputedStyle(e); return e.tagName + " " + (e.getAttribute("aria-label") || e.name || e.textContent).trim().slice(0, 50) + ` [ring ${cs.outlineStyle}${cs.boxShadow !== "none" ? "+shadow" : ""}]`; });
await page.goto(L, { waitUntil: "networkidle" }); await page.waitForTimeout(1500);
await page.locator('.react-flow__edge[data-id="j-aft-horn"]').focus();
await page.keyboard.press("Enter"); await page.waitForTimeout(500);
// tab to part number
for (let i = 0; i < 14; i++) await page.keyboard.press("Tab");
console.log("at", await act());
await page.keyboard.press("Control+a"); await page.keyboard.type("LW-SRE4M-LH2");
await page.keyboard.press("Control+s"); await page.waitForTimeout(1500);
console.log("status", await page.locator("text=/All changes saved|Unsaved|Saving/").allTextContents());
await page.keyboard.press("Escape"); await page.waitForTimeout(300);
console.log("after Esc", await act());
await page.keyboard.press("Escape"); await page.waitForTimeout(300);
console.log("after Esc2", await act());
await page.keyboard.press("l"); await page.waitForTimeout(600);
console.log("after L", await act(), "list items", await page.locator("[data-run-item]").count());
await page.screenshot({ path: "/tmp/lw/kb-list.png" });
// Hardware list by keyboard: go to the first state select
await page.goto(BU + "/hardware", { waitUntil: "networkidle" }); await page.waitForTimeout(800);
let found = false;
for (let i = 0; i < 40; i++) { await page.keyboard.press("Tab"); const a = await act(); if (/^SELECT State of/.test(a)) { console.log("hw reached in", i + 1, a); found = true; break; } }
if (found) { await page.keyboard.press("ArrowDown"); await page.waitForTimeout(1200); console.log("hw after ArrowDown", await act(), await page.evaluate(() => document.activeElement.value)); await page.screenshot({ path: "/tmp/lw/kb-hw.png" }); }
// Column sort buttons
await page.keyboard.press("Shift+Tab");
// checklist: tick by Space
await page.goto(BU + "/checklist/2b0de79f-ace0-4e44-88d3-aa5a9321e01a", { waitUntil: "networkidle" }); await page.waitForTimeout(800);
for (let i = 0; i < 30; i++) { await page.keyboard.press("Tab"); const a = await act(); if (/^INPUT/.test(a)) { console.log("ck reached", i + 1, a); break; } }
await page.keyboard.press("Tab"); console.log("ck next", await act());
await page.keyboard.press("Shift+Tab");
await page.keyboard.press("Space"); await page.waitForTimeout(1000);
console.log("ck checked", await page.evaluate(() => document.activeElement.checked), await act());
await page.screenshot({ path: "/tmp/lw/kb-ck.png" });
await browser.close();
