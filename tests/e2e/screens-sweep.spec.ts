import { mkdirSync } from "node:fs";
import { expect, test, type APIRequestContext, type BrowserContext, type Page } from "@playwright/test";
import { signedInContext } from "./fixtures";
import { createModel, firstProjectId, submitSweep, waitForSweep, type CandidatePage } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll } from "./helpers/sign-in";

const SCREENS = "test-results/screens";
let engineer: APIRequestContext;
let browserCtx: BrowserContext;
let projectId: string;
let versionId: string;

test.beforeAll(async ({ browser }) => {
  mkdirSync(SCREENS, { recursive: true });
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  versionId = (await createModel(engineer, projectId, `Screens kinetics ${Date.now()}`)).version.id;
  browserCtx = await browserAs(browser, engineer);
});
test.afterAll(() => closeAll(browserCtx, engineer));

/** The numbers of one column of the ranked table, top to bottom. */
async function columnNumbers(page: Page, column: number): Promise<number[]> {
  const texts = await page.getByTestId("candidate-row").locator(`td:nth-child(${column + 1})`).allInnerTexts();
  return texts.map((t) => Number(t.replace(/[^0-9.eE+-]/g, ""))).filter(Number.isFinite);
}

const COL = { rank: 1, totalVolume: 4, totalCost: 5 };

/**
 * The ranks the API lists for one scenario in one order. The page keeps showing the previous
 * rows while it fetches new ones, so the table is compared with these rather than read at once.
 */
async function apiRanks(sweepId: string, scenario: number, query: string): Promise<number[]> {
  const res = await engineer.get(`/api/sweeps/${sweepId}/scenarios/${scenario}/candidates?${query}&pageSize=25`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as CandidatePage).items.map((c) => c.rank);
}

test("sweep page: progress to 100 %, heat map, sort by volume kept in the URL, candidate chart, compare, pin", async () => {
  // Submitted just before opening the page, so the progress is seen moving (or at least ending at 100 %).
  const sweep = await submitSweep(engineer, projectId, versionId, [
    { field: "feed.flowA", values: [0.01, 0.02, 0.04] },
    { field: "target.conversion", values: [0.8, 0.9] },
  ]);
  const page = await browserCtx.newPage();
  const sweepUrl = `/projects/${projectId}/sweeps/${sweep.id}`;
  await page.goto(sweepUrl);
  await expect(page.getByTestId("sweep-title")).toBeVisible();
  await expect(page.getByRole("progressbar")).toBeVisible();
  // The one worker may still be busy with sweeps that earlier specs queued.
  await expect(page.getByTestId("progress-text")).toHaveText("6 / 6 · 100 %", { timeout: 120_000 });
  await expect(page.getByTestId("sweep-status")).toHaveText("Finished");
  await expect(page.getByTestId("ranked-table")).toBeVisible();
  await expect(page.getByTestId("heat-map")).toBeVisible();
  await expect(page.getByTestId("heat-map").getByRole("button")).toHaveCount(6);
  await expect(page.getByTestId("thumbnail").first()).toBeVisible();

  // Sort by total volume, ascending then descending, checked against the API's own order.
  await page.getByTestId("sort-totalVolume").click();
  await expect(page).toHaveURL(/sort=totalVolume/);
  await expect(page.getByRole("columnheader", { name: /Total volume/ })).toHaveAttribute("aria-sort", "ascending");
  await page.getByTestId("sort-totalVolume").click();
  await expect(page).toHaveURL(/dir=desc/);
  await expect.poll(() => columnNumbers(page, COL.rank)).toEqual(await apiRanks(sweep.id, 0, "sort=totalVolume&dir=desc"));
  const volumes = await columnNumbers(page, COL.totalVolume);
  expect(volumes).toEqual([...volumes].sort((a, b) => b - a));

  // A second scenario and another unit, then a reload: the link alone restores the view.
  await page.getByTestId("heat-map").getByRole("button").nth(3).click();
  await expect(page).toHaveURL(/scenario=\d+/);
  const scenario = Number(new URL(page.url()).searchParams.get("scenario"));
  await page.getByTestId("unit-picker").selectOption("L");
  await expect(page).toHaveURL(/unit=L/);
  const ranks = await apiRanks(sweep.id, scenario, "sort=totalVolume&dir=desc");
  await expect.poll(() => columnNumbers(page, COL.rank)).toEqual(ranks);
  await page.reload();
  await expect(page.getByRole("columnheader", { name: /Total volume, L/ })).toHaveAttribute("aria-sort", "descending");
  await expect.poll(() => columnNumbers(page, COL.rank)).toEqual(ranks);
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: `${SCREENS}/sweep-page.png`, fullPage: true });

  // Two trains to compare.
  const boxes = page.getByRole("checkbox", { name: /to compare/ });
  await boxes.nth(0).check();
  await boxes.nth(1).check();
  await page.getByTestId("compare-selected").click();
  await expect(page).toHaveURL(/\/compare\?ids=/);
  await expect(page.getByTestId("compare-card")).toHaveCount(2);
  await expect(page.getByTestId("compare-differences")).toContainText("Volume over the smallest");
  await expect(page.getByTestId("levenspiel-chart")).toHaveCount(2);
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: `${SCREENS}/compare.png`, fullPage: true });

  // A candidate's chart, then pin it.
  await page.goBack();
  await page.getByTestId("candidate-link").first().click();
  await expect(page).toHaveURL(/\/candidates\//);
  const chart = page.getByTestId("levenspiel-chart");
  await expect(chart).toBeVisible();
  await expect(page.getByTestId("chart-label-1")).toContainText(/L$/);
  await expect(page.getByTestId("stage-table")).toBeVisible();
  await expect(page.getByTestId("cautions")).toBeVisible();
  await chart.focus();
  await page.keyboard.press("ArrowRight");
  await expect(page.getByTestId("chart-readout")).toContainText("FA0/(−rA)");
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: `${SCREENS}/candidate.png`, fullPage: true });
  await page.getByLabel("Note for the reviewer").fill("Smallest train at the design feed; check the jacket duty");
  await page.getByTestId("pin-button").click();
  // The project may already hold a current design (the seeded one, or another spec's): then pinning asks first.
  const supersede = page.getByRole("dialog", { name: "Supersede the current design?" });
  await expect(page.getByTestId("pin-done").or(supersede)).toBeVisible();
  if (await supersede.isVisible()) await supersede.getByRole("button", { name: "Pin and supersede" }).click();
  await expect(page.getByTestId("pin-done")).toBeVisible();
  await page.close();
});

test("cost-objective sweep: the table sorts by total cost", async () => {
  const res = await engineer.post(`/api/projects/${projectId}/sweeps`, {
    data: {
      kineticsVersionId: versionId,
      target: { conversion: 0.9 },
      train: { maxStages: 3, types: ["CSTR", "PFR"] },
      objective: { minimise: "cost", vessels: { CSTR: { a: 18000, b: 42000, n: 0.6 }, PFR: { a: 9000, b: 61000, n: 0.55 } } },
    },
  });
  expect(res.status(), await res.text()).toBe(201);
  const { sweep } = (await res.json()) as { sweep: { id: string } };
  await waitForSweep(engineer, sweep.id);
  const page = await browserCtx.newPage();
  await page.goto(`/projects/${projectId}/sweeps/${sweep.id}`);
  await expect(page.getByTestId("ranked-table")).toBeVisible();
  await page.getByTestId("sort-totalCost").click();
  await expect(page).toHaveURL(/sort=totalCost/);
  await expect(page.getByRole("columnheader", { name: /Total cost/ })).toHaveAttribute("aria-sort", "ascending");
  const ascending = await apiRanks(sweep.id, 0, "sort=totalCost&dir=asc");
  expect(ascending.length).toBeGreaterThan(3);
  await expect.poll(() => columnNumbers(page, COL.rank)).toEqual(ascending);
  const costs = await columnNumbers(page, COL.totalCost);
  expect(costs).toEqual([...costs].sort((a, b) => a - b));
  await page.getByTestId("sort-totalCost").click();
  await expect(page).toHaveURL(/dir=desc/);
  await expect.poll(async () => {
    const c = await columnNumbers(page, COL.totalCost);
    return c.length > 3 && c.every((v, i) => i === 0 || v <= c[i - 1]);
  }).toBe(true);
  await page.screenshot({ path: `${SCREENS}/sweep-cost.png`, fullPage: true });
  await page.close();
});

test("a running sweep shows its progress bar and can be cancelled", async () => {
  const sweep = await submitSweep(engineer, projectId, versionId, [{ field: "feed.flowA", from: 0.005, to: 0.05, steps: 40 }], 5);
  const page = await browserCtx.newPage();
  await page.goto(`/projects/${projectId}/sweeps/${sweep.id}`);
  await expect(page.getByRole("progressbar")).toHaveAttribute("aria-valuemax", "40");
  await page.screenshot({ path: `${SCREENS}/sweep-progress.png` });
  const status = (await page.getByTestId("sweep-status").textContent()) ?? "";
  if (status === "Queued" || status === "Running") {
    await page.getByRole("button", { name: "Cancel sweep" }).click();
    await expect(page.getByTestId("sweep-status")).toHaveText(/Cancelled|Finished/);
  } else {
    await expect(page.getByRole("button", { name: "Re-run" })).toBeVisible();
  }
  await page.close();
});
