import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { baseUrl, launch, shot, signInPage, SHOTS } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const consoleErrors = (page: Page) => (page as Page & { consoleErrors?: string[] }).consoleErrors ?? [];

async function countIs(page: Page, n: number): Promise<void> {
  await page.waitForFunction((want) => document.querySelector("[data-testid=plan-count]")?.textContent === String(want), n, { timeout: 15_000 });
  await page.getByText("Updating…").waitFor({ state: "detached" });
}

/*
 * The trailer fender BC-2210 (760 long × 320 wide × 340 high mm, 5.53 kg) on Line 2's carrier
 * (800 along travel × 1800 high × 700 across mm, 80 kg), 50 mm clearance. Hand-worked, common
 * practice, no source (n = floor((W + c)/(s + c)) per axis in 850 × 1850 × 750):
 *   upright best, length along travel (760, 340, 320): 1 × 4 × 2 = 8.
 *   by hand "width along travel, length up, height across" (320, 760, 340): pitches 370, 810, 390
 *   → 2 × 2 × 1 = 4: two tiers, lower faces at 0 and 810 mm, two parts each 370 mm apart.
 */
describe("saved racking plans", () => {
  it("the supervisor overrides the orientation, saves the plan and prints it", async () => {
    const page = await signInPage(browser, "supervisor@bramblecote.test");
    await page.goto(`${baseUrl()}/racking`);
    await page.getByRole("heading", { level: 1, name: "Racking" }).waitFor();
    // The demo's saved plans are listed.
    const list = page.getByTestId("saved-plans");
    await list.getByRole("cell", { name: /^BC-5020/ }).waitFor({ timeout: 15_000 });

    await page.getByLabel("Take the part from the catalogue").selectOption({ label: "BC-2210 · Trailer fender, 13 in wheel" });
    await page.getByLabel("Take the window from a line").selectOption({ label: "Line 2 — Powder only (conveyor carrier)" });
    await expect.poll(() => page.getByLabel("Window width, along travel (mm)").inputValue(), { timeout: 15_000 }).toBe("800");
    const panel = page.getByTestId("saved-plan");
    await panel.getByText("No saved plan for this part on this line yet").waitFor({ timeout: 15_000 });
    await page.getByLabel("Clearance between parts (mm)", { exact: true }).fill("50");
    await countIs(page, 8);
    await expect.poll(() => page.getByTestId("orientation-count").textContent(), { timeout: 15_000 }).toBe("8 with the planner's best; choose one to count that way only.");

    // By hand: any orientation, then the fender standing on its width. Keyboard: the select takes focus.
    await page.getByLabel("Any orientation").check();
    const select = page.getByLabel("Orientation", { exact: true });
    const options = await select.locator("option").allTextContents();
    expect(options[0]).toBe("Best found (the planner chooses)");
    expect(options).toContain("By hand: width along travel, length up, height across (320 mm × 760 mm × 340 mm)");
    await select.focus();
    await select.selectOption("width-length-height");
    await countIs(page, 4);
    await expect.poll(() => page.getByTestId("orientation-count").textContent(), { timeout: 15_000 }).toBe("4 this way; best found 8.");
    await expect.poll(() => page.getByTestId("best-count").textContent(), { timeout: 15_000 }).toBe("Orientation set by hand. The planner's best holds 8, 4 more.");
    await expect.poll(() => page.getByTestId("plan-reason").textContent(), { timeout: 15_000 }).toBe(
      "Space limits the carrier to 4 parts: 2 along travel × 2 tiers × 1 across, 50 mm clearance.",
    );
    await shot(page, "rack-plans-override");

    await page.getByLabel("Note for the line (optional)").fill("Stand them on the short edge; hook through the stud bosses.");
    await panel.getByRole("button", { name: "Save plan" }).click();
    await expect.poll(() => panel.getByTestId("saved-plan-message").textContent(), { timeout: 15_000 }).toBe("Saved: 4 parts per carrier.");
    await expect.poll(() => panel.getByTestId("saved-plan-facts").textContent(), { timeout: 15_000 }).toMatch(
      /^Plan \d+: 4 per carrier \(limited by space\), by hand: width along travel, length up, height across, clearance 50 mm\./,
    );
    // Saved as shown: nothing left to update.
    expect(await panel.getByRole("button", { name: "Update plan" }).isDisabled()).toBe(true);
    const row = list.getByRole("row", { name: /BC-2210.*Line 2/ });
    await row.waitFor({ timeout: 15_000 });
    expect(await row.textContent()).toMatch(/4 limited by space.*By hand: width along travel, length up, height across.*50 mm.*Tobias Wrenfield/);
    await shot(page, "rack-plans-saved");

    // The printable view: the picture (two SVG views, no 3D) and the tiers from the bottom.
    await panel.getByRole("link", { name: "Printable view" }).click();
    await page.waitForURL(/\/racking\/plans\/\d+$/);
    const sheet = page.getByTestId("rack-plan-sheet");
    await sheet.waitFor();
    expect(await sheet.getByTestId("sheet-count").textContent()).toBe("4");
    expect(await sheet.getByTestId("sheet-reason").textContent()).toBe("Space limits the carrier to 4 parts: 2 along travel × 2 tiers × 1 across, 50 mm clearance.");
    const tiers = await sheet.getByTestId("sheet-tiers").locator("tbody tr").evaluateAll((rows) => rows.map((r) => [...r.querySelectorAll("td")].map((td) => td.textContent)));
    expect(tiers).toEqual([
      ["1", "0 mm", "2", "2 × 1", "760 mm", "370 mm", "—"],
      ["2", "810 mm", "2", "2 × 1", "760 mm", "370 mm", "—"],
    ]);
    expect(await sheet.getByTestId("rack-diagram").locator("svg").count()).toBe(2);
    expect(await sheet.getByRole("img", { name: /^Front: along travel × up: 4 part outlines/ }).count()).toBe(1);
    expect(await page.locator("canvas").count()).toBe(0);
    await sheet.getByText("Stand them on the short edge; hook through the stud bosses.").waitFor();
    await shot(page, "rack-plan-sheet-screen");

    await page.emulateMedia({ media: "print" });
    // roughly an A4 page's printable width at 96 px/in (210 mm − 2 × 12 mm margins)
    await page.setViewportSize({ width: 703, height: 1000 });
    await expect.poll(() => page.locator("header.no-print").isVisible(), { timeout: 15_000 }).toBe(false);
    await expect.poll(() => page.getByRole("button", { name: "Print" }).isVisible(), { timeout: 15_000 }).toBe(false);
    const colour = await sheet.evaluate((el) => getComputedStyle(el).color);
    expect(colour).toBe("rgb(0, 0, 0)");
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(703);
    await shot(page, "rack-plan-sheet-print");
    for (const format of ["A4", "Letter"] as const) {
      const pdf = await page.pdf({ format, printBackground: false, preferCSSPageSize: true });
      fs.writeFileSync(path.join(SHOTS, `rack-plan-${format.toLowerCase()}.pdf`), pdf);
      const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length;
      expect(pages).toBeGreaterThanOrEqual(1);
      expect(pages).toBeLessThanOrEqual(2);
    }
    await page.emulateMedia({ media: "screen" });
    await page.setViewportSize({ width: 1280, height: 860 });

    // Back in the planner from the list: the saved choices load; delete with a confirmation.
    await page.goto(`${baseUrl()}/racking`);
    await row.waitFor({ timeout: 15_000 });
    const open = row.getByRole("link", { name: /^Open plan \d+ in planner$/ });
    await open.click();
    await page.waitForURL(/\/racking\?part=.*&line=\d+$/);
    await expect.poll(() => page.getByLabel("Orientation", { exact: true }).inputValue(), { timeout: 20_000 }).toBe("width-length-height");
    await countIs(page, 4);
    await panel.getByRole("button", { name: "Delete plan…" }).focus();
    await page.keyboard.press("Enter");
    await panel.getByRole("button", { name: /^Yes, delete plan \d+$/ }).click();
    await expect.poll(() => panel.getByTestId("saved-plan-message").textContent(), { timeout: 15_000 }).toBe(
      "Deleted. Runs of this part on this line go back to the planner's count.",
    );
    await expect.poll(() => list.getByRole("row", { name: /BC-2210.*Line 2/ }).count(), { timeout: 15_000 }).toBe(0);
    expect(consoleErrors(page)).toEqual([]);
    await page.context().close();
  });

  it("the operator reads the saved plans and prints one, but cannot save", async () => {
    const page = await signInPage(browser, "operator@bramblecote.test");
    await page.goto(`${baseUrl()}/racking`);
    const list = page.getByTestId("saved-plans");
    const row = list.getByRole("row", { name: /BC-2210.*Batch oven B/ });
    await row.waitFor({ timeout: 15_000 });
    expect(await page.getByRole("button", { name: "Save plan" }).count()).toBe(0);
    await row.getByRole("link", { name: /Printable view/ }).click();
    const sheet = page.getByTestId("rack-plan-sheet");
    await sheet.waitFor();
    // Demo plan, hand-worked (common practice, no source): 320 along, 340 up, 760 across in the
    // oven's 1000 × 2000 × 2800 mm rack window with 50 mm clearance → 2 × 5 × 3 = 30, five tiers of six.
    expect(await sheet.getByTestId("sheet-count").textContent()).toBe("30");
    const counts = await sheet.getByTestId("sheet-tiers").locator("tbody tr td:nth-child(3)").allTextContents();
    expect(counts).toEqual(["6", "6", "6", "6", "6"]);
    await shot(page, "rack-plan-sheet-operator");
    expect(consoleErrors(page)).toEqual([]);
    await page.context().close();
  });
});
