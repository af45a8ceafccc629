import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { baseUrl, launch, shot, signInPage } from "./browser";

let browser: Browser;
let dir: string;
beforeAll(async () => {
  browser = await launch();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "coatwright-parts-e2e-"));
});
afterAll(async () => {
  await browser?.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

/**
 * A closed box (0,0,0)–(x,y,z) whose faces are split into n × n squares: the same area and
 * volume as a plain box, but 12·n² triangles, so the upload is big enough to watch.
 */
function gridBoxStl(x: number, y: number, z: number, n: number): Buffer {
  const tris: number[] = [];
  const face = (origin: number[], u: number[], v: number[]) => {
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const p = (a: number, b: number) => origin.map((o, k) => o + (u[k] * a) / n + (v[k] * b) / n);
        const a = p(i, j), b = p(i + 1, j), c = p(i + 1, j + 1), d = p(i, j + 1);
        tris.push(...a, ...b, ...c, ...a, ...c, ...d);
      }
    }
  };
  // each face's u × v points outward
  face([0, 0, 0], [0, y, 0], [x, 0, 0]); // bottom
  face([0, 0, z], [x, 0, 0], [0, y, 0]); // top
  face([0, 0, 0], [x, 0, 0], [0, 0, z]); // front
  face([0, y, 0], [0, 0, z], [x, 0, 0]); // back
  face([0, 0, 0], [0, 0, z], [0, y, 0]); // left
  face([x, 0, 0], [0, y, 0], [0, 0, z]); // right
  const count = tris.length / 9;
  const buf = Buffer.alloc(84 + 50 * count);
  buf.write("grid box for the parts browser test", 0, "ascii");
  buf.writeUInt32LE(count, 80);
  for (let t = 0; t < count; t++) for (let k = 0; k < 9; k++) buf.writeFloatLE(tris[9 * t + k], 84 + 50 * t + 12 + 4 * k);
  return buf;
}

/** Failed requests the test provokes on purpose (the refused import) log a console error. */
function unexpectedErrors(page: Page): string[] {
  const errors = (page as Page & { consoleErrors?: string[] }).consoleErrors ?? [];
  return errors.filter((e) => !/status of 400/.test(e));
}

async function partCount(page: Page): Promise<number> {
  return page.evaluate(async () => ((await (await fetch("/api/parts")).json()) as { parts: unknown[] }).parts.length);
}

describe("parts catalogue", () => {
  it("the engineer uploads an STL, confirms its unit, sees area, volume and 3D, and saves the part", async () => {
    const page = await signInPage(browser, "engineer@bramblecote.test");
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Parts" }).click();
    await page.waitForURL(`${baseUrl()}/parts`);
    await page.getByTestId("parts-table").waitFor();
    expect(await page.getByTestId("parts-table").locator("tbody tr").count()).toBe(6);
    await shot(page, "parts-list");

    await page.getByRole("link", { name: "Create part" }).click();
    await page.waitForURL(`${baseUrl()}/parts/new`);
    await page.getByLabel("Part number").fill("BC-7001");
    await page.getByLabel("Name", { exact: true }).fill("Test mounting block");
    // the figures panel says what it still waits for
    await expect.poll(() => page.getByRole("region", { name: "Figures" }).textContent(), { timeout: 15_000 }).toMatch(/Upload the STL file and fill in .*section thickness.* to see its figures\./);
    await page.getByLabel("Section thickness (mm)").fill("25.4");

    // A 4 × 2 × 1 in block drawn in inches, 120 000 triangles (6 MB); sent as millimetres by mistake.
    const file = path.join(dir, "mounting-block.stl");
    fs.writeFileSync(file, gridBoxStl(4, 2, 1, 100));
    await page.getByLabel("STL file (binary or text)").setInputFiles(file);
    await page.getByLabel("millimetres").check();

    // Slow the upload so the progress bar can be watched (Chromium's network emulation, ~1.5 MB/s).
    const cdp = await page.context().newCDPSession(page);
    await cdp.send("Network.enable");
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: 1.5 * 1024 * 1024 });
    await page.getByRole("button", { name: "Upload and measure" }).click();
    const progress = page.getByTestId("upload-progress");
    await progress.first().waitFor({ timeout: 10_000 });
    const seen: number[] = [];
    for (let i = 0; i < 40 && seen.length < 3; i++) {
      const value = await progress
        .first()
        .evaluate((el) => (el as HTMLProgressElement).value / (el as HTMLProgressElement).max)
        .catch(() => null);
      if (value !== null && value > 0 && value < 1 && !seen.includes(value)) seen.push(value);
      await page.waitForTimeout(150);
    }
    await shot(page, "parts-upload-progress");
    expect(seen.length).toBeGreaterThanOrEqual(2);
    expect([...seen].sort((a, b) => a - b)).toEqual(seen); // it only moves forward
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

    // Read as mm the block is only 4 mm long: the form asks to check the unit.
    const check = page.getByTestId("unit-check");
    await check.waitFor({ timeout: 30_000 });
    await expect.poll(() => check.textContent(), { timeout: 15_000 }).toMatch(/only 4 mm/);
    await expect.poll(() => page.getByRole("button", { name: "Save part" }).isDisabled(), { timeout: 15_000 }).toBe(true);
    await shot(page, "parts-unit-check");
    await check.getByRole("button", { name: "It was drawn in inches" }).click();
    await check.waitFor({ state: "detached" });

    // 1 in = 25.4 mm (NIST SP 811): 2(8 + 4 + 2) = 28 in² = 0.018 064 48 m²; 8 in³ = 0.131 096 512 L.
    await page.waitForFunction(() => document.querySelector("[data-testid=mesh-area]")?.textContent === "0.01806 m²", null, { timeout: 15_000 });
    await expect.poll(() => page.getByTestId("mesh-volume").textContent(), { timeout: 15_000 }).toBe("0.1311 L");
    await expect.poll(() => page.getByTestId("mesh-box").textContent(), { timeout: 15_000 }).toBe("101.6 × 50.8 × 25.4 mm");

    // The 3D preview loads on its own (three.js fetched only now) and draws a canvas.
    const preview = page.getByTestId("part-preview");
    await page.waitForFunction(() => document.querySelector("[data-testid=part-preview]")?.getAttribute("data-state") === "ready", null, { timeout: 30_000 });
    expect(await preview.locator("canvas").count()).toBe(1);
    // steel 7850 kg/m³ × 131.1 cm³ = 1.029 kg
    await page.waitForFunction(() => document.querySelector("[data-testid=live-mass]")?.textContent === "1.029 kg", null, { timeout: 15_000 });
    await expect.poll(() => page.getByTestId("live-area").textContent(), { timeout: 15_000 }).toBe("0.01806 m²");
    await page.waitForTimeout(500);
    await shot(page, "parts-upload-measured");

    await page.getByRole("button", { name: "Save part" }).click();
    await page.waitForURL(/\/parts\/[0-9a-f-]{36}$/);
    await page.getByRole("heading", { level: 1 }).waitFor();
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent(), { timeout: 15_000 }).toBe("BC-7001 · Test mounting block");
    await expect.poll(() => page.getByTestId("part-coated").textContent(), { timeout: 15_000 }).toBe("0.01806 m²");
    await expect.poll(() => page.getByTestId("part-mass").textContent(), { timeout: 15_000 }).toBe("1.029 kg");
    await page.waitForFunction(() => document.querySelector("[data-testid=part-preview]")?.getAttribute("data-state") === "ready", null, { timeout: 30_000 });
    await page.waitForTimeout(500);
    await shot(page, "parts-detail-mesh");
    expect(unexpectedErrors(page)).toEqual([]);
    await page.context().close();
  });

  it("a template part shows its area live while the dimensions are typed", async () => {
    const page = await signInPage(browser, "engineer@bramblecote.test");
    await page.goto(`${baseUrl()}/parts/new`);
    await page.getByRole("radio", { name: /^Shape template/ }).check();
    await page.getByLabel("Shape", { exact: true }).selectOption("flat-plate");
    await page.getByLabel("Length (mm)", { exact: true }).fill("1000");
    await page.getByLabel("Width (mm)", { exact: true }).fill("500");
    await page.getByLabel("Thickness (mm)", { exact: true }).fill("3");
    // 2·1000·500 + 2(1000 + 500)·3 = 1 009 000 mm² (both faces and the edges; common practice)
    await page.waitForFunction(() => document.querySelector("[data-testid=live-area]")?.textContent === "1.009 m²", null, { timeout: 15_000 });
    // 1000·500·3 mm³ = 1.5 L × 7850 kg/m³ = 11.78 kg; the thickness also filled the section thickness
    await expect.poll(() => page.getByTestId("live-mass").textContent(), { timeout: 15_000 }).toBe("11.78 kg");
    await expect.poll(() => page.getByLabel("Section thickness (mm)").inputValue(), { timeout: 15_000 }).toBe("3");
    await page.getByRole("radio", { name: /^Formula/ }).check();
    await page.getByLabel("Value of L (mm)").fill("100");
    await page.getByLabel("Value of W (mm)").fill("50");
    await page.getByLabel("Value of H (mm)").fill("20");
    await page.getByLabel("Length (x) (mm)").fill("100");
    await page.getByLabel("Width (y) (mm)").fill("50");
    await page.getByLabel("Height (z) (mm)").fill("20");
    // hand working: 2(100·50 + 100·20 + 50·20) = 16 000 mm²
    await page.waitForFunction(() => document.querySelector("[data-testid=live-area]")?.textContent === "0.016 m²", null, { timeout: 15_000 });
    await page.getByLabel("Area formula", { exact: true }).fill("2*(L*W + Q)");
    await page.getByText(/Unknown name "Q"/).first().waitFor({ timeout: 15_000 });
    await shot(page, "parts-formula-error");
    await page.context().close();
  });

  it("an entered area too large for the part's box is flagged beside the mass", async () => {
    const page = await signInPage(browser, "engineer@bramblecote.test");
    await page.goto(`${baseUrl()}/parts/new`);
    await page.getByLabel("Enter the area").check();
    await page.getByLabel("Section thickness (mm)").fill("2");
    await page.getByLabel("Outside area (m²)").fill("2");
    for (const l of ["Length (x) (mm)", "Width (y) (mm)", "Height (z) (mm)"]) await page.getByLabel(l).fill("100");
    // ½ × 2 m² × 2 mm × 7850 kg/m³ = 15.7 kg against a solid 100 mm steel cube of 7.85 kg (hand working)
    const flag = page.getByTestId("mass-implausible");
    await expect.poll(() => flag.textContent(), { timeout: 15_000 }).toMatch(/more than a solid block .* \(7\.85 kg\)/);
    await page.getByLabel("Outside area (m²)").fill("0.06");
    await expect.poll(() => flag.count(), { timeout: 15_000 }).toBe(0);
    await page.context().close();
  });

  it("a CSV with one bad row is refused with that row's number and reason; the valid rows only on request", async () => {
    const page = await signInPage(browser, "engineer@bramblecote.test");
    const before = await partCount(page);
    await page.goto(`${baseUrl()}/parts/import`);
    const csv = [
      "number,name,customer,material,thicknessMm,areaOrigin,areaM2,templateId,dimensionsMm,lengthMm,widthMm,heightMm",
      "CSV-1,Gate hinge plate,Hedgerow Fencing Co.,steel,5,template,,flat-plate,lengthMm=120;widthMm=60;thicknessMm=5,,,",
      "CSV-2,Gate latch,Hedgerow Fencing Co.,steel,3,manual,-0.2,,,80,40,30",
      "CSV-3,Gate post cap,Hedgerow Fencing Co.,steel,2,manual,0.03,,,110,110,40",
    ].join("\n");
    const file = path.join(dir, "gate-parts.csv");
    fs.writeFileSync(file, csv);
    await page.getByLabel("CSV file").setInputFiles(file);
    await page.getByTestId("import-rows").waitFor({ timeout: 15_000 });
    await expect.poll(() => page.getByTestId("import-summary").textContent(), { timeout: 15_000 }).toMatch(/3 rows: 2 valid, 1 with problems/);
    const bad = page.locator("[data-testid=import-rows] tr[data-valid=false]");
    expect(await bad.count()).toBe(1);
    await expect.poll(() => bad.getAttribute("data-row"), { timeout: 15_000 }).toBe("3");
    await expect.poll(() => bad.textContent(), { timeout: 15_000 }).toMatch(/Row 3, areaM2: Enter the outside area as a number above 0/);

    await page.getByRole("button", { name: "Import all 3 rows" }).click();
    const refused = page.getByTestId("import-refused");
    await refused.waitFor({ timeout: 15_000 });
    await expect.poll(() => refused.textContent(), { timeout: 15_000 }).toMatch(/Nothing was imported: 1 of 3 rows have problems\. Row 3: areaM2/);
    expect(await partCount(page)).toBe(before);
    await shot(page, "parts-import-refused");

    await page.getByRole("button", { name: "Import only the 2 valid rows" }).click();
    await page.getByTestId("import-done").waitFor({ timeout: 15_000 });
    await expect.poll(() => page.getByTestId("import-done").textContent(), { timeout: 15_000 }).toMatch(/Imported 2 parts; 1 row was left out/);
    expect(await partCount(page)).toBe(before + 2);
    await shot(page, "parts-import-done");

    // the same file again: the two imported numbers are now taken, until updating is ticked
    await page.reload();
    const fixed = csv.replace("CSV-1,Gate hinge plate", "CSV-1,Gate hinge plate (heavy)").replace("manual,-0.2", "manual,0.02");
    fs.writeFileSync(file, fixed);
    await page.getByLabel("CSV file").setInputFiles(file);
    await expect.poll(() => page.getByTestId("import-summary").textContent(), { timeout: 15_000 }).toMatch(/3 rows: 1 valid, 2 with problems/);
    await expect.poll(() => page.locator("[data-testid=import-rows] tr[data-row='2']").textContent(), { timeout: 15_000 }).toMatch(/already in the catalogue/);
    await page.getByLabel("Update parts already in the catalogue").check();
    await expect.poll(() => page.getByTestId("import-summary").textContent(), { timeout: 15_000 }).toMatch(/3 rows: 3 valid \(1 new, 2 updating a part\)/);
    await expect.poll(() => page.locator("[data-testid=import-rows] tr[data-row='2']").textContent(), { timeout: 15_000 }).toMatch(/OK, updates this part/);
    await shot(page, "parts-import-update-preview");
    await page.getByRole("button", { name: "Import all 3 rows" }).click();
    await expect.poll(() => page.getByTestId("import-done").textContent(), { timeout: 15_000 }).toMatch(/Imported 3 parts \(1 new, 2 updated\)/);
    expect(await partCount(page)).toBe(before + 3);
    const { parts } = (await (await page.request.get(`${baseUrl()}/api/parts`)).json()) as { parts: { number: string; name: string }[] };
    expect(parts.find((p) => p.number === "CSV-1")?.name).toBe("Gate hinge plate (heavy)");
    await page.context().close();
  });

  it("racking takes a part from the catalogue: its box, mass and mesh", async () => {
    const page = await signInPage(browser, "supervisor@bramblecote.test");
    await page.goto(`${baseUrl()}/racking`);
    await page.getByLabel("Take the part from the catalogue").selectOption({ label: "BC-5020 · Bike-rack hoop, 48.3 mm tube" });
    // the hoop's mesh box: x 648.3 → length, y 48.3 → width, z 974.15 → height
    await expect.poll(() => page.getByLabel("Part length (mm)", { exact: true }).inputValue(), { timeout: 15_000 }).toBe("648.3");
    await expect.poll(() => page.getByLabel("Part width (mm)", { exact: true }).inputValue(), { timeout: 15_000 }).toBe("48.3");
    await expect.poll(() => page.getByLabel("Part height (mm)", { exact: true }).inputValue(), { timeout: 15_000 }).toBe("974.2");
    await page.getByText("The 3D view draws the part's own shape while the box matches it.").waitFor({ timeout: 30_000 });
    await page.getByTestId("rack-view").locator("canvas").waitFor({ timeout: 30_000 });
    await page.waitForTimeout(1000);
    await shot(page, "racking-catalogue-part");
    await page.context().close();
  });

  it("a US-units reader sees a part in ft², lb and inches", async () => {
    const page = await signInPage(browser, "purchaser@bramblecote.test");
    await page.goto(`${baseUrl()}/parts`);
    await page.getByRole("link", { name: "BC-4105" }).click();
    await page.getByTestId("part-coated").waitFor();
    // 1.404 784 m² ÷ 0.092 903 04 m²/ft² = 15.12 ft²; 21.848 kg ÷ 0.453 592 37 kg/lb = 48.17 lb (NIST SP 811)
    await expect.poll(() => page.getByTestId("part-coated").textContent(), { timeout: 15_000 }).toBe("15.12 ft²");
    await expect.poll(() => page.getByTestId("part-mass").textContent(), { timeout: 15_000 }).toBe("48.17 lb");
    // 800 mm ÷ 25.4 = 31.5 in
    await page.getByText("31.5 in", { exact: true }).first().waitFor();
    await shot(page, "parts-detail-us");
    await page.context().close();
  });

  it("an operator reads the catalogue but gets no create or import buttons", async () => {
    const page = await signInPage(browser, "operator@bramblecote.test");
    await page.goto(`${baseUrl()}/parts`);
    await page.getByTestId("parts-table").waitFor();
    expect(await page.getByRole("link", { name: "Create part" }).count()).toBe(0);
    expect(await page.getByRole("link", { name: "Import CSV" }).count()).toBe(0);
    expect(await page.getByRole("link", { name: "Export CSV" }).count()).toBe(1);
    await page.goto(`${baseUrl()}/parts/new`);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent(), { timeout: 15_000 }).toBe("Not for your role");
    await page.context().close();
  });
});
