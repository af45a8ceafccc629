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

const today = () => new Date().toISOString().slice(0, 10);
const consoleErrors = (page: Page) => (page as Page & { consoleErrors?: string[] }).consoleErrors ?? [];

/** "1,234.5 kg" → 1234.5 */
const kgOf = (text: string) => Number(text.replace(/[^0-9.]/g, ""));

async function stockShown(page: Page, code: string): Promise<number> {
  const cell = page.locator(`tr[data-coating="${code}"] td[data-stock]`);
  await cell.waitFor();
  return kgOf(await cell.innerText());
}

interface RunDetailBody {
  run: {
    id: number;
    partId: string;
    quantity: number;
    lineId: number;
    line: { name: string };
    shift: number;
    clearanceMm: number;
    orientations: "any" | "upright";
    coats: { coatingId: number; filmUm: number; firstPassEfficiency: number | null; reclaimEfficiency: number | null; coating: { kind: string; code: string } | null }[];
  };
}

interface ActualUseBody {
  actualUse: { quantity: number; coats: { coatIndex: number; kind: string; areaPerPartM2: number; targetFilmUm: number; measuredFilmUm: number | null; specificGravity: number | null }[] };
}

describe("forecast, purchasing and the actual-use feedback loop", () => {
  it("the purchaser sends a purchase request from the forecast, the supplier mail is captured, and receiving raises stock", async () => {
    const page = await signInPage(browser, "purchaser@bramblecote.test");
    await page.getByRole("region", { name: /Running out or expiring/ }).waitFor();
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Forecast" }).click();
    await page.waitForURL(`${baseUrl()}/forecast`);
    await page.getByRole("table", { name: "Material forecast" }).waitFor();
    await shot(page, "forecast-table");

    const code = "PP-420";
    const before = await stockShown(page, code);
    await page.getByLabel(`Order ${code}`).check();
    await page.getByLabel(`${code} containers to order`).fill("2");
    await page.getByRole("button", { name: "Send purchase requests" }).click();
    const sent = page.getByRole("status").filter({ hasText: /Sent PR-\d{4}-\d{4}/ });
    await sent.waitFor();
    const reference = (await sent.innerText()).match(/PR-\d{4}-\d{4}/)![0];
    await shot(page, "forecast-request-sent");

    // the SMTP fake captured the supplier's e-mail: read it from the admin outbox
    const admin = await signInPage(browser, "admin@bramblecote.test");
    const outbox = (await (await admin.request.get(`${baseUrl()}/api/admin/outbox`)).json()) as { messages: { subject: string; text: string; to: string }[] };
    const mail = outbox.messages.find((m) => m.subject.includes(reference));
    expect(mail, `mail for ${reference}`).toBeTruthy();
    expect(mail!.text).toMatch(new RegExp(`${code} .*: 2 × \\d+ kg`));

    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Purchasing" }).click();
    await page.waitForURL(`${baseUrl()}/purchase-requests`);
    const card = page.locator(`li[data-reference="${reference}"]`);
    await card.getByRole("button", { name: "Receive…" }).click();
    await card.getByLabel("Lot number").fill("E2E-LOT-1");
    await shot(page, "purchase-request-receive");
    await card.getByRole("button", { name: "Receive into stock" }).click();
    await card.locator('[data-status="received"]').waitFor();
    await shot(page, "purchase-request-received");

    await page.goto(`${baseUrl()}/forecast`);
    await page.getByRole("table", { name: "Material forecast" }).waitFor();
    const after = await stockShown(page, code);
    expect(after).toBeGreaterThan(before);
    expect(consoleErrors(page)).toEqual([]);
  });

  it("the operator records actual use on three done runs and the estimate shows measured beside nominal", async () => {
    const supervisor = await signInPage(browser, "supervisor@bramblecote.test");
    const list = (await (await supervisor.request.get(`${baseUrl()}/api/runs?from=${today()}`)).json()) as { runs: { id: number; line: { name: string }; coats: { coating: { kind: string } | null }[] }[] };
    const src = list.runs.find((r) => r.line.name.startsWith("Line 1") && r.coats.some((c) => c.coating?.kind === "powder"))!;
    expect(src).toBeTruthy();
    const { run } = (await (await supervisor.request.get(`${baseUrl()}/api/runs/${src.id}`)).json()) as RunDetailBody;
    const body = {
      partId: run.partId,
      quantity: 50,
      lineId: run.lineId,
      date: today(),
      shift: 3,
      clearanceMm: run.clearanceMm,
      orientations: run.orientations,
      coats: run.coats.map((c) => ({ coatingId: c.coatingId, filmUm: c.filmUm, firstPassEfficiency: c.firstPassEfficiency, reclaimEfficiency: c.reclaimEfficiency })),
      masking: "",
      notes: "actual-use check",
    };
    const ids: number[] = [];
    for (let i = 0; i < 3; i++) {
      const created = await supervisor.request.post(`${baseUrl()}/api/runs`, { data: body, headers: { origin: baseUrl() } });
      expect(created.status(), await created.text()).toBe(201);
      const id = ((await created.json()) as { run: { id: number } }).run.id;
      for (const status of ["planned", "in-progress", "done"]) {
        const moved = await supervisor.request.post(`${baseUrl()}/api/runs/${id}/status`, { data: { status }, headers: { origin: baseUrl() } });
        expect(moved.status(), await moved.text()).toBe(200);
      }
      ids.push(id);
    }

    const page = await signInPage(browser, "operator@bramblecote.test");
    // hand-picked utilisations; their mean 0.65 is what the estimate must show
    const targets = [0.6, 0.65, 0.7];
    for (const [i, id] of ids.entries()) {
      await page.goto(`${baseUrl()}/runs/${id}`);
      await page.getByRole("link", { name: "Actual use" }).click();
      await page.waitForURL(`${baseUrl()}/feedback/runs/${id}`);
      const use = (await (await page.request.get(`${baseUrl()}/api/runs/${id}/actual-use`)).json()) as ActualUseBody;
      const coat = use.actualUse.coats.find((c) => c.kind === "powder")!;
      // deposited kg = area × film × SG / 1000 (Products Finishing coverage); used = deposited / utilisation
      const deposited = (coat.areaPerPartM2 * use.actualUse.quantity * (coat.measuredFilmUm ?? coat.targetFilmUm) * coat.specificGravity!) / 1000;
      await page.getByLabel("Powder used (kg)").fill((deposited / targets[i]).toFixed(4));
      await page.getByRole("button", { name: "Save actual use" }).click();
      await page.getByRole("status").filter({ hasText: "Saved." }).waitFor();
      if (i === 0) await shot(page, "actual-use-first");
    }
    await page.locator("[data-measured]").filter({ hasText: "65.0 %" }).waitFor();
    await expect.poll(async () => page.locator("[data-nominal]").first().innerText()).toMatch(/\d+(\.\d)? %/);
    await shot(page, "actual-use-measured");

    await supervisor.goto(`${baseUrl()}/feedback`);
    await supervisor.locator("[data-measured]").filter({ hasText: "65.0 %" }).first().waitFor();
    await shot(supervisor, "utilisation-estimates");
    expect(consoleErrors(page)).toEqual([]);
  });
});
