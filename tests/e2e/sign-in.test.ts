import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { baseUrl, launch, shot, signInPage } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

// What each role's navigation shows (from the roles in the product brief); anything else must be absent.
const everyone = ["Today", "Parts", "Coatings", "Lines", "Calculators", "Settings"];
const floor = ["Racking", "Runs", "Day board", "Throughput", "Oven profiles", "Quality", "Utilisation"];
const expected: Record<string, string[]> = {
  admin: [...everyone, ...floor, "Forecast", "Purchasing", "Users", "Mail outbox"],
  manager: [...everyone, ...floor, "Forecast"],
  supervisor: [...everyone, ...floor],
  engineer: [...everyone, "Racking", "Oven profiles"],
  purchaser: [...everyone, "Forecast", "Purchasing"],
  operator: [...everyone, "Runs"],
};

describe("sign-in and role navigation", () => {
  it.each(Object.entries(expected))("%s signs in and sees only its sections", async (role, links) => {
    const page = await signInPage(browser, `${role}@bramblecote.test`);
    await expect.poll(() => page.getByTestId("current-user").textContent(), { timeout: 15_000 }).toContain(role);
    // work sections in the main bar; settings and administration beside the user's name
    const nav = [
      ...(await page.getByRole("navigation", { name: "Sections" }).getByRole("link").allTextContents()),
      ...(await page.getByRole("navigation", { name: "Account and administration" }).getByRole("link").allTextContents()),
    ];
    expect([...nav].sort()).toEqual([...links].sort());
    await shot(page, `home-${role}`);
    if (role !== "admin") {
      await page.goto(`${baseUrl()}/admin/users`);
      await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent(), { timeout: 15_000 }).toBe("Not for your role");
    }
    await page.context().close();
  });

  it("a wrong password shows an error and stays on sign-in", async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByLabel("E-mail").fill("supervisor@bramblecote.test");
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText("Wrong e-mail address or password").waitFor();
    expect(page.url()).toBe(`${baseUrl()}/sign-in`);
    await shot(page, "sign-in-wrong-password");
    await page.close();
  });

  it("an anonymous visit to a protected page lands on sign-in", async () => {
    const page = await browser.newPage();
    await page.goto(`${baseUrl()}/settings`);
    expect(page.url()).toBe(`${baseUrl()}/sign-in`);
    await page.close();
  });

  it("the admin invites a user from the users screen and the outbox shows the e-mail", async () => {
    const page = await signInPage(browser, "admin@bramblecote.test");
    await page.goto(`${baseUrl()}/admin/users`);
    await page.getByRole("columnheader", { name: /E-mail/ }).getByRole("button").click();
    await page.getByLabel("E-mail").fill("hollis.quarry@bramblecote.test");
    await page.getByLabel("Name").fill("Hollis Quarry");
    await page.getByLabel("Role", { exact: true }).selectOption("engineer");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText("Invitation e-mailed to hollis.quarry@bramblecote.test.").waitFor();
    await page.getByRole("cell", { name: "hollis.quarry@bramblecote.test" }).waitFor();
    await shot(page, "admin-users");
    await page.goto(`${baseUrl()}/admin/outbox`);
    await page.getByText("Your Coatwright account").first().click();
    const text = await page.locator("pre").first().textContent();
    const link = text!.match(/http\S+\/invite\/\S+/)![0];
    await page.goto(link);
    await page.getByLabel("New password").fill("hollis-powder-9");
    await page.getByLabel("Repeat it").fill("hollis-powder-9");
    await page.getByRole("button", { name: "Set password" }).click();
    await page.getByText("Password set for hollis.quarry@bramblecote.test").waitFor();
    await page.goto(link);
    await page.getByText("already been used").waitFor();
    await page.context().close();
    const hollis = await signInPage(browser, "hollis.quarry@bramblecote.test", "hollis-powder-9");
    await expect.poll(() => hollis.getByTestId("current-user").textContent(), { timeout: 15_000 }).toContain("engineer");
    await hollis.context().close();
  });
});
