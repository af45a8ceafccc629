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

const LINE1 = "Line 1 — E-coat and powder";
const LINE2 = "Line 2 — Powder only";
const consoleErrors = (page: Page) => (page as Page & { consoleErrors?: string[] }).consoleErrors ?? [];

/*
 * Hand working (as in tests/api/throughput.test.ts): the reference bench end frame, 2 mm steel,
 * in PP-410. Lumped heat-up (Çengel ch. 4) with the Process Heating polyester schedule:
 * Line 1's 60 m powder oven at 210 °C needs 16.29 min → fastest 60 / 16.29 = 3.683 m/min =
 * 12.08 ft/min; Line 2's 54 m oven at 205 °C needs 17.75 min → 3.042 m/min = 9.98 ft/min
 * (1 ft = 0.3048 m, NIST SP 811). Carriers/h = speed × 60 / pitch (REFERENCES.md): Line 2
 * 202.8/h × 12 = 2434 parts/h beats Line 1's 368.3/h × 6 = 2210.
 */
describe("throughput comparison", () => {
  it("the manager compares two lines for one part, sees what limits each and a chart", async () => {
    const page = await signInPage(browser, "manager@bramblecote.test");
    // the home panel lists every line for the reference part
    const panel = page.getByRole("region", { name: "Throughput by line" });
    await panel.getByRole("cell", { name: LINE2 }).waitFor();
    expect(await panel.locator("tbody tr").count()).toBe(3);
    await panel.screenshot({ path: `${SHOTS}/throughput-home-panel.png` });

    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Throughput" }).click();
    await page.waitForURL(`${baseUrl()}/throughput`);
    await page.getByRole("heading", { level: 1, name: "Throughput" }).waitFor();

    // The manager reads US units: the part is typed by hand in inches, pounds and square feet.
    // 0.8 m² = 8.611 ft²; 6.5 kg = 14.33 lb; 2 mm = 0.07874 in; 450 × 60 × 700 mm = 17.72 × 2.362 × 27.56 in.
    const fill = async (label: string, value: string) => page.getByLabel(label, { exact: true }).fill(value);
    await fill("Coated outside area (ft²)", "8.611");
    await fill("Mass (lb)", "14.33");
    await fill("Section thickness (in)", "0.07874");
    await fill("Length (along travel) (in)", "17.72");
    await fill("Width (in)", "2.362");
    await fill("Height (hung upright) (in)", "27.56");
    await page.getByLabel("Powder", { exact: true }).selectOption({ label: "PP-410 · Outdoor polyester, gloss · Bramble Green" });

    const lines = page.getByRole("list", { name: "Lines" });
    await lines.getByLabel(LINE1).check();
    await lines.getByLabel(LINE2).check();
    await page.getByRole("button", { name: "Compare" }).click();

    const limits = page.getByTestId("limit");
    await limits.nth(1).waitFor();
    await expect.poll(() => limits.nth(0).textContent(), { timeout: 15_000 }).toMatch(new RegExp(`^${LINE1}: Cure dwell in Powder cure oven limits speed to 12\\.1 ft/min`));
    await expect.poll(() => limits.nth(1).textContent(), { timeout: 15_000 }).toMatch(new RegExp(`^${LINE2}: Cure dwell in Cure oven limits speed to 9\\.98 ft/min`));

    const table = page.getByTestId("comparison-table");
    const row = (name: string) => table.locator("tbody tr", { has: page.getByRole("rowheader", { name, exact: true }) });
    await expect.poll(() => row("Parts per hour").locator("td").allTextContents(), { timeout: 15_000 }).toEqual(["2,210", "2,434best"]);
    await expect.poll(() => row("Cost per part").locator('td[data-best="true"]').count(), { timeout: 15_000 }).toBe(1);
    await expect.poll(() => row("Cost per part").locator("td").nth(1).getAttribute("data-best"), { timeout: 15_000 }).toBe("true");

    // The chart arrives after the table (Recharts is loaded on demand): an svg with one bar per line.
    const bars = page.locator('[data-testid="chart-parts-per-hour"] svg .recharts-bar-rectangle');
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="chart-parts-per-hour"] svg .recharts-bar-rectangle path').length >= 2, null, { timeout: 30_000 });
    expect(await bars.count()).toBe(2);
    expect(await page.locator('[data-testid="chart-cost-per-part"] svg .recharts-bar-rectangle').count()).toBe(2);
    await shot(page, "throughput-two-lines");

    // A what-if faster than Line 2's range is refused on the field; 11 ft/min (3.353 m/min) is saved.
    await page.getByLabel("Scenario name").fill("Line 2 at 11 ft/min");
    await page.getByLabel("Base line").selectOption({ label: LINE2 });
    await page.getByLabel("Line speed (ft/min)").fill("13");
    await page.getByRole("button", { name: "Save scenario" }).click();
    // Line 2 runs 1.2–3.6 m/min = 3.94–11.8 ft/min (1 ft = 0.3048 m)
    await page.getByText("Enter a speed within the line's range 3.94–11.8 ft/min.").first().waitFor();
    await page.getByLabel("Line speed (ft/min)").fill("11");
    await page.getByRole("button", { name: "Save scenario" }).click();
    await page.getByText("Saved Line 2 at 11 ft/min; it is ticked for the comparison above.").waitFor();
    await expect.poll(() => page.getByRole("list", { name: "Saved scenarios" }).getByLabel("Line 2 at 11 ft/min").isChecked(), { timeout: 15_000 }).toBe(true);
    await page.getByRole("button", { name: "Compare" }).click();
    await limits.nth(2).waitFor();
    // 3.353 m/min is faster than the 3.042 m/min the oven cures at: named, and the bar is red
    await expect.poll(() => limits.nth(2).textContent(), { timeout: 15_000 }).toMatch(/^Line 2 at 11 ft\/min: Cure dwell in Cure oven limits speed to 9\.98 ft\/min: at the scenario's 11 ft\/min .* does not cure\./);
    await expect.poll(() => limits.nth(2).getAttribute("data-kind"), { timeout: 15_000 }).toBe("cure-dwell");
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="chart-parts-per-hour"] svg .recharts-bar-rectangle path').length >= 3, null, { timeout: 30_000 });

    // Duplicate, then delete the copy after confirming.
    await page.getByRole("button", { name: "Duplicate Line 2 at 11 ft/min" }).click();
    await page.getByText("Copied as Line 2 at 11 ft/min (copy); edit it below.").waitFor();
    await page.getByRole("button", { name: "Delete Line 2 at 11 ft/min (copy)" }).click();
    await page.getByRole("button", { name: "Yes, delete Line 2 at 11 ft/min (copy)" }).click();
    await page.getByText("Deleted Line 2 at 11 ft/min (copy).").waitFor();
    await page.locator('tr[data-scenario="Line 2 at 11 ft/min (copy)"]').waitFor({ state: "detached" });
    await shot(page, "throughput-scenario");

    expect(consoleErrors(page)).toEqual([]);
    await page.context().close();
  });

  it("a supervisor compares the saved scenarios but has no editor", async () => {
    const page = await signInPage(browser, "supervisor@bramblecote.test");
    await page.goto(`${baseUrl()}/throughput`);
    await page.getByLabel("Powder", { exact: true }).selectOption({ label: "PP-410 · Outdoor polyester, gloss · Bramble Green" });
    const saved = page.getByRole("list", { name: "Saved scenarios" });
    await saved.getByLabel("Line 1 at 3.5 m/min").check();
    await saved.getByLabel("Line 2 with longer oven").check();
    await page.getByRole("button", { name: "Compare" }).click();
    const limits = page.getByTestId("limit");
    await limits.nth(1).waitFor();
    // 66 m oven: fastest curing 66 / 17.75 = 3.72 m/min, above Line 2's 3.6 m/min top speed
    await expect.poll(() => limits.nth(1).textContent(), { timeout: 15_000 }).toContain(
      "Line 2 with longer oven: The conveyor's top speed limits speed to 3.6 m/min; Cure oven would cure at up to 3.72 m/min.",
    );
    await expect.poll(() => limits.nth(1).getAttribute("data-kind"), { timeout: 15_000 }).toBe("line-speed");
    expect(await page.getByRole("button", { name: "Save scenario" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: /^Delete / }).count()).toBe(0);
    await page.context().close();
  });

  it("an operator is not shown the screen", async () => {
    const page = await signInPage(browser, "operator@bramblecote.test");
    expect(await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Throughput" }).count()).toBe(0);
    await page.goto(`${baseUrl()}/throughput`);
    await page.waitForURL(`${baseUrl()}/forbidden`);
    await page.context().close();
  });
});
