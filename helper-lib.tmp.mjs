import { chromium } from "playwright-core";
export const B = "http://127.0.0.1:3000";
export async function open({ email, pw, phone = true }) {
  const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--headless", "--no-sandbox", "--disable-gpu"] });
  const context = await browser.newContext(phone ? { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, deviceScaleFactor: 1 } : { viewport: { width: 1440, height: 900 } });
  const { csrfToken } = await (await context.request.get(B + "/api/auth/csrf")).json();
  const r = await context.request.post(B + "/api/auth/callback/credentials", { form: { csrfToken, email, password: pw, json: "true" } });
  const page = await context.newPage();
  page.on("pageerror", (e) => console.log("PAGEERROR", page.url(), String(e).slice(0, 200)));
  page.on("console", (m) => { if (m.type() === "error") console.log("CONSOLE", page.url(), m.text().slice(0, 200)); });
  return { browser, context, page };
}
// audit: overflow, small targets
export async function audit(page, label) {
  const res = await page.evaluate(() => {
    const W = document.documentElement.clientWidth;
    const out = { scrollW: document.documentElement.scrollWidth, W, over: [], small: [] };
    const inScroller = (el) => { for (let p = el.parentElement; p; p = p.parentElement) { const cs = getComputedStyle(p); if (/(auto|scroll|hidden)/.test(cs.overflowX) && p !== document.body && p !== document.documentElement) return true; } return false; };
    for (const el of document.querySelectorAll("body *")) {
      const r = el.getBoundingClientRect();
      if (r.width === 0 || r.height === 0) continue;
      const cs = getComputedStyle(el); if (cs.visibility === "hidden") continue;
      if ((r.right > W + 1 || r.left < -1) && !inScroller(el) && el.children.length === 0) out.over.push(`${el.tagName}.${(el.className?.baseVal ?? el.className ?? "").toString().slice(0, 40)} "${(el.textContent || el.getAttribute("aria-label") || "").trim().slice(0, 40)}" L${Math.round(r.left)} R${Math.round(r.right)}`);
    }
    for (const el of document.querySelectorAll('a[href], button, input, select, textarea, [role=button], [role=tab], [role=link], [role=checkbox], [role=switch], summary, [tabindex]:not([tabindex="-1"])')) {
      const r = el.getBoundingClientRect();
      if (r.width === 0 || r.height === 0) continue;
      if (getComputedStyle(el).visibility === "hidden") continue;
      if (el.type === "hidden") continue;
      if (r.width < 24 || r.height < 24) {
        // inline link in text exemption
        const inline = el.tagName === "A" && getComputedStyle(el).display === "inline" && el.parentElement && el.parentElement.textContent.trim().length > el.textContent.trim().length + 10;
        out.small.push(`${inline ? "(inline) " : ""}${el.tagName}${el.type ? "[" + el.type + "]" : ""} "${(el.getAttribute("aria-label") || el.textContent || el.name || el.id || "").trim().slice(0, 40)}" ${Math.round(r.width)}x${Math.round(r.height)}`);
      }
    }
    return out;
  });
  console.log(`== ${label} ${page.url()} scrollW=${res.scrollW}/${res.W}`);
  if (res.over.length) console.log("  OVERFLOW:", [...new Set(res.over)].slice(0, 12).join("\n    "));
  if (res.small.length) console.log("  SMALL:", [...new Set(res.small)].slice(0, 25).join("\n    "));
  return res;
}
