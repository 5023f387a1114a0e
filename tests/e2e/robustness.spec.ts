import { expect, test, type APIRequestContext, type BrowserContext } from "@playwright/test";
import { expectReadableAxes } from "./chart-fixtures";
import { openPage, signedInContext } from "./fixtures";
import { firstProjectId } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll } from "./helpers/sign-in";

let engineer: APIRequestContext;
let browserCtx: BrowserContext;
let projectId: string;
let pin: { id: string; sweepId: string; candidateId: string };

test.beforeAll(async ({ browser }) => {
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  // The demo data's finished sweep has its best train at the design point pinned for review.
  const pins = (await (await engineer.get(`/api/projects/${projectId}/pins`)).json()) as { pins: { id: string; sweepId: string; candidateId: string; note: string }[] };
  pin = pins.pins.find((p) => p.note.includes("(demo)"))!;
  browserCtx = await browserAs(browser, engineer);
});
test.afterAll(() => closeAll(browserCtx, engineer));

const percent = (text: string) => Number(text.replace(/[^0-9.]/g, "")) / 100;

test("candidate view: k ± 20 % gives P5/P50/P95 as the API stores them, the chart and a text summary", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}/sweeps/${pin.sweepId}/candidates/${pin.candidateId}`);
  const panel = page.getByRole("region", { name: "Robustness" });
  await expect(panel).toBeVisible({ timeout: 30_000 });
  await panel.getByLabel("Input", { exact: true }).selectOption("reaction.rate.k");
  await panel.getByLabel("Distribution", { exact: true }).selectOption("plusMinus");
  await panel.getByLabel("± %", { exact: true }).fill("20");
  await panel.getByLabel("Samples", { exact: true }).fill("1500");
  await panel.getByLabel("Random seed (repeatable draws)", { exact: true }).fill("42");
  await panel.getByTestId("robustness-run").click();

  const result = panel.getByTestId("robustness-result");
  await expect(result).toBeVisible({ timeout: 30_000 });
  await expect(panel.getByTestId("robustness-chart").locator("svg")).toBeVisible();
  await expectReadableAxes(panel.getByTestId("robustness-chart"), ["Outlet conversion X", "Share of samples ≤ X"]);
  await expect(panel.getByTestId("robustness-summary")).toContainText("1,500 samples (random seed 42)");

  // The figures on screen are the stored run's.
  const list = (await (await engineer.get(`/api/candidates/${pin.candidateId}/robustness`)).json()) as {
    runs: { request: { samples: number; seed: number }; result: { p5: number; p50: number; p95: number } }[];
  };
  const run = list.runs.find((r) => r.request.seed === 42 && r.request.samples === 1500)!;
  const shown = await result.locator("dd").allInnerTexts();
  expect(percent(shown[0])).toBeCloseTo(run.result.p5, 4);
  expect(percent(shown[1])).toBeCloseTo(run.result.p50, 4);
  expect(percent(shown[2])).toBeCloseTo(run.result.p95, 4);
  expect(run.result.p5).toBeLessThan(run.result.p95);
  await expectNoSeriousA11yViolations(page);
  await page.close();
});

test("a bad range is refused beside its field and nothing runs", async () => {
  const runs = async () => ((await (await engineer.get(`/api/candidates/${pin.candidateId}/robustness`)).json()) as { runs: unknown[] }).runs.length;
  const before = await runs();
  const page = await openPage(browserCtx, `/projects/${projectId}/sweeps/${pin.sweepId}/candidates/${pin.candidateId}`);
  const panel = page.getByRole("region", { name: "Robustness" });
  await expect(panel.getByLabel("± %", { exact: true })).toBeVisible({ timeout: 30_000 });
  await panel.getByLabel("± %", { exact: true }).fill("150");
  await panel.getByTestId("robustness-run").click();
  await expect(panel.getByTestId("uncertain-0").getByRole("alert")).toContainText("below 100 %");
  expect(await runs()).toBe(before);
  await page.close();
});

test("pinned design: a run above 2,000 samples is queued, polled and shown when the worker is done", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}`);
  const item = page.getByTestId("pin").filter({ hasText: "(demo)" });
  await item.getByRole("button", { name: "Robustness" }).click();
  const panel = item.getByRole("region", { name: "Robustness of this pinned design" });
  await expect(panel.getByLabel("± %", { exact: true })).toBeVisible({ timeout: 30_000 });
  await panel.getByLabel("Samples", { exact: true }).fill("3000");
  await panel.getByLabel("Random seed (repeatable draws)", { exact: true }).fill("5");
  await panel.getByTestId("robustness-run").click();
  await expect(panel.getByTestId("robustness-waiting")).toBeVisible();
  await expect(panel.getByTestId("robustness-summary")).toContainText("3,000 samples (random seed 5)", { timeout: 60_000 });
  await expectNoSeriousA11yViolations(page);
  await page.close();
});
