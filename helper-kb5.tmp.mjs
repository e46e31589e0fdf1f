import { open, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder", phone: false });
const L = B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/linkages/2b0de79f-ace0-4e44-88d3-aa5a9321e01a";
await page.goto(L, { waitUntil: "networkidle" }); await page.waitForTimeout(1500);
const act = () => page.evaluate(() => { const e = document.activeElement; return e.tagName + " " + (e.getAttribute("aria-label") || e.name || e.textContent).slice(0, 50) + (e.closest("[role=dialog]") ? " (in dialog)" : " (outside)"); });
await page.getByRole("button", { name: "Keys ?" }).focus();
await page.keyboard.press("Enter"); await page.waitForTimeout(400);
const d = page.locator("[role=dialog]");
console.log("dialog attrs", await d.evaluate(e => ({ modal: e.getAttribute("aria-modal"), tag: e.tagName, open: e.open, sh: e.scrollHeight, ch: e.clientHeight, inert: [...document.body.children].map(c => c.inert) })));
await page.keyboard.press("Escape"); await page.waitForTimeout(300);
console.log("after immediate Esc:", await act());
await page.keyboard.press("Enter"); await page.waitForTimeout(400);
for (let i = 0; i < 3; i++) { await page.keyboard.press("Tab"); console.log("tab", i, await act()); }
// scrolling the sheet by keyboard
await page.keyboard.press("Shift+Tab"); await page.keyboard.press("Shift+Tab"); await page.keyboard.press("Shift+Tab");
console.log("back", await act());
const before = await d.evaluate(e => { let s = e; while (s && s.scrollHeight <= s.clientHeight) s = s.parentElement; return s ? s.scrollTop : -1; });
await page.keyboard.press("ArrowDown"); await page.keyboard.press("ArrowDown"); await page.keyboard.press("PageDown"); await page.waitForTimeout(300);
const after = await d.evaluate(e => { let s = e; while (s && s.scrollHeight <= s.clientHeight) s = s.parentElement; return s ? [s.tagName, s.scrollTop, s.scrollHeight, s.clientHeight] : -1; });
console.log("scroll before", before, "after", after);
await browser.close();
