import { expect, test, type APIRequestContext, type BrowserContext } from "@playwright/test";
import { appReady, openPage, signedInContext } from "./fixtures";
import { createModel, firstProjectId, SECOND_ORDER } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll } from "./helpers/sign-in";

let engineer: APIRequestContext;
let browserCtx: BrowserContext;
let projectId: string;
let versionId: string;
let modelLabel: string;
const tag = `E2E-${Date.now().toString(36)}`;

test.beforeAll(async ({ browser }) => {
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  modelLabel = `Costs kinetics ${Date.now()}`;
  versionId = (await createModel(engineer, projectId, modelLabel)).version.id;
  browserCtx = await browserAs(browser, engineer);
});
test.afterAll(() => closeAll(browserCtx, engineer));

test("cost basis, an idle vessel, a sweep with reuse and which vessel goes where", async () => {
  const page = await browserCtx.newPage();

  // 1. The project's cost basis, from the project page.
  await page.goto(`/projects/${projectId}`);
  await appReady(page);
  await page.getByTestId("project-costs-link").click();
  await expect(page.getByRole("heading", { name: "Cost basis", level: 1 })).toBeVisible();
  const exponent = page.getByLabel("n (size exponent)").first();
  await exponent.fill("zero");
  await page.getByRole("button", { name: "Save cost basis" }).click();
  await expect(page.locator("#c-vessels-CSTR-n-error")).toContainText("Must be a number");
  await exponent.fill("0.6");
  await page.getByLabel("Installation factor (installed cost = purchase × factor)").fill("3.5");
  await page.getByRole("button", { name: "Save cost basis" }).click();
  await expect(page.getByText("Cost basis saved.")).toBeVisible();
  await expectNoSeriousA11yViolations(page);

  // 2. An idle vessel, from the header's Inventory link.
  await page.getByRole("link", { name: "Inventory" }).click();
  await expect(page.getByRole("heading", { name: "Inventory", level: 1 })).toBeVisible();
  await page.getByLabel("Tag").fill(tag);
  await page.getByLabel("Type").selectOption("CSTR");
  await page.getByLabel("Volume", { exact: true }).fill("30");
  await page.getByLabel("Unit").selectOption("L");
  await page.getByLabel("Reuse cost").fill("0");
  await page.getByRole("button", { name: "Add vessel" }).click();
  await expect(page.getByTestId("inventory-row").filter({ hasText: tag })).toContainText("0.03");
  await expectNoSeriousA11yViolations(page);

  // 3. A cost sweep that reuses idle vessels, prefilled from the project's basis.
  await page.goto(`/projects/${projectId}/sweeps/new?version=${versionId}`);
  await appReady(page);
  await page.getByLabel("Least vessel cost").check();
  await page.getByTestId("use-project-costs").click();
  await expect(page.getByText(/Filled from the project's cost basis/)).toBeVisible();
  await expect(page.locator("#s-installationFactor")).toHaveValue("3.5");
  await page.getByLabel("Reuse idle vessels from the inventory").check();
  await page.getByRole("button", { name: "Submit sweep" }).click();
  await expect(page).toHaveURL(/\/sweeps\/[0-9a-f-]{36}/);
  await expect(page.getByTestId("sweep-status")).toHaveText("Finished", { timeout: 60_000 });

  // Most reused first (sorted by the server), then the candidate's vessel plan.
  await page.getByTestId("sort-reused").click();
  await expect(page).toHaveURL(/sort=reused/);
  await page.getByTestId("sort-reused").click();
  await expect(page).toHaveURL(/dir=desc/);
  // The page shows the previous order until the new rows come: wait for the API's order.
  const sweepId = /\/sweeps\/([0-9a-f-]{36})/.exec(page.url())![1];
  const reusedFirst = (await (await engineer.get(`/api/sweeps/${sweepId}/scenarios/0/candidates?sort=reused&dir=desc&pageSize=25`)).json()) as { items: { rank: number }[] };
  await expect(page.getByTestId("candidate-row").locator("td:nth-child(2)")).toHaveText(reusedFirst.items.map((c) => String(c.rank)));
  // Trains reusing one vessel tie; the first with a stirred tank is the one our idle CSTR equips
  // (reuse cost 0, so the least-cost plan always takes it when it fits).
  await page.getByTestId("candidate-row").filter({ hasText: "CSTR" }).first().getByTestId("candidate-link").click();
  const plan = page.getByTestId("vessel-plan-table");
  await expect(plan).toBeVisible();
  await expect(plan).toContainText(tag);
  await expect(page.getByTestId("vessel-plan-saving")).toContainText("saving");
  await expectNoSeriousA11yViolations(page);
});

test("rate a fixed train: conversion, largest feed and cautions", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}`);
  await page.getByTestId("project-rate-link").click();
  await expect(page.getByRole("heading", { name: "Rate a fixed train", level: 1 })).toBeVisible();
  await page.getByLabel("Kinetics version").selectOption({ label: `${modelLabel} · v1` });
  await page.getByLabel("Target conversion").fill("0.8");
  const first = page.getByTestId("rate-stage").first();
  await first.getByLabel("Volume").fill("10");
  await first.getByLabel("Unit").selectOption("L");
  await page.getByRole("button", { name: "Add a stage" }).click();
  const second = page.getByTestId("rate-stage").nth(1);
  await second.getByLabel("Vessel", { exact: true }).selectOption("inventory");
  await second.getByLabel("Inventory vessel").selectOption({ label: "R-301 · CSTR · 0.025 m³" });
  await page.getByRole("button", { name: "Rate the train" }).click();
  await expect(page.getByTestId("rating-result")).toBeVisible();
  await expect(page.getByTestId("rating-stages")).toContainText("R-301");
  // The model was typed without units, so the default choice "as typed in the kinetics" falls back
  // to SI with litres and hours: feed in kmol/h, vessels below 1 m³ in litres, temperatures in °C.
  await expect(page.getByTestId("rating-largest-feed")).toHaveText(/^\d[\d.e+-]* kmol\/h$/);
  const stages = page.getByTestId("rating-stages");
  await expect(stages.getByRole("columnheader", { name: "Volume, L" })).toBeVisible();
  await expect(stages.getByRole("columnheader", { name: "T in → out, °C" })).toBeVisible();
  // 10 L as typed, and R-301's 0.025 m³ is 25 L (1 m³ = 1,000 L, common practice).
  await expect(stages.getByRole("row").nth(1).getByRole("cell").nth(1)).toHaveText("10");
  await expect(stages.getByRole("row").nth(2).getByRole("cell").nth(1)).toHaveText("25");
  await expect(page.getByText(/space time/)).toBeVisible();
  await expect(page.getByTestId("cautions")).toBeVisible();
  await expectNoSeriousA11yViolations(page);
});

test("a model typed in mol/s, mol/m³ and K rates in those units, as typed", async () => {
  const name = `Typed in SI ${Date.now()}`;
  const shownUnits = { "feed.flowA": "mol/s", "feed.concA": "mol/m3", "feed.temperature": "K" };
  const created = await engineer.post(`/api/projects/${projectId}/kinetics`, { data: { name, spec: { ...SECOND_ORDER, shownUnits } } });
  expect(created.status()).toBe(201);
  const version = ((await created.json()) as { version: { id: string } }).version.id;
  const api = await engineer.post(`/api/projects/${projectId}/rate`, { data: { kineticsVersionId: version, stages: [{ type: "CSTR", volume: 0.01 }], target: 0.8 } });
  expect(api.status()).toBe(200);
  const flowA = ((await api.json()) as { rating: { largestFeed: { flowA: number } } }).rating.largestFeed.flowA;

  const page = await openPage(browserCtx, `/projects/${projectId}/rate`);
  await page.getByLabel("Kinetics version").selectOption({ label: `${name} · v1` });
  await page.getByLabel("Target conversion").fill("0.8");
  const first = page.getByTestId("rate-stage").first();
  await first.getByLabel("Volume").fill("10");
  await first.getByLabel("Unit").selectOption("L");
  await page.getByRole("button", { name: "Rate the train" }).click();
  const stages = page.getByTestId("rating-stages");
  await expect(stages.getByRole("columnheader", { name: "Volume, m³" })).toBeVisible({ timeout: 30_000 });
  await expect(stages.getByRole("columnheader", { name: "T in → out, K" })).toBeVisible();
  const cells = stages.getByRole("row").nth(1).getByRole("cell");
  // 10 L = 0.01 m³, and the feed's 66.85 °C is 340 K (0 °C = 273.15 K): common practice.
  await expect(cells.nth(1)).toHaveText("0.01");
  await expect(cells.nth(3)).toHaveText(/^340 → /);
  // The largest feed is the API's own figure, in mol/s as typed.
  const feed = page.getByTestId("rating-largest-feed");
  await expect(feed).toHaveText(/ mol\/s$/);
  const shown = Number((await feed.innerText()).replace(" mol/s", ""));
  expect(Math.abs(shown / flowA - 1)).toBeLessThan(1e-4); // five significant digits on screen
  await page.close();
});
