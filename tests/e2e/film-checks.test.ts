import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { baseUrl, launch, shot, signInPage } from "./browser";

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
});
