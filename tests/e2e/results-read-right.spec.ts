import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { appReady, DEMO_PASSWORD, USERS } from "./fixtures";
import { SignInPage } from "./pages/sign-in-page";

async function signInAsEngineer(page: Page) {
  await page.setViewportSize({ width: 1280, height: 900 });
  const form = new SignInPage(page);
  await form.open();
  await form.withPassword(USERS.engineer, DEMO_PASSWORD);
  await expect(page.getByRole("heading", { name: "Brightwater Fine Chemicals" })).toBeVisible();
  await appReady(page);
}

test("the kinetics preview never shows a figure it cannot stand behind", async ({ page }) => {
  await signInAsEngineer(page);
  const name = `Preview limits ${Date.now()}`;
  const create = page.getByRole("form", { name: "New project" });
  await create.getByLabel("New project").fill(name);
  await create.getByRole("button", { name: "Create project" }).click();
  await page.getByRole("link", { name }).click();
  await page.getByRole("link", { name: "New kinetics" }).click();
  await expect(page.getByRole("heading", { name: "New kinetics" })).toBeVisible();

  const pfr = page.getByTestId("single-pfr-volume");
  // First order, k = 0.002 1/s, v0 = 0.05/1500 m3/s, X = 0.9: V = v0 ln 10 / k = 38.38 L (common practice).
  await expect(pfr).toHaveText("38.38 L");
  // The two references are alternatives, not a two-stage train.
  await expect(page.getByTestId("chart-label-1")).toContainText("Single CSTR");
  await expect(page.getByTestId("chart-label-2")).toContainText("Single PFR");

  const k = page.getByLabel("Rate constant k", { exact: true });
  // A field holding an error: the last good figure goes, and the panel says what it waits for.
  await k.fill("abc");
  await expect(pfr).toHaveText("—");
  await expect(page.getByTestId("kinetics-preview")).toContainText("Waiting for a valid value");

  // k = 1e308 overflows the rate: a message in words, never "0 L".
  await k.fill("1e308");
  await expect(page.getByTestId("preview-error")).toContainText("rate overflows");
  await expect(pfr).toHaveText("—");

  await k.fill("0.002");
  await expect(pfr).toHaveText("38.38 L");
  const axe = await new AxeBuilder({ page }).include("[data-testid=kinetics-preview]").analyze();
  expect(axe.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => v.id)).toEqual([]);
});
