import { open, audit, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "dana@demo.linkwright.test", pw: "larkspur-builder" });
for (const p of ["/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20", "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/parts", "/parts"]) {
await page.goto(B + p, { waitUntil: "networkidle" });
await page.screenshot({ path: `/tmp/lw/view${p.replace(/\//g,"_")}.png` });
const r = await page.evaluate(() => {
  const W = 390; const out = [];
  for (const el of document.querySelectorAll("main *, main")) {
    const r = el.getBoundingClientRect();
    if (r.width > W + 2) out.push(`${el.tagName}.${String(el.className).slice(0,80)} w=${Math.round(r.width)} sw=${el.scrollWidth} ovx=${getComputedStyle(el).overflowX}`);
  }
  return out.slice(0, 12);
});
console.log(p, "\n  " + r.join("\n  "));
}
await browser.close();
