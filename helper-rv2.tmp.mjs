import { open, audit, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "sam@demo.linkwright.test", pw: "larkspur-reviewer" });
page.on("response", r => { if (r.status() >= 400) console.log("HTTP", r.status(), r.url()); });
const L = B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/linkages/2b0de79f-ace0-4e44-88d3-aa5a9321e01a";
await page.goto(L, { waitUntil: "networkidle" }); await page.waitForTimeout(1500);
await page.locator('[data-run-item="joint:j-aft-horn"]').tap(); await page.waitForTimeout(800);
// find the comment box for this joint
const ta = page.locator("textarea");
console.log("textareas", await ta.count(), await ta.evaluateAll(ts => ts.map(t => t.getAttribute("aria-label") || t.placeholder)));
const box = ta.nth(1);
await box.scrollIntoViewIfNeeded(); await page.evaluate(() => scrollBy(0, -250));
await page.screenshot({ path: "/tmp/lw/rv-comment-area.png" });
await box.tap(); await box.fill("Please confirm the jam nut torque-stripe at the horn rod end.");
await page.getByRole("button", { name: "Add comment" }).first().tap(); await page.waitForTimeout(1500);
await page.screenshot({ path: "/tmp/lw/rv-comment-posted.png" });
console.log("threads text", await page.locator("text=/open thread/").allTextContents());
// now try to get back to sign-off: look for a deselect control
const sign = page.getByRole("button", { name: /Sign off/ });
console.log("sign-off visible while joint selected:", await sign.count());
const cand = await page.$$eval("button, a", bs => bs.filter(b => /clear|deselect|close|back|whole linkage|linkage as a whole|done|×/i.test(b.textContent + (b.getAttribute("aria-label")||""))).map(b => b.textContent.trim().slice(0,40) + "|" + b.getAttribute("aria-label")));
console.log("deselect candidates", cand);
await browser.close();
