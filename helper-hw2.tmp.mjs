import { open, audit, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder" });
await page.goto(B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/hardware", { waitUntil: "networkidle" }); await page.waitForTimeout(800);
await page.evaluate(() => { scrollTo(0, 250); document.querySelector("table").parentElement.scrollLeft = 400; }); await page.waitForTimeout(300);
await page.screenshot({ path: "/tmp/lw/hw-scrolled.png" });
console.log(await page.evaluate(() => [...document.querySelectorAll("table tbody tr:first-child td")].map(td => td.innerHTML.slice(0, 300))));
// the filter row at top
await page.evaluate(() => scrollTo(0, 0));
await page.screenshot({ path: "/tmp/lw/hw-top.png" });
await browser.close();
