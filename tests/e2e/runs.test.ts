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

/** Today as the browser (and the demo seed, on a UTC machine) sees it. */
const today = () => new Date().toISOString().slice(0, 10);
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

interface BoardBody {
  board: { shifts: { shift: number; runs: { id: number; part: { number: string } }[] }[] };
}

async function boardOrder(page: Page, lineId: string, date: string): Promise<number[]> {
  const res = await page.request.get(`${baseUrl()}/api/runs/board?lineId=${lineId}&date=${date}`);
  const body = (await res.json()) as BoardBody;
  return body.board.shifts[0].runs.map((r) => r.id);
}

async function rowIds(page: Page): Promise<number[]> {
  return page.locator("[data-testid=shift-1] li[data-run-id]").evaluateAll((els) => els.map((e) => Number(e.getAttribute("data-run-id"))));
}

/** Waits until the board on screen shows `ids` in this order and the server has it saved. */
async function orderIs(page: Page, lineId: string, ids: number[]): Promise<void> {
  await page.waitForFunction(
    (want) => [...document.querySelectorAll("[data-testid=shift-1] li[data-run-id]")].map((e) => e.getAttribute("data-run-id")).join() === want.join(),
    ids.map(String),
    { timeout: 15_000 },
  );
  await expect.poll(() => boardOrder(page, lineId, today()), { timeout: 10_000 }).toEqual(ids);
}

describe("runs, the day board and the run sheet", () => {
  it("the supervisor plans an e-coat + powder run, reorders the day board and prints the run sheet", async () => {
    const page = await signInPage(browser, "supervisor@bramblecote.test");
    // the home page lists today's seeded runs per line
    const panel = page.getByRole("region", { name: "Today's runs" });
    await panel.getByRole("link", { name: /BC-2210 × 600/ }).waitFor();
    await shot(page, "home-today-runs");

    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Runs" }).click();
    await page.waitForURL(`${baseUrl()}/runs`);
    await page.getByTestId("runs-table").waitFor();
    await page.getByRole("button", { name: "Plan a run" }).click();

    await page.getByLabel("Part", { exact: true }).selectOption({ label: "BC-2210 · Trailer fender, 13 in wheel" });
    await page.getByLabel("Quantity (parts)").fill("120");
    await page.getByLabel("Line", { exact: true }).selectOption({ label: "Line 1 — E-coat and powder" });
    await page.getByLabel("Day", { exact: true }).fill(today());
    await page.getByLabel("Any orientation").check();
    await page.getByLabel("Coat 1 coating").selectOption({ label: "EC-200 · e-coat · Forge Black" });
    await page.getByLabel("Coat 1 film (µm)").fill("20");
    await page.getByRole("button", { name: "Add a coat" }).click();
    await page.getByLabel("Coat 2 coating").selectOption({ label: "PP-430 · powder · Rosehip Red" });
    await page.getByLabel("Coat 2 film (µm)").fill("70");
    await page.getByLabel("Coat 2 first-pass efficiency (%)").fill("55");

    // The fender (760 × 320 × 340 mm) hangs one per 500 × 1500 × 600 mm carrier with 50 mm clearance:
    // 120 carriers; line time (120 × 0.6 m + 224 m) / 3 m/min = 98.7 min → "1 h 39 min" (cost.ts, hand).
    const summary = page.getByTestId("run-summary");
    await page.waitForFunction(() => document.querySelector("[data-testid=carriers]")?.textContent === "120", null, { timeout: 15_000 });
    await page.getByText("Updating…").waitFor({ state: "detached" });
    await expect.poll(() => summary.getByTestId("line-time").textContent(), { timeout: 15_000 }).toBe("1 h 39 min");
    await expect.poll(() => summary.getByTestId("parts-per-carrier").textContent(), { timeout: 15_000 }).toBe("1");
    const material = await summary.getByTestId("material").textContent();
    expect(material).toMatch(/^\d+(\.\d+)? kg$/);
    await expect.poll(() => summary.getByTestId("cures").textContent(), { timeout: 15_000 }).toBe("Every coat cures");
    expect(await summary.getByTestId("coats-table").locator("tbody tr").count()).toBe(2);
    await shot(page, "runs-plan-form");

    await page.getByRole("button", { name: "Save as draft" }).click();
    await page.waitForURL(/\/runs\/\d+$/);
    const runId = Number(page.url().split("/").pop());
    await page.getByRole("heading", { level: 1, name: `Run ${runId}: 120 × BC-2210 Trailer fender, 13 in wheel` }).waitFor();
    // the saved plan matches what the form showed
    await expect.poll(() => page.getByTestId("material").textContent(), { timeout: 15_000 }).toBe(material);
    const api = await (await page.request.get(`${baseUrl()}/api/runs/${runId}`)).json();
    expect(api.run.plan.carriers).toBe(120);
    expect(api.run.plan.coats.map((c: { code: string }) => c.code)).toEqual(["EC-200", "PP-430"]);
    expect(api.run.plan.materialKg).toBeCloseTo(api.run.plan.coats[0].materialKg + api.run.plan.coats[1].materialKg, 9);
    await page.getByRole("button", { name: "Mark planned" }).click();
    await page.getByText("The run is planned.").waitFor();
    // a planned run follows changes: no kept-plan note
    expect(await page.getByTestId("plan-frozen-note").count()).toBe(0);
    await page.getByTestId("rack-view").locator("canvas").waitFor({ timeout: 30_000 });
    await shot(page, "run-detail");

    // The day board: today's three seeded Line 1 runs and the new one, last.
    await page.getByRole("main").getByRole("link", { name: "Day board" }).click();
    await page.waitForURL(/\/board\?lineId=\d+&date=/);
    const lineId = new URL(page.url()).searchParams.get("lineId")!;
    await page.getByTestId("shift-1").waitFor();
    const start = await rowIds(page);
    expect(start).toHaveLength(4);
    expect(start[3]).toBe(runId);
    await expect.poll(() => page.getByTestId("colour-change").count(), { timeout: 15_000 }).toBeGreaterThan(0);

    // keyboard: Alt+↑ on the focused row moves it up one place, and focus stays on it
    await page.locator(`li[data-run-id="${runId}"]`).focus();
    await page.keyboard.press("Alt+ArrowUp");
    await orderIs(page, lineId, [start[0], start[1], runId, start[2]]);
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute("data-run-id")), { timeout: 15_000 }).toBe(String(runId));
    // the move buttons
    await page.getByRole("button", { name: "Move BC-2210 up" }).nth(1).click();
    await orderIs(page, lineId, [start[0], runId, start[1], start[2]]);
    // drag and drop (HTML5): the bracket run onto the first place
    await page.locator(`li[data-run-id="${start[2]}"]`).dragTo(page.locator(`li[data-run-id="${start[0]}"]`));
    await orderIs(page, lineId, [start[2], start[0], runId, start[1]]);
    await shot(page, "day-board-reordered");

    // the proposal groups by cure schedule and goes light to dark; using it saves it
    await page.getByRole("button", { name: "Propose an order" }).click();
    const proposal = page.getByTestId("proposal");
    await proposal.waitFor();
    await shot(page, "day-board-proposal");
    const proposed = (await (await page.request.get(`${baseUrl()}/api/runs/board/propose?lineId=${lineId}&date=${today()}`)).json()).proposal.shifts[0].runIds as number[];
    // grey PP-420 (luminance 0.209) before the two red PP-430 runs (0.095); the e-coat-only brackets last (0.019)
    expect(proposed[proposed.length - 1]).toBe(start[2]);
    await proposal.getByRole("button", { name: "Use this order for shift 1" }).click();
    await orderIs(page, lineId, proposed);
    await shot(page, "day-board");

    // tomorrow's seeded Line 1 runs need more than the 8 h shift: the late run is flagged
    await page.getByRole("button", { name: "Next day" }).click();
    await page.getByTestId("overflow").first().waitFor();
    await expect.poll(() => page.getByTestId("shift-1-fill").textContent(), { timeout: 15_000 }).toMatch(/ min past the shift/);
    await shot(page, "day-board-overflow");
    expect(consoleErrors(page)).toEqual([]);

    // The run sheet: on screen, then as printed.
    await page.goto(`${baseUrl()}/runs/${runId}/sheet`);
    const sheet = page.getByTestId("run-sheet");
    await sheet.waitFor();
    await sheet.getByRole("heading", { name: "Safety" }).waitFor();
    await expect.poll(() => sheet.getByTestId("sheet-film").locator("tbody tr").count(), { timeout: 15_000 }).toBe(2);
    const steps = await sheet.getByTestId("sheet-steps").locator("li").allTextContents();
    expect(steps[0]).toMatch(/^Mask/);
    expect(steps.some((s) => /E-coat tank: coat 1, EC-200/.test(s))).toBe(true);
    expect(steps.some((s) => /Powder cure oven: oven air 210 °C, dwell 20 min/.test(s))).toBe(true);
    await expect.poll(() => sheet.textContent(), { timeout: 15_000 }).toMatch(/NFPA 33.*NFPA 652.*NFPA 654/);
    await shot(page, "run-sheet-screen");

    await page.emulateMedia({ media: "print" });
    // roughly an A4 page's printable width at 96 px/in (210 mm − 2 × 12 mm margins)
    await page.setViewportSize({ width: 703, height: 1000 });
    await expect.poll(() => page.locator("header.no-print").isVisible(), { timeout: 15_000 }).toBe(false);
    await expect.poll(() => page.getByRole("button", { name: "Print" }).isVisible(), { timeout: 15_000 }).toBe(false);
    // black on white when printed
    const colours = await sheet.evaluate((el) => [getComputedStyle(el).color, getComputedStyle(el.querySelector("h2")!).color]);
    expect(colours).toEqual(["rgb(0, 0, 0)", "rgb(0, 0, 0)"]);
    const wide = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(wide).toBeLessThanOrEqual(703);
    await shot(page, "run-sheet-print");

    // PDFs on A4 and Letter: a few pages, nothing cut at the side
    for (const format of ["A4", "Letter"] as const) {
      const pdf = await page.pdf({ format, printBackground: false, preferCSSPageSize: true });
      fs.writeFileSync(path.join(SHOTS, `run-sheet-${format.toLowerCase()}.pdf`), pdf);
      const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length;
      expect(pages).toBeGreaterThanOrEqual(1);
      expect(pages).toBeLessThanOrEqual(4);
    }
    await page.context().close();
  });

  it("a run that has started says its figures are kept as they stood", async () => {
    const page = await signInPage(browser, "operator@bramblecote.test");
    const { runs } = (await (await page.request.get(`${baseUrl()}/api/runs?from=${daysAgo(30)}`)).json()) as { runs: { id: number; status: string }[] };
    const started = runs.find((r) => r.status === "in-progress");
    expect(started, "the demo has a run in progress").toBeTruthy();
    await page.goto(`${baseUrl()}/runs/${started!.id}`);
    const note = page.getByTestId("plan-frozen-note");
    await note.waitFor();
    await shot(page, "run-started-kept-plan");
    expect(await note.textContent()).toMatch(/^These figures are kept as they stood on .+: later changes to the line, coatings, prices or part do not change a run that has started or was cancelled\.$/);
    expect(consoleErrors(page)).toEqual([]);
    await page.context().close();
  });

  it("a part too big for the line's window is refused with the reason, and the operator reads the sheet but cannot plan", async () => {
    const page = await signInPage(browser, "supervisor@bramblecote.test");
    await page.goto(`${baseUrl()}/runs`);
    await page.getByRole("button", { name: "Plan a run" }).click();
    // an untouched form is not marked red; trying to save marks what is missing and takes the keyboard there
    const form = page.getByRole("form", { name: "Plan a run" });
    await page.getByLabel("Part", { exact: true }).waitFor();
    expect(await form.locator(".field-error").count()).toBe(0);
    await page.getByRole("button", { name: "Save as draft" }).click();
    await form.getByText("Choose a part.").waitFor({ timeout: 15_000 });
    await form.getByText("Choose a line.").waitFor();
    await expect.poll(() => page.evaluate(() => document.activeElement?.id), { timeout: 15_000 }).toBe("run-part");
    await page.getByLabel("Part", { exact: true }).selectOption({ label: "BC-5020 · Bike-rack hoop, 48.3 mm tube" });
    await page.getByLabel("Quantity (parts)").fill("10");
    await page.getByLabel("Line", { exact: true }).selectOption({ label: "Line 1 — E-coat and powder" });
    await page.getByLabel("Coat 1 coating").selectOption({ label: "PP-410 · powder · Bramble Green" });
    await page.getByTestId("line-error").waitFor({ timeout: 15_000 });
    await expect.poll(() => page.getByTestId("line-error").textContent(), { timeout: 15_000 }).toMatch(/does not fit on Line 1 — E-coat and powder's carrier: The part .* is larger than the 500 × 1500 × 600 mm window/);
    await shot(page, "runs-plan-does-not-fit");
    await page.context().close();

    const operator = await signInPage(browser, "operator@bramblecote.test");
    await operator.getByRole("region", { name: "Today's runs" }).getByRole("link", { name: /BC-4105/ }).click();
    await operator.waitForURL(/\/runs\/\d+\/sheet$/);
    await operator.getByTestId("run-sheet").waitFor();
    await operator.goto(`${baseUrl()}/runs`);
    await operator.getByTestId("runs-table").waitFor();
    expect(await operator.getByRole("button", { name: "Plan a run" }).count()).toBe(0);
    await operator.goto(`${baseUrl()}/board`);
    await expect.poll(() => operator.getByRole("heading", { level: 1 }).textContent(), { timeout: 15_000 }).toBe("Not for your role");
    await operator.context().close();
  });
  it("planning a part that has a saved racking plan on the line says the plan decides the racking", async () => {
    // demo data: the bike-rack hoop has a saved racking plan on Line 2
    const page = await signInPage(browser, "supervisor@bramblecote.test");
    await page.goto(`${baseUrl()}/runs`);
    await page.getByRole("button", { name: "Plan a run" }).click();
    await page.getByLabel("Part", { exact: true }).selectOption({ label: "BC-5020 · Bike-rack hoop, 48.3 mm tube" });
    await page.getByLabel("Quantity (parts)").fill("40");
    await page.getByLabel("Line", { exact: true }).selectOption({ label: "Line 2 — Powder only" });
    await page.getByLabel("Day", { exact: true }).fill(today());
    await page.getByLabel("Coat 1 coating").selectOption({ label: "PP-410 · powder · Bramble Green" });
    await page.getByLabel("Coat 1 film (µm)").fill("80");
    const note = page.getByTestId("saved-plan-note");
    await note.waitFor({ timeout: 15_000 });
    expect(await note.getByRole("link", { name: /^Racking plan \d+$/ }).count()).toBe(1);
    await shot(page, "runs-plan-saved-racking");
    // a count set by hand wins over the saved plan: the note goes
    await page.getByLabel(/Parts per carrier, set by hand/).fill("3");
    await expect.poll(() => note.count(), { timeout: 15_000 }).toBe(0);
    await page.context().close();
  });
});
