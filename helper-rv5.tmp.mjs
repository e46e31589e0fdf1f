import { open, audit, B } from "./helper-lib.tmp.mjs";
const { browser, page } = await open({ email: "sam@demo.linkwright.test", pw: "larkspur-reviewer" });
page.on("response", r => { if (r.status() >= 400) console.log("HTTP", r.status(), r.url()); });
const L = B + "/builds/acbd7c41-5dc6-4b6f-9054-890c8d1efa20/linkages/2b0de79f-ace0-4e44-88d3-aa5a9321e01a";
await page.goto(L, { waitUntil: "networkidle" }); await page.waitForTimeout(1500);
const sign = page.getByRole("button", { name: /Sign off/ });
await sign.scrollIntoViewIfNeeded(); await page.evaluate(() => scrollBy(0, 150));
await page.screenshot({ path: "/tmp/lw/rv-signoff-area.png" });
await page.getByPlaceholder("What you inspected and on what basis").fill("Inspected all joints in the aircraft.");
console.log("disabled after statement?", await sign.isDisabled());
if (!(await sign.isDisabled())) { await sign.tap(); await page.waitForTimeout(1500); }
await page.screenshot({ path: "/tmp/lw/rv-signoff-after.png" });
console.log("alerts", await page.locator("[role=alert]").allTextContents());
await browser.close();
