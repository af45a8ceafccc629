import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { baseUrl, launch, shot, signInPage } from "./browser";

// signInPage collects the page's console errors.
const consoleErrors = (p: Page) => (p as Page & { consoleErrors?: string[] }).consoleErrors ?? [];
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** Today's in-progress fender run (coat 1 EC-200 e-coat, coat 2 PP-430 powder). */
async function fenderRunId(page: Page): Promise<number> {
  const res = await page.request.get(`${baseUrl()}/api/runs`);
  const body = (await res.json()) as { runs: { id: number; status: string; part: { number: string } | null }[] };
  return body.runs.find((r) => r.status === "in-progress" && r.part?.number === "BC-2210")!.id;
}

async function keyIn(page: Page, values: number[]) {
  const input = page.locator("#dft-key");
  for (const v of values) {
    await input.fill(String(v));
    await input.press("Enter");
  }
}

describe("film checks", () => {
  it("the operator keys in readings, sees a failing spot explained and imports a gauge CSV; the supervisor sees the charts", async () => {
    const page = await signInPage(browser, "operator@bramblecote.test");
    const runId = await fenderRunId(page);
    await page.goto(`${baseUrl()}/runs/${runId}`);
    await page.getByRole("link", { name: "Film checks" }).click();
    await page.waitForURL(`${baseUrl()}/runs/${runId}/film`);
    await page.getByRole("heading", { name: "Enter readings" }).waitFor();

    // Coat 2 (PP-430, 60–90 µm), SSPC-PA 2: spot 4 averages 45 µm, below 80 % of 60 µm = 48 µm
    await page.locator("#fc-coat").selectOption("1");
    await page.locator("#fc-gauge").selectOption({ index: 1 });
    await keyIn(page, [70, 71, 69, 70, 70, 70, 72, 68, 70, 44, 45, 46, 70, 70, 70]);
    await page.getByText("A1 S5:").waitFor();
    await page.getByRole("button", { name: "Save and judge" }).click();
    await page.getByText("Area 1, spot 4 at 45 µm is below 80 % of the 60 µm minimum (48 µm).").waitFor();
    await shot(page, "film-checks-failing-spot");

    // a paste with text in it adds nothing and names the bad line
    await page.getByRole("tab", { name: "Paste a column" }).click();
    await page.locator("#dft-paste").fill("21\nabc\n22");
    await page.getByRole("button", { name: "Use these readings" }).click();
    await page.getByText('Line 2: "abc" is not a number.').waitFor();
    expect(await page.getByText("0 readings entered").count()).toBe(1);

    // Coat 1 (EC-200, 18–25 µm) from the gauge's CSV export, mapped to "Reading" once for this gauge
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "coatwright-gauge-"));
    const file = path.join(dir, "gauge-export.csv");
    const readings = [20, 21, 22, 19, 20, 21, 22, 23, 21, 20, 19, 21, 22, 22, 20];
    fs.writeFileSync(file, ["No,Time,Reading,Unit", ...readings.map((r, i) => `${i + 1},10:${String(i).padStart(2, "0")},${r},um`)].join("\n"));
    await page.locator("#fc-coat").selectOption("0");
    await page.getByRole("tab", { name: "Import gauge CSV" }).click();
    await page.locator("#dft-csv").setInputFiles(file);
    await expect.poll(() => page.locator("#dft-col").inputValue()).toBe("Reading");
    await page.getByRole("button", { name: "Use 15 rows" }).click();
    await page.getByText("15 readings taken from gauge-export.csv.").waitFor();
    await page.getByRole("button", { name: "Save and judge" }).click();
    await expect.poll(() => page.locator("[data-testid=film-check]").count()).toBe(3);
    await shot(page, "film-checks-csv-imported");
    await page.close();

    const sup = await signInPage(browser, "supervisor@bramblecote.test");
    await sup.goto(`${baseUrl()}/runs/${runId}/film`);
    await sup.locator("[data-testid=film-histogram]").first().waitFor();
    expect(await sup.locator("[data-testid=film-histogram]").count()).toBe(3);
    await shot(sup, "film-checks-supervisor");

    await sup.getByRole("link", { name: "Quality" }).click();
    await sup.waitForURL(`${baseUrl()}/quality`);
    await sup.locator("#q-coating").selectOption({ label: "EC-200 Cathodic epoxy e-coat primer" });
    await sup.locator("#q-line").selectOption({ label: "Line 1 — E-coat and powder" });
    await sup.locator("[data-testid=run-chart]").first().waitFor();
    expect(await sup.locator("tbody tr").count()).toBe(2);
    await shot(sup, "quality-trend");
  }, 120_000);

  it("the operator sees the sampling plan, edits one reading (a bad cell saves nothing) and reads the change in the log", async () => {
    const page = await signInPage(browser, "operator@bramblecote.test");
    const runId = await fenderRunId(page);
    await page.goto(`${baseUrl()}/runs/${runId}/film`);

    // 600 fenders × 0.708 m² = 424.9 m² = 4574 ft²: SSPC-PA 2 asks 3 + 4 = 7 areas of 5 spots, ≥ 3 readings a spot
    const panel = page.locator("[data-testid=sampling-panel]");
    await panel.waitFor();
    await expect.poll(() => panel.locator("[data-testid=sampling-coat-1]").innerText()).toContain("7 areas, 35 spots, at least 105 readings");
    expect(await panel.locator("[data-testid=sampling-coat-2]").innerText()).toContain("7 areas, 35 spots, at least 105 readings");
    expect(await panel.innerText()).toMatch(/424\.9 m²/);
    await shot(page, "film-checks-sampling-panel");

    // the seeded e-coat check is the first card; area 1, spot 2 was read 19, 20, 21 µm
    const card = page.locator("[data-testid=film-check]").first();
    await card.getByRole("button", { name: "Edit readings…" }).click();
    const cell = card.getByLabel("Area 1, spot 2, reading 3 (µm)");
    expect(await cell.inputValue()).toBe("21");
    await cell.fill("25");
    // one bad cell: nothing is sent until it is fixed
    const other = card.getByLabel("Area 1, spot 1, reading 1 (µm)");
    await other.fill("2O");
    await card.getByText('Area 1, spot 1, reading 1: "2O" is not a number.').waitFor();
    await card.getByRole("button", { name: "Save changes" }).click();
    await card.getByText("Fix the marked entry first; nothing was saved.").waitFor();
    expect(await other.getAttribute("aria-invalid")).toBe("true");
    await shot(page, "film-checks-edit-bad-cell");
    await other.fill("20");
    // Enter moves to the next cell, as in fast entry
    await other.press("Enter");
    expect(await card.getByLabel("Area 1, spot 1, reading 2 (µm)").evaluate((el) => el === document.activeElement)).toBe(true);
    await card.getByRole("button", { name: "Save changes" }).click();
    await page.getByText("Changes saved and logged.").waitFor();

    await card.getByText(/History of this check \(2\)/).click();
    const entry = card.locator("[data-testid=change-log] li", { hasText: "Edited coat 1 (EC-200)" });
    await entry.waitFor();
    expect(await entry.innerText()).toContain("Samir Holloway");
    const change = (await entry.locator("li").first().textContent()) ?? "";
    expect(change.replace(/\s+/g, " ").trim()).toBe("area 1, spot 2, reading 3: 21 µm → changed to 25 µm");
    await shot(page, "film-checks-edit-logged");

    // the gauges page is linked from the entry screen
    await page.getByRole("link", { name: "Gauges and their verification" }).click();
    await page.waitForURL(`${baseUrl()}/quality/gauges`);
    await page.locator("[data-testid=gauges-table]").waitFor();
    expect(consoleErrors(page)).toEqual([]);
    await page.close();
  }, 120_000);

  it("a run that has not started takes no readings, and its film page says why", async () => {
    const page = await signInPage(browser, "operator@bramblecote.test");
    const { runs } = (await (await page.request.get(`${baseUrl()}/api/runs`)).json()) as { runs: { id: number; status: string }[] };
    const planned = runs.find((r) => r.status === "planned")!;
    await page.goto(`${baseUrl()}/runs/${planned.id}/film`);
    await expect.poll(() => page.getByTestId("film-locked").textContent(), { timeout: 15_000 }).toBe("Film readings are taken on coated parts: this run has not started yet.");
    expect(await page.getByRole("heading", { name: "Enter readings" }).count()).toBe(0);
    await page.context().close();
  });

  it("the supervisor adds a gauge, corrects an overdue verification date and forgets a CSV mapping", async () => {
    const sup = await signInPage(browser, "supervisor@bramblecote.test");
    await sup.goto(`${baseUrl()}/quality`);
    await sup.getByRole("link", { name: "Gauges and their verification" }).click();
    await sup.waitForURL(`${baseUrl()}/quality/gauges`);
    const table = sup.locator("[data-testid=gauges-table]");
    await table.waitFor();
    // the seeded pull-off gauge was verified 425 days ago, past its 12-month interval
    const pullOff = table.locator("[data-testid=gauge-row]", { hasText: "Gauge 2 — pull-off" });
    await pullOff.locator("[data-testid=verification-overdue]").waitFor();
    await shot(sup, "gauges-overdue");

    await sup.getByRole("button", { name: "Add a gauge…" }).click();
    await sup.getByLabel("Name").fill("Gauge 3 — booth 2");
    await sup.locator("#g-add-type").selectOption("type1");
    await sup.getByLabel("Serial number").fill("PO-2290");
    await sup.getByLabel("Last verified").fill("2026-06-15");
    await sup.getByRole("button", { name: "Add gauge" }).click();
    await sup.getByText("Gauge 3 — booth 2 was added.").waitFor();
    await table.locator("[data-testid=gauge-row]", { hasText: "Gauge 3 — booth 2" }).waitFor();

    // a date in the future is refused by the server and shown at the field
    await sup.getByRole("button", { name: "Edit Gauge 2 — pull-off" }).click();
    const date = sup.getByLabel("Last verified");
    await date.fill("2099-01-01");
    await sup.getByRole("button", { name: "Save gauge" }).click();
    await sup.getByText("Enter the day the gauge was last verified (today or earlier).").waitFor();
    await shot(sup, "gauges-edit-error");
    const today = new Date().toISOString().slice(0, 10);
    await date.fill(today);
    await sup.getByRole("button", { name: "Save gauge" }).click();
    await sup.getByText("Gauge 2 — pull-off was saved.").waitFor();
    await expect.poll(() => pullOff.innerText()).toContain(today);
    expect(await table.locator("[data-testid=verification-overdue]").count()).toBe(0);

    // forget the CSV mapping remembered for the electronic gauge
    const electronic = table.locator("[data-testid=gauge-row]", { hasText: "Gauge 1 — electronic" });
    await electronic.getByRole("button", { name: "Forget mapping…" }).click();
    await sup.getByRole("group", { name: /Confirm: forget/ }).getByRole("button", { name: "Forget" }).click();
    await expect.poll(() => electronic.innerText()).toContain("none remembered");
    await shot(sup, "gauges-list");
    // the one 400 is the refused future date above
    expect(consoleErrors(sup).filter((e) => !e.includes("status of 400"))).toEqual([]);
    await sup.close();
  }, 120_000);
});
