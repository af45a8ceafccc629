import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { navItems } from "@/lib/navigation";
import { baseUrl, launch, signInPage } from "./browser";

/*
 * axe-core on every main page (every navigation entry, as admin, plus sign-in): no serious or
 * critical violations. The rules are axe's own (WCAG 2.x A/AA).
 */
const axeSource = fs.readFileSync(path.resolve("node_modules/axe-core/axe.min.js"), "utf8");
let browser: Browser;
let admin: Page;
beforeAll(async () => {
  browser = await launch();
  admin = await signInPage(browser, "admin@bramblecote.test");
});
afterAll(async () => {
  await browser?.close();
});

async function seriousViolations(page: Page): Promise<string[]> {
  await page.addScriptTag({ content: axeSource });
  const result = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, o: object) => Promise<{ violations: { id: string; impact: string; help: string; nodes: { target: string[] }[] }[] }> } }).axe;
    return axe.run(document, { resultTypes: ["violations"] });
  });
  return result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.slice(0, 3).map((n) => n.target.join(" ")).join(", ")}`);
}

describe("accessibility (axe-core)", () => {
  it("sign-in page", async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl()}/sign-in`);
    expect(await seriousViolations(page)).toEqual([]);
    await page.close();
  });

  it.each(navItems.map((i) => [i.href]))("%s", async (href) => {
    await admin.goto(`${baseUrl()}${href}`);
    await admin.waitForLoadState("networkidle");
    expect(await seriousViolations(admin)).toEqual([]);
  });

  it("every form field on the main pages has a label, and the page can be tabbed through", async () => {
    await admin.goto(`${baseUrl()}/settings`);
    const unlabeled = await admin.evaluate(() =>
      [...document.querySelectorAll("input:not([type=hidden]), select, textarea")]
        .filter((el) => !(el as HTMLInputElement).labels?.length && !el.getAttribute("aria-label") && !el.getAttribute("aria-labelledby"))
        .map((el) => el.outerHTML.slice(0, 80)),
    );
    expect(unlabeled).toEqual([]);
    // The first Tab offers to skip the header; the work sections' first link comes after the
    // brand and the account links (admin has the most of those).
    await admin.keyboard.press("Tab");
    const seen: string[] = [];
    for (let i = 0; i < 10; i++) {
      seen.push(await admin.evaluate(() => document.activeElement?.textContent?.trim() ?? ""));
      await admin.keyboard.press("Tab");
    }
    expect(seen[0]).toBe("Skip to content");
    expect(seen.some((t) => t === "Today")).toBe(true);
  });
});
