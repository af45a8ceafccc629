import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import path from "node:path";
import { baseUrl, launch, shot, signInPage, SHOTS } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** The number at the start of a result cell ("64.07 ft²/lb" → 64.07). */
async function numberIn(cell: Locator): Promise<number> {
  const text = (await cell.textContent()) ?? "";
  const m = text.replace(/[$,]/g, "").match(/-?\d+(\.\d+)?/);
  if (!m) throw new Error(`no number in "${text}"`);
  return Number(m[0]);
}

function near(actual: number, expected: number, relTol: number) {
  expect(Math.abs(actual - expected) / Math.abs(expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(relTol);
}

async function openCalculators(role: string): Promise<Page> {
  const page = await signInPage(browser, `${role}@bramblecote.test`);
  await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Calculators" }).click();
  await page.waitForURL(`${baseUrl()}/calculators`);
  await page.getByRole("heading", { level: 1, name: "Calculators" }).waitFor();
  return page;
}

describe("calculators page", () => {
  it("powder in US units, then metric: the entered values and the result convert", async () => {
    const page = await openCalculators("supervisor");
    const powder = page.getByRole("region", { name: "Powder use" });
    await page.getByText("US customary", { exact: true }).click();
    await powder.getByLabel("Coated area per part").fill("10");
    await powder.getByLabel("Film build").fill("2");
    await powder.getByLabel("Specific gravity").fill("1.5");
    await powder.getByLabel("First-pass transfer efficiency").fill("60");
    await powder.getByLabel("Overspray reclaimed").fill("0");
    await powder.getByLabel("Parts", { exact: true }).fill("50");
    await powder.getByLabel("Powder price").fill("8");
    // the units beside each box are the US ones
    await expect.poll(() => powder.getByText("(ft²)").count(), { timeout: 15_000 }).toBeGreaterThan(0);
    await expect.poll(() => powder.getByText("(mil)").count(), { timeout: 15_000 }).toBeGreaterThan(0);

    const theoretical = powder.getByTestId("powder-theoretical");
    await expect.poll(() => theoretical.textContent(), { timeout: 15_000 }).toMatch(/ft²\/lb$/);
    // source: Products Finishing, "Coverage of Powder": ft²/lb = 192.3 / (SG × mil) = 192.3 / 3 = 64.1
    near(await numberIn(theoretical), 192.3 / (1.5 * 2), 1e-3);
    // hand working: 64.07 × 0.6 = 38.44 ft²/lb; 10 ft² / 38.44 = 0.2601 lb per part; × 50 = 13.01 lb; × $8 = $104.07
    await expect.poll(() => powder.getByTestId("powder-total").textContent(), { timeout: 15_000 }).toMatch(/ lb$/);
    near(await numberIn(powder.getByTestId("powder-total")), (50 * 10) / ((192.2 / 3) * 0.6), 2e-3);
    near(await numberIn(powder.getByTestId("powder-cost")), (8 * 50 * 10) / ((192.2 / 3) * 0.6), 2e-3);
    await shot(page, "calculators-powder-us");

    await page.getByText("Metric", { exact: true }).click();
    // 2 mil = 50.8 µm and 10 ft² = 0.92903 m² (NIST SP 811, exact factors)
    await expect.poll(() => powder.getByLabel("Film build").inputValue(), { timeout: 15_000 }).toBe("50.8");
    await expect.poll(() => powder.getByLabel("Coated area per part").inputValue(), { timeout: 15_000 }).toBe("0.92903");
    await expect.poll(() => theoretical.textContent(), { timeout: 15_000 }).toMatch(/m²\/kg$/);
    // source: REFERENCES.md, m²/kg = 1000 / (SG × µm) = 1000 / (1.5 × 50.8) = 13.12
    near(await numberIn(theoretical), 1000 / (1.5 * 50.8), 5e-4);
    // 13.01 lb = 5.902 kg (1 lb = 0.45359237 kg); the cost does not move with the units
    near(await numberIn(powder.getByTestId("powder-total")), ((50 * 10) / ((192.2 / 3) * 0.6)) * 0.45359237, 2e-3);
    near(await numberIn(powder.getByTestId("powder-cost")), (8 * 50 * 10) / ((192.2 / 3) * 0.6), 2e-3);
    await shot(page, "calculators-powder-metric");

    // field-level validation in the displayed units: 150 % is refused with what to enter
    const fpe = powder.getByLabel("First-pass transfer efficiency");
    await fpe.fill("150");
    await expect.poll(() => fpe.getAttribute("aria-invalid"), { timeout: 15_000 }).toBe("true");
    await powder.getByText("Enter a number greater than 0 and at most 100 %.").waitFor();
    await powder.getByText("Correct the marked fields").waitFor();
    await powder.screenshot({ path: path.join(SHOTS, "calculators-powder-invalid-section.png") });
    await fpe.fill("abc");
    await powder.getByText("“abc” is not a number").waitFor();
    await fpe.fill("60");
    await expect.poll(() => fpe.getAttribute("aria-invalid"), { timeout: 15_000 }).toBeNull();
    await powder.getByText("combustible dust", { exact: false }).first().waitFor();

    // the cure section refuses a target at the air temperature, in °F after a flip
    await page.getByText("US customary", { exact: true }).click();
    const cure = page.getByRole("region", { name: "Cure and metal heat-up" });
    await cure.getByLabel("Oven air temperature").fill("400");
    await cure.getByLabel("Cure metal temperature").fill("400");
    await expect.poll(() => cure.getByLabel("Cure metal temperature").getAttribute("aria-invalid"), { timeout: 15_000 }).toBe("true");
    await cure.getByText("Enter a target below the oven air temperature", { exact: false }).waitFor();
    await cure.getByLabel("Cure metal temperature").fill("380");
    await cure.getByTestId("cure-total").waitFor();

    // line throughput: 10 ft/min at 24 in → 300 carriers/h (REFERENCES.md worked example)
    const line = page.getByRole("region", { name: "Line throughput" });
    await line.getByLabel("Line speed").fill("10");
    await line.getByLabel("Carrier pitch").fill("24");
    await expect.poll(() => line.getByTestId("line-carriers").textContent(), { timeout: 15_000 }).toBe("300");

    expect((page as Page & { consoleErrors?: string[] }).consoleErrors ?? []).toEqual([]);
    await page.context().close();
  });

  it("film: pasted readings with a bad cell, then a failing spot explained", async () => {
    const page = await openCalculators("operator");
    const film = page.getByRole("region", { name: "Film thickness acceptance" });
    await film.getByText("Paste gauge readings or load a CSV file").waitFor();
    await film.getByLabel("Specified minimum").fill("60");
    await film.getByLabel("Specified maximum").fill("90");
    const box = film.getByLabel("Gauge readings");
    // what a paste of a spreadsheet block gives: tabs between cells, a title row, a typo "7O"
    await box.fill("R1\tR2\tR3\n70\t72\t71\n68\t75\t70\n40\t45\t44\n72\t7O\t74\n71\t69\t73");
    await film.getByText("Line 5, cell 2: “7O” is not a number.").waitFor();
    await expect.poll(() => box.getAttribute("aria-invalid"), { timeout: 15_000 }).toBe("true");
    await shot(page, "calculators-film-bad-cell");
    await film.screenshot({ path: path.join(SHOTS, "calculators-film-bad-cell-section.png") });

    await box.fill("R1\tR2\tR3\n70\t72\t71\n68\t75\t70\n40\t45\t44\n72\t70\t74\n71\t69\t73");
    await expect.poll(() => box.getAttribute("aria-invalid"), { timeout: 15_000 }).toBeNull();
    // source: SSPC-PA 2 default restriction: no spot below 80 % of the minimum (0.8 × 60 = 48 µm);
    // spot 3 averages (40 + 45 + 44) / 3 = 43 µm; the area averages 65.6 µm, inside 60–90
    await expect.poll(() => film.getByTestId("film-verdict").textContent(), { timeout: 15_000 }).toBe("Fail");
    await expect.poll(() => film.getByTestId("film-reasons").textContent(), { timeout: 15_000 }).toContain("Area 1, spot 3 at 43 µm is below 80 % of the 60 µm minimum (48 µm).");
    await film.getByRole("row").filter({ hasText: "below 80 % of the minimum" }).waitFor();
    await expect.poll(() => film.getByRole("row").filter({ hasText: "below 80 % of the minimum" }).count(), { timeout: 15_000 }).toBe(1);
    await film.scrollIntoViewIfNeeded();
    await shot(page, "calculators-film-fail");
    await film.screenshot({ path: path.join(SHOTS, "calculators-film-fail-section.png") });

    // in US units the same readings are re-shown in mil and the explanation follows
    await page.getByText("US customary", { exact: true }).click();
    await expect.poll(() => box.inputValue(), { timeout: 15_000 }).toContain("1.5748\t1.77165\t1.73228");
    await expect.poll(() => film.getByTestId("film-reasons").textContent(), { timeout: 15_000 }).toContain("spot 3 at 1.69 mil is below 80 % of the 2.36 mil minimum (1.89 mil)");
    await page.getByText("Metric", { exact: true }).click();
    // back in µm the text is exactly what was pasted
    await expect.poll(() => box.inputValue(), { timeout: 15_000 }).toBe("R1\tR2\tR3\n70\t72\t71\n68\t75\t70\n40\t45\t44\n72\t70\t74\n71\t69\t73");

    // a CSV file loads through the same parser; ISO 19840 on a flat list that passes
    await film.getByRole("radio", { name: /ISO 19840/ }).check();
    await film.getByLabel("Nominal thickness").fill("70");
    await film.getByTestId("film-file").setInputFiles({
      name: "gauge-export.csv",
      mimeType: "text/csv",
      // source: ISO 19840 80–20 rule: mean 77 ≥ 70; 63 and 65 are ≥ 56 (80 %); 2 of 10 = 20 % below nominal
      buffer: Buffer.from("reading\n75\n80\n63\n78\n82\n65\n79\n81\n85\n82\n"),
    });
    await film.getByText("Loaded gauge-export.csv").waitFor();
    await expect.poll(() => film.getByTestId("film-verdict").textContent(), { timeout: 15_000 }).toBe("Pass");
    await expect.poll(() => film.getByTestId("film-mean").textContent(), { timeout: 15_000 }).toBe("77 µm");
    expect((page as Page & { consoleErrors?: string[] }).consoleErrors ?? []).toEqual([]);
    await page.context().close();
  });

  it("shows the safety notes and a source line for each calculator", async () => {
    const page = await openCalculators("engineer");
    for (const title of ["Powder booth safety", "E-coat tank safety", "Oven safety"]) {
      await page.getByRole("complementary", { name: title }).waitFor();
    }
    await page.getByText("NFPA 652").first().waitFor();
    await page.getByText("1910.147", { exact: false }).first().waitFor();
    await page.getByText("NFPA 86", { exact: false }).first().waitFor();
    await expect.poll(() => page.getByText("How this is computed:").count(), { timeout: 15_000 }).toBe(5);
    await shot(page, "calculators-page");
    await page.context().close();
  });
});
