import { expect, test, type APIRequestContext, type Browser, type Locator, type Page } from "@playwright/test";
import { openPage, signedInContext } from "./fixtures";
import { createModel, firstProjectId } from "./sweep-fixtures";
import { browserAs } from "./helpers/sign-in";

// A message a person reads names fields by their labels: no camel-case key, no dotted path.
const PATHY = /\b[a-z]+[A-Z]\w*\b|\w+\.\d+\.\w+/;

let engineer: APIRequestContext;
let projectId: string;
let versionId: string;
const modelName = `Wording kinetics ${Date.now()}`;
test.beforeAll(async () => {
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  versionId = (await createModel(engineer, projectId, modelName)).version.id;
});
test.afterAll(() => engineer.dispose());

async function refusal(res: { status(): number; json(): Promise<unknown> }) {
  expect(res.status()).toBe(400);
  return ((await res.json()) as { error: { message: string; fields: Record<string, string[]> } }).error;
}

test("rating a stage volume that is not a quantity names the stage as the form does", async () => {
  const error = await refusal(await engineer.post(`/api/projects/${projectId}/rate`, { data: { kineticsVersionId: versionId, stages: [{ type: "CSTR", volume: "abc" }], target: 0.9 } }));
  expect(error.message).toContain('Stage 1 volume: "abc" is not a quantity with a unit, e.g. 2.5 m³');
  expect(error.message).not.toMatch(PATHY);
  expect(Object.keys(error.fields)).toContain("stages.0.volume");
});

test("a sweep of 9 stages reads as the builder's label with its range", async () => {
  const error = await refusal(await engineer.post(`/api/projects/${projectId}/sweeps`, { data: { kineticsVersionId: versionId, target: { conversion: 0.9 }, train: { maxStages: 9 } } }));
  expect(error.message).toContain("Largest number of stages: a whole number from 1 to 8");
  expect(error.message).not.toMatch(PATHY);
});

test("a cost basis with a negative fixed part names the correlation, not its key", async () => {
  const correlation = { a: -1, b: 45000, n: 0.6, source: "invented for the test" };
  const error = await refusal(
    await engineer.put(`/api/projects/${projectId}/costs`, {
      data: { vessels: { CSTR: correlation, PFR: { ...correlation, a: 1 } }, currency: "EUR", basisYear: 2026, sizes: { mode: "any" }, maxVesselVolume: null, installationFactor: { value: 3, source: "common practice" } },
    }),
  );
  expect(error.message).toContain("CSTR cost: fixed part a");
  expect(error.message).not.toMatch(PATHY);
});

test("kinetics with an unreadable unit and a project of one letter read in labels", async () => {
  const k = await refusal(await engineer.post(`/api/projects/${projectId}/kinetics`, { data: { name: "Bad unit", spec: { feed: { flowA: 0.02, concA: "1 furlong" }, reaction: { rate: { law: "power", k: 1e-3, orders: { A: 1 } } } } } }));
  expect(k.message).toMatch(/^Feed concentration of A: /);
  expect(k.message).not.toMatch(PATHY);
  const p = await refusal(await engineer.post("/api/projects", { data: { name: "A" } }));
  expect(p.message).toBe("Name: Use at least 2 characters");
});

test("a finished sweep reads the same on the project list and on its page", async ({ browser }) => {
  const ctx = await browser.newContext({ storageState: await engineer.storageState() });
  const page = await openPage(ctx, `/projects/${projectId}`);
  const row = page.getByRole("row").filter({ has: page.getByRole("link") }).filter({ hasText: "Finished" }).first();
  await expect(row).toBeVisible({ timeout: 60_000 });
  await row.getByRole("link").first().click();
  await expect(page.getByTestId("sweep-status")).toHaveText("Finished", { timeout: 60_000 });
  await ctx.close();
});

// --- On screen, as the demo design engineer: every alert a form shows reads in labels. ---

async function engineerPage(browser: Browser, path: string): Promise<Page> {
  const ctx = await browserAs(browser, engineer);
  const page = await openPage(ctx, path);
  return page;
}

/** The texts of the alerts shown in `scope`, once there are some; none may carry a key or a dotted path. */
async function alertsIn(scope: Locator): Promise<string[]> {
  const alerts = scope.getByRole("alert");
  await expect(alerts.first()).toBeVisible({ timeout: 30_000 });
  const texts = (await alerts.allInnerTexts()).map((t) => t.trim()).filter(Boolean);
  expect(texts.length).toBeGreaterThan(0);
  for (const text of texts) expect(text).not.toMatch(PATHY);
  return texts;
}

test("the rating form names the stage volume and the target by their labels", async ({ browser }) => {
  const page = await engineerPage(browser, `/projects/${projectId}/rate`);
  await page.getByLabel("Kinetics version").selectOption({ label: `${modelName} · v1` });
  await page.getByLabel("Target conversion").fill("1.5");
  await page.getByTestId("rate-stage").first().getByLabel("Volume").fill("abc");
  await page.getByRole("button", { name: "Rate the train" }).click();
  const form = page.getByRole("form", { name: "Rate a fixed train" });
  expect((await alertsIn(form)).join(" ")).toContain("Target conversion: Conversion must be below 1");
  // A volume is read as a quantity only once the request's shape is right, so it is named second.
  await page.getByLabel("Target conversion").fill("0.8");
  await page.getByRole("button", { name: "Rate the train" }).click();
  await expect(form.getByRole("alert").filter({ hasText: "Stage 1 volume" }).first()).toBeVisible({ timeout: 30_000 });
  await alertsIn(form);
  await expect(page.getByTestId("rating-result")).toHaveCount(0);
  await page.context().close();
});

test("the kinetics form names a rate constant that is not a number by its label", async ({ browser }) => {
  const page = await engineerPage(browser, `/projects/${projectId}/kinetics/new`);
  await page.getByLabel("Model name").fill("Wording check, never saved");
  await page.getByLabel("Rate constant k", { exact: true }).fill("abc");
  await page.getByRole("button", { name: "Save kinetics" }).click();
  await alertsIn(page.locator("main"));
  await expect(page.locator("#f-reaction-rate-k-value-error")).toContainText("Enter a number");
  await expect(page).toHaveURL(/\/kinetics\/new$/);
  await page.context().close();
});

test("the sweep builder names too many stages and an unreadable value by their labels", async ({ browser }) => {
  const page = await engineerPage(browser, `/projects/${projectId}/sweeps/new?version=${versionId}`);
  await page.getByLabel("Largest number of stages (1–8)").fill("9");
  await page.getByRole("button", { name: "+ Vary a field" }).click();
  await page.getByLabel("Values (comma separated)").fill("0.02, abc");
  await page.getByRole("button", { name: "Submit sweep" }).click();
  const texts = await alertsIn(page.getByRole("form", { name: "New sweep" }));
  expect(texts.join(" ")).toContain("a whole number from 1 to 8");
  expect(texts.join(" ")).toContain("Separate numbers with commas");
  await expect(page).toHaveURL(/\/sweeps\/new/);
  await page.context().close();
});

test("the cost basis form names a negative fixed part by its correlation and saves nothing", async ({ browser }) => {
  const before = await (await engineer.get(`/api/projects/${projectId}/costs`)).json();
  const page = await engineerPage(browser, `/projects/${projectId}/costs`);
  const form = page.getByRole("form", { name: "Cost basis" });
  await form.getByRole("group", { name: /^CSTR purchase cost/ }).getByLabel("a", { exact: true }).fill("-1");
  await form.getByRole("button", { name: "Save cost basis" }).click();
  const texts = await alertsIn(form);
  expect(texts.join(" ")).toContain("CSTR cost: fixed part a");
  expect(texts.join(" ")).toContain("Nothing was saved");
  expect(await (await engineer.get(`/api/projects/${projectId}/costs`)).json()).toEqual(before);
  await page.context().close();
});

test("the new-project form asks for a longer name in words", async ({ browser }) => {
  const page = await engineerPage(browser, "/");
  const form = page.getByRole("form", { name: "New project" });
  await form.getByLabel("New project").fill("A");
  await form.getByRole("button", { name: "Create project" }).click();
  const texts = await alertsIn(form);
  expect(texts.join(" ")).toContain("at least 2 characters");
  await page.context().close();
});

test("the robustness ± % takes 20 and refuses 500 with the words the form uses", async ({ browser }) => {
  const pins = (await (await engineer.get(`/api/projects/${projectId}/pins`)).json()) as { pins: { sweepId: string; candidateId: string; note: string }[] };
  const pin = pins.pins.find((p) => p.note.includes("(demo)"))!;
  const page = await engineerPage(browser, `/projects/${projectId}/sweeps/${pin.sweepId}/candidates/${pin.candidateId}`);
  const panel = page.getByRole("region", { name: "Robustness" });
  await expect(panel).toBeVisible({ timeout: 30_000 });
  await panel.getByLabel("Input", { exact: true }).selectOption("reaction.rate.k");
  await panel.getByLabel("Distribution", { exact: true }).selectOption("plusMinus");
  const spread = panel.getByLabel("± %", { exact: true });
  await panel.getByLabel("Samples", { exact: true }).fill("200");
  await spread.fill("500");
  await panel.getByTestId("robustness-run").click();
  const texts = await alertsIn(panel.getByTestId("uncertain-0"));
  expect(texts.join(" ")).toContain("below 100 %");
  await spread.fill("20");
  await panel.getByTestId("robustness-run").click();
  await expect(panel.getByTestId("robustness-result")).toBeVisible({ timeout: 60_000 });
  await expect(panel.getByTestId("uncertain-0").getByRole("alert")).toHaveCount(0);
  await page.context().close();
});
