import { open, B } from "./helper-lib.tmp.mjs";
const BU = B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20";
const L = BU + "/linkages/2b0de79f-ace0-4e44-88d3-aa5a9321e01a";
{
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder", phone: false });
const act = () => page.evaluate(() => { const e = document.activeElement; const cs = getComputedStyle(e); return e.tagName + " " + (e.getAttribute("aria-label") || e.name || e.textContent).trim().slice(0, 50) + ` [ring ${cs.outlineStyle}${cs.boxShadow !== "none" ? "+shadow" : ""}]`; });
await page.goto(BU + "/log", { waitUntil: "networkidle" }); await page.waitForTimeout(800);
for (let i = 0; i < 25; i++) { await page.keyboard.press("Tab"); const a = await act(); if (/New entry/.test(a)) { console.log("log: New entry at", i + 1); break; } }
await page.keyboard.press("Enter"); await page.waitForTimeout(400);
console.log("after Enter", await act());
await page.keyboard.press("Tab"); console.log("next", await act());
const seq = [];
for (let i = 0; i < 14; i++) { await page.keyboard.press("Tab"); seq.push(await act()); }
console.log(seq.join("\n"));
await page.keyboard.press("Escape"); await page.waitForTimeout(300);
console.log("Esc closes form?", await page.getByRole("button", { name: "Save entry" }).count());
await browser.close();
}
{
const { browser, page } = await open({ email: "sam@demo.linkwright.test", pw: "larkspur-reviewer", phone: false });
const act = () => page.evaluate(() => { const e = document.activeElement; const cs = getComputedStyle(e); return e.tagName + " " + (e.getAttribute("aria-label") || e.name || e.placeholder || e.textContent).trim().slice(0, 50) + ` [ring ${cs.outlineStyle}${cs.boxShadow !== "none" ? "+shadow" : ""}]`; });
await page.goto(L, { waitUntil: "networkidle" }); await page.waitForTimeout(1500);
let n = 0;
for (let i = 0; i < 60; i++) { await page.keyboard.press("Tab"); n++; const a = await act(); if (/pushrod-aft to horn/.test(a)) break; }
console.log("reviewer reached hazard joint in", n, await act());
await page.keyboard.press("Enter"); await page.waitForTimeout(500);
const seq = [];
for (let i = 0; i < 60; i++) { await page.keyboard.press("Tab"); const a = await act(); seq.push(a); if (/Comment on this joint/.test(a)) break; }
console.log("tabs to comment box:", seq.length, "\n  " + seq.filter(s => !/^INPUT v\.|^SELECT v\.|^INPUT on\./.test(s)).join("\n  "));
await page.keyboard.type("Keyboard review: please confirm washer size.");
await page.keyboard.press("Tab"); console.log("after comment Tab", await act());
await page.keyboard.press("Enter"); await page.waitForTimeout(1200);
console.log("after post", await act(), await page.locator("text=Keyboard review").count());
await page.keyboard.press("Escape"); await page.waitForTimeout(300); console.log("Esc1", await act());
await page.keyboard.press("Escape"); await page.waitForTimeout(300); console.log("Esc2", await act(), "signoff btn", await page.getByRole("button", { name: /Sign off/ }).count());
await page.screenshot({ path: "/tmp/lw/kb-rv.png" });
await browser.close();
}
