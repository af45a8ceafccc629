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

const view = (page: Page) => page.getByTestId("rack-view");

async function drawCalls(page: Page): Promise<number> {
  return Number(await view(page).getAttribute("data-draw-calls"));
}

/** Waits until the 3D view shows `parts` parts and has drawn a frame since (software WebGL is slow). */
async function waitForScene(page: Page, parts: number): Promise<void> {
  await page.waitForFunction(
    (n) => {
      const el = document.querySelector("[data-testid=rack-view]");
      return el?.getAttribute("data-parts") === String(n) && Number(el.getAttribute("data-draw-calls")) > 0;
    },
    parts,
    { timeout: 30_000 },
  );
  // One more frame for instance matrices set in a layout effect after the first draw.
  await page.waitForTimeout(750);
}

async function fill(page: Page, values: Record<string, string>): Promise<void> {
  for (const [label, value] of Object.entries(values)) await page.getByLabel(label, { exact: true }).fill(value);
}

async function countIs(page: Page, n: number): Promise<void> {
  await page.waitForFunction((want) => document.querySelector("[data-testid=plan-count]")?.textContent === String(want), n, { timeout: 15_000 });
  // The card shows "Updating…" while a newer input is on its way; wait until it is the answer.
  await page.getByText("Updating…").waitFor({ state: "detached" });
}

describe("racking planner", () => {
  it("the supervisor plans a carrier, sees it in 3D, and the clearance changes the count", async () => {
    const page = await signInPage(browser, "supervisor@bramblecote.test");
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Racking" }).click();
    await page.waitForURL(`${baseUrl()}/racking`);
    await page.getByRole("heading", { level: 1, name: "Racking" }).waitFor();

    // Hand working (as in tests/api/rack.test.ts): a 200 × 100 × 300 mm part upright in a
    // 1000 × 1000 × 100 mm window: 5 along travel × 3 tiers × 1 across = 15, no clearance.
    await fill(page, {
      "Part length (mm)": "200",
      "Part width (mm)": "100",
      "Part height (mm)": "300",
      "Part mass (kg)": "1.5",
      "Window width, along travel (mm)": "1000",
      "Window height (mm)": "1000",
      "Window depth, across (mm)": "100",
      "Load limit (kg)": "100",
      "Clearance between parts (mm)": "0",
    });
    await countIs(page, 15);
    await expect.poll(() => page.getByTestId("plan-reason").textContent(), { timeout: 15_000 }).toBe(
      "Space limits the carrier to 15 parts: 5 along travel × 3 tiers × 1 across, no clearance.",
    );
    // The 3D view is fetched after the plan (three.js loads only here): wait for its canvas.
    await view(page).locator("canvas").waitFor({ timeout: 30_000 });
    expect(await view(page).locator("canvas").count()).toBe(1);
    await waitForScene(page, 15);
    expect(await drawCalls(page)).toBeGreaterThan(0);
    await expect.poll(() => page.getByTestId("summary-count").textContent(), { timeout: 15_000 }).toBe("15");
    // Tiers in the printable list: lower faces at 0, 300 and 600 mm, five parts each.
    const tiers = await page.getByTestId("tier-table").locator("tbody tr").allTextContents();
    expect(tiers).toEqual(["10 mm5300 mm", "2300 mm5300 mm", "3600 mm5300 mm"]);

    // 50 mm clearance: 4 along travel (4·200 + 3·50 = 950 ≤ 1000) × 3 tiers = 12.
    await fill(page, { "Clearance between parts (mm)": "50" });
    await countIs(page, 12);
    await waitForScene(page, 12);
    const before = await drawCalls(page);
    await page.getByLabel("Show clearance").check();
    await page.waitForFunction((n) => Number(document.querySelector("[data-testid=rack-view]")?.getAttribute("data-draw-calls")) > n, before);
    await page.getByRole("button", { name: "Front" }).click();
    await page.waitForTimeout(500);
    await shot(page, "racking-clearance");
    await view(page).screenshot({ path: `${SHOTS}/racking-clearance-view.png` });

    // A load limit of 10 kg keeps 6 of the 12 parts: floor(10 / 1.5) = 6.
    await fill(page, { "Load limit (kg)": "10" });
    await countIs(page, 6);
    await page.getByText("limited by load").waitFor();

    // Per line, from a seeded conveyor line when the lines capability answers: the window and
    // load fill in, and 3 m/min at 0.6 m pitch is 3 × 60 / 0.6 = 300 carriers/h (carriers per
    // hour = speed × 60 / pitch, REFERENCES "Conveyor lines and ovens").
    const picker = page.getByLabel("Take the window from a line");
    if ((await picker.count()) > 0) {
      await picker.selectOption({ label: "Line 1 — E-coat and powder (conveyor carrier)" });
      await expect.poll(() => page.getByLabel("Window width, along travel (mm)").inputValue(), { timeout: 15_000 }).toBe("500");
      await expect.poll(() => page.getByLabel("Load limit (kg)").inputValue(), { timeout: 15_000 }).toBe("45");
      await expect.poll(() => page.getByLabel("Line speed (m/min)").inputValue(), { timeout: 15_000 }).toBe("3");
      await expect.poll(() => page.getByLabel("Carrier pitch (m)").inputValue(), { timeout: 15_000 }).toBe("0.6");
      await page.getByTestId("per-line-result").getByText("300", { exact: true }).waitFor();
      await fill(page, { "Window width, along travel (mm)": "1000", "Window height (mm)": "1000", "Window depth, across (mm)": "100" });
    } else {
      console.log("racking e2e: /api/lines not available, line picker not shown");
    }

    // A clearance larger than the window is named on the field (the API refuses it too).
    await fill(page, { "Load limit (kg)": "100", "Clearance between parts (mm)": "5000" });
    await page.getByText("The clearance is larger than every side of the window.").waitFor();
    await page.context().close();
  });

  it("a plan of 4,000 small parts stays within 5 draw calls, and hover names a part", async () => {
    const page = await signInPage(browser, "supervisor@bramblecote.test");
    await page.goto(`${baseUrl()}/racking`);
    // 50 mm cubes in a 1000 × 1000 × 500 mm window: 20 × 20 × 10 = 4000; 400 kg ≤ 1000 kg.
    await fill(page, {
      "Part length (mm)": "50",
      "Part width (mm)": "50",
      "Part height (mm)": "50",
      "Part mass (kg)": "0.1",
      "Window width, along travel (mm)": "1000",
      "Window height (mm)": "1000",
      "Window depth, across (mm)": "500",
      "Load limit (kg)": "1000",
      "Clearance between parts (mm)": "0",
    });
    await countIs(page, 4000);
    // 1 mm long: 1000 × 20 × 10 = 200,000 parts, refused by the API as a likely unit mistake.
    await fill(page, { "Part length (mm)": "1" });
    await page.getByRole("alert").getByText(/More than 10000 parts would fit on one carrier/).waitFor();
    await fill(page, { "Part length (mm)": "50" });
    await countIs(page, 4000);
    await waitForScene(page, 4000);
    const calls = await drawCalls(page);
    console.log(`racking e2e: 4000 parts drawn in ${calls} draw calls`);
    expect(calls).toBeGreaterThan(0);
    expect(calls).toBeLessThanOrEqual(5);

    const box = (await view(page).boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.getByText(/^Part \d+ of 4000: corner at x/).waitFor({ timeout: 15_000 });
    await page.waitForTimeout(500);
    expect(await drawCalls(page)).toBeLessThanOrEqual(5);
    await shot(page, "racking-4000");
    // The one 400 is the refused 200,000-part plan above; nothing else may log an error.
    const errors = ((page as Page & { consoleErrors?: string[] }).consoleErrors ?? []).filter((e) => !e.includes("status of 400"));
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it("the manager works in inches and pounds", async () => {
    const page = await signInPage(browser, "manager@bramblecote.test");
    await page.goto(`${baseUrl()}/racking`);
    // The opening example is 300 × 200 × 100 mm = 11.81 × 7.874 × 3.937 in (1 in = 25.4 mm).
    await expect.poll(() => page.getByLabel("Part length (in)", { exact: true }).inputValue(), { timeout: 15_000 }).toBe("11.81");
    await expect.poll(() => page.getByLabel("Part mass (lb)", { exact: true }).inputValue(), { timeout: 15_000 }).toBe("2.646");
    await page.getByTestId("plan-count").waitFor();
    await expect.poll(() => page.getByTestId("plan-reason").textContent(), { timeout: 15_000 }).toMatch(/in clearance|no clearance/);
    await page.getByText("Updating…").waitFor({ state: "detached" });
    const count = Number(await page.getByTestId("plan-count").textContent());
    expect(count).toBeGreaterThan(0);
    const result = page.getByTestId("per-line-result");

    // 10 ft/min at 24 in (2 ft) pitch → 300 carriers/h (REFERENCES: conveyor worked example).
    await fill(page, { "Line speed (ft/min)": "10", "Carrier pitch (ft)": "2" });
    await expect.poll(() => result.locator("dd").nth(0).textContent(), { timeout: 15_000 }).toBe("300");
    await expect.poll(() => result.locator("dd").nth(1).textContent(), { timeout: 15_000 }).toBe((300 * count).toLocaleString("en-US"));

    // Batch oven, hand working (common practice, no source): 10 + 15 + 10 + 10 = 45 min a cycle;
    // an 8 h shift holds floor(480 / 45) = 10 whole cycles of 4 racks.
    await page.getByLabel("Batch oven").check();
    await fill(page, { "Racks per load": "4", "Loading (min)": "10", "Heat-up (min)": "15", "Hold at cure (min)": "10", "Unloading (min)": "10", "Shift (h)": "8" });
    await expect.poll(() => result.locator("dd").nth(1).textContent(), { timeout: 15_000 }).toBe("45 min");
    await expect.poll(() => result.locator("dd").nth(2).textContent(), { timeout: 15_000 }).toBe("10 (whole cycles in 8 h)");
    await expect.poll(() => result.locator("dd").nth(3).textContent(), { timeout: 15_000 }).toBe((40 * count).toLocaleString("en-US"));
    await shot(page, "racking-us-units");
    await view(page).screenshot({ path: `${SHOTS}/racking-us-units-view.png` });
    await page.context().close();
  });
});
