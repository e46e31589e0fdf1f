import { open, audit, B } from "./helper-lib.tmp.mjs";
const [email, pw, tag] = process.argv.slice(2);
const { browser, page } = await open({ email, pw });
const BU = "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20";
const pages = ["/builds", BU, BU + "/log", BU + "/files", BU + "/hardware", BU + "/parts", BU + "/checklist", BU + "/members", BU + "/settings", BU + "/activity", "/account", "/parts", "/builds/new", BU + "/checklist/f24006fb-7d9b-45b1-a88b-13cecd0c656a", BU + "/linkages/f24006fb-7d9b-45b1-a88b-13cecd0c656a"];
for (const p of pages) {
  const r = await page.goto(B + p, { waitUntil: "networkidle" });
  await page.waitForTimeout(800);
  console.log("HTTP", r.status());
  await audit(page, tag);
  const name = p.replace(BU, "build").replace(/[\/]/g, "_").replace(/f24006fb[^_]*/, "L");
  await page.screenshot({ path: `/tmp/lw/${tag}${name}.png`, fullPage: true });
}
await browser.close();
