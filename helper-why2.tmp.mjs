import { open, audit, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder" });
await page.goto(B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/parts", { waitUntil: "networkidle" });
const r = await page.evaluate(() => {
  const out = [];
  for (const el of document.querySelectorAll("body *")) {
    const r = el.getBoundingClientRect();
    if (r.right > 392) out.push(`${el.tagName}.${String(el.className).slice(0,60)} L${Math.round(r.left)} R${Math.round(r.right)} ovx=${getComputedStyle(el).overflowX} pos=${getComputedStyle(el).position}`);
  }
  return [document.documentElement.scrollWidth, out.slice(0, 15)];
});
console.log(r);
await page.screenshot({ path: "/tmp/lw/view-parts.png" });
await browser.close();
