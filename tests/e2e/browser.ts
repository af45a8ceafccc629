import fs from "node:fs";
import path from "node:path";
import { chromium, type Browser, type Page } from "playwright-core";
import { inject } from "vitest";

export const CHROMIUM = process.env.CHROMIUM_PATH || "/usr/bin/chromium";
export const SHOTS = path.resolve("tests/e2e/screenshots");

export function baseUrl(): string {
  return inject("baseUrl");
}

export async function launch(): Promise<Browser> {
  // playwright gives every launch a fresh temporary profile (it refuses --user-data-dir here).
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

export async function signInPage(browser: Browser, email: string, password = "coatwright-demo"): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 860 } });
  const page = await context.newPage();
  const errors: string[] = [];
  // the address too, so that a failed resource says which one it was
  page.on("console", (m) => m.type() === "error" && errors.push(m.location()?.url ? `${m.text()} [${m.location().url}]` : m.text()));
  (page as Page & { consoleErrors?: string[] }).consoleErrors = errors;
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${baseUrl()}/`);
  return page;
}

export async function shot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SHOTS, { recursive: true });
  const file = path.join(SHOTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
