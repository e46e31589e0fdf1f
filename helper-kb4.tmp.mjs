import { open, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder", phone: false });
const L = B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/linkages/2b0de79f-ace0-4e44-88d3-aa5a9321e01a";
await page.goto(L, { waitUntil: "networkidle" }); await page.waitForTimeout(1500);
const tab = async (k, sh) => { for (let i = 0; i < k; i++) await page.keyboard.press(sh ? "Shift+Tab" : "Tab"); };
const act = () => page.evaluate(() => { const e = document.activeElement; const cs = getComputedStyle(e); return e.tagName + " " + (e.getAttribute("aria-label") || e.name || e.textContent).slice(0, 60) + ` ring=${cs.outlineStyle}/${cs.boxShadow.slice(0,30)}`; });
// open Keys ?
await tab(15); console.log("focus", await act());
await page.keyboard.press("Enter"); await page.waitForTimeout(500);
console.log("dialog", await page.locator("[role=dialog]").count(), "focus", await act());
await page.screenshot({ path: "/tmp/lw/kb-keys.png" });
await tab(3); console.log("after 3 tabs in dialog", await act());
await page.keyboard.press("Escape"); await page.waitForTimeout(300);
console.log("after esc", await act(), "dialog", await page.locator("[role=dialog]").count());
// go to the hazard edge j-aft-horn: edges start at tab 34 from page start; from Keys (15) -> +19 + 5
await page.locator('.react-flow__edge[data-id="j-aft-horn"]').focus();
console.log("focus", await act());
await page.keyboard.press("Enter"); await page.waitForTimeout(600);
console.log("after Enter", await act());
const seq = [];
for (let i = 0; i < 30; i++) { await page.keyboard.press("Tab"); seq.push(await act()); }
console.log(seq.join("\n"));
await page.screenshot({ path: "/tmp/lw/kb-card-tab.png" });
await browser.close();
