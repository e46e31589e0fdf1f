import { open, B } from "./helper-lib.tmp.mjs";
const [email, pw, path, n = "60", tag = "kb"] = process.argv.slice(2);
const { browser, page } = await open({ email, pw, phone: false });
await page.goto(B + path, { waitUntil: "networkidle" }); await page.waitForTimeout(1200);
const seen = [];
for (let i = 0; i < Number(n); i++) {
  await page.keyboard.press("Tab");
  const f = await page.evaluate(() => {
    const e = document.activeElement; if (!e || e === document.body) return null;
    const cs = getComputedStyle(e); const r = e.getBoundingClientRect();
    const vis = (cs.outlineStyle !== "none" && parseFloat(cs.outlineWidth) > 0) || (cs.boxShadow && cs.boxShadow !== "none");
    const inView = r.bottom > 0 && r.top < innerHeight && r.right > 0 && r.left < innerWidth;
    return `${e.tagName}${e.type ? "[" + e.type + "]" : ""} "${(e.getAttribute("aria-label") || e.textContent || e.name || e.placeholder || "").trim().replace(/\s+/g, " ").slice(0, 45)}" ${vis ? "" : "NOFOCUSRING(" + cs.outlineStyle + "/" + cs.boxShadow.slice(0, 20) + ")"} ${inView ? "" : "OFFSCREEN"} ${r.width < 2 || r.height < 2 ? "TINY" : ""}`;
  });
  seen.push(`${i + 1}: ${f}`);
}
console.log(seen.join("\n"));
await page.screenshot({ path: `/tmp/lw/${tag}.png` });
await browser.close();
