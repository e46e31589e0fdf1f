import { mkdirSync } from "node:fs";
import path from "node:path";
import { chromium, type Browser, type Page } from "playwright-core";
import { APP_URL } from "./env";

export const ARTIFACTS = path.resolve(__dirname, "../artifacts");
mkdirSync(ARTIFACTS, { recursive: true });

/** Debian's Chromium, headless, with the flags this machine needs (no browser download). */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || "/usr/bin/chromium",
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  });
}

/** Signs in through the sign-in page, as a person would. */
export async function signInPage(page: Page, email: string, password: string) {
  await page.goto(`${APP_URL}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/builds/);
}

export const shot = (page: Page, name: string) => page.screenshot({ path: path.join(ARTIFACTS, `${name}.png`), fullPage: true });
export { APP_URL };
