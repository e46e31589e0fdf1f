import { open, audit, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder" });
await page.goto(B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/log", { waitUntil: "networkidle" }); await page.waitForTimeout(800);
const e = page.locator("article, li").filter({ hasText: "Jam nut at the horn" }).first();
await e.scrollIntoViewIfNeeded();
await e.screenshot({ path: "/tmp/lw/log-entry.png" });
console.log(await e.innerHTML().then(h => h.slice(0, 1500)));
await browser.close();
