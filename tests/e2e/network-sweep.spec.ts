import { mkdirSync } from "node:fs";
import { expect, test, type APIRequestContext, type BrowserContext, type Page } from "@playwright/test";
import { appReady, openPage, signedInContext } from "./fixtures";
import { firstProjectId, waitForSweep } from "./sweep-fixtures";
import { leadingNumber } from "./ranked-rows";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll } from "./helpers/sign-in";

const SCREENS = "test-results/screens";

// Invented chemistry of our own: a wanted intermediate B that goes on to C, and a second-order side
// product D from A. Liquid, numbers SI; the feed of A was typed in mol/L.
const SIDE_REACTIONS = {
  feed: { volumetricFlow: 0.01, concentrations: { A: 800, B: 0, C: 0, D: 0 }, temperature: 310 },
  phase: "liquid",
  reactions: [
    { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 0.02, orders: { A: 1 } } },
    { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: 0.006, orders: { B: 1 } } },
    { stoichiometry: { A: -2, D: 1 }, rate: { law: "power", k: 1e-5, orders: { A: 2 } } },
  ],
  keyReactant: "A",
  product: "B",
  shownUnits: { "feed.concentrations.A": "mol/L" },
};

interface NetworkItem {
  id: string;
  rank: number;
  feasible: boolean;
  yield: number | null;
  stages: { type: string; outlet: Record<string, number> }[];
}

let engineer: APIRequestContext;
let browserCtx: BrowserContext;
let projectId: string;
let versionId: string;
let sweepId: string;

test.beforeAll(async ({ browser }) => {
  mkdirSync(SCREENS, { recursive: true });
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  const model = await engineer.post(`/api/projects/${projectId}/kinetics`, { data: { name: `Side reactions ${Date.now()}`, spec: SIDE_REACTIONS, note: "invented for the screens" } });
  expect(model.status(), await model.text()).toBe(201);
  versionId = ((await model.json()) as { version: { id: string } }).version.id;
  const res = await engineer.post(`/api/projects/${projectId}/sweeps`, {
    data: {
      kineticsVersionId: versionId,
      thermal: { mode: "isothermal" },
      train: { maxStages: 2, types: ["CSTR", "PFR"] },
      objective: { maximise: "yield", product: "B" },
      constraints: { maxTotalVolume: 20 },
      grid: [{ field: "reactions.0.rate.k", values: [0.02, 0.04] }],
    },
  });
  expect(res.status(), await res.text()).toBe(201);
  sweepId = ((await res.json()) as { sweep: { id: string } }).sweep.id;
  // Runs on the real worker the harness started; generous, the queue is shared with other specs.
  const done = await waitForSweep(engineer, sweepId, 240_000);
  expect(done.status).toBe("succeeded");
  browserCtx = await browserAs(browser, engineer);
});
test.afterAll(() => closeAll(browserCtx, engineer));

async function apiItems(query: string): Promise<NetworkItem[]> {
  const res = await engineer.get(`/api/sweeps/${sweepId}/scenarios/0/candidates?${query}&pageSize=25`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as { items: NetworkItem[] }).items;
}

/** The texts of one column of the ranked table, found by its header (shown in capitals by the style). */
async function column(page: Page, header: RegExp): Promise<string[]> {
  const headers = await page.getByTestId("ranked-table").locator("thead th").allInnerTexts();
  const index = headers.findIndex((h) => header.test(h));
  expect(index, `a column ${header}`).toBeGreaterThanOrEqual(0);
  return page.getByTestId("candidate-row").locator(`td:nth-child(${index + 1})`).allInnerTexts();
}

test("network sweep: yield columns sorted on the server, a candidate's composition and charts, compare two", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}/sweeps/${sweepId}`);
  await expect(page.getByTestId("sweep-objective")).toContainText("Highest yield of B");
  await expect(page.getByTestId("ranked-table")).toBeVisible();
  await expect(page.getByRole("columnheader", { name: /Yield of B/ })).toBeVisible();
  await expect(page.getByRole("columnheader", { name: /Selectivity to B/ })).toBeVisible();
  // No cost and no Levenspiel thumbnails for several reactions.
  await expect(page.getByRole("columnheader", { name: /Total cost/ })).toHaveCount(0);
  await expect(page.getByTestId("thumbnail")).toHaveCount(0);

  // Sort by yield: the first click puts the largest first, as the database orders it.
  await page.getByTestId("sort-yield").click();
  await expect(page).toHaveURL(/sort=yield/);
  await expect(page).toHaveURL(/dir=desc/);
  await expect(page.getByRole("columnheader", { name: /Yield of B/ })).toHaveAttribute("aria-sort", "descending");
  const byYield = await apiItems("sort=yield&dir=desc");
  const yields = byYield.filter((c) => c.feasible).map((c) => c.yield!);
  expect(yields.length).toBeGreaterThan(2);
  // Yields are compared to 9 decimals, the designer's tie tolerance: round-off never reorders tied trains.
  const to9 = (y: number) => Math.round(y * 1e9) / 1e9;
  expect(yields.map(to9)).toEqual(yields.map(to9).sort((a, b) => b - a));
  await expect.poll(async () => (await column(page, /^rank/i)).map(leadingNumber)).toEqual(byYield.map((c) => c.rank));
  // The first row's yield is the largest (shown as a percentage with one decimal).
  await expect.poll(async () => leadingNumber((await column(page, /yield of b/i))[0]!)).toBeCloseTo(100 * Math.max(...yields), 1);
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: `${SCREENS}/network-sweep.png`, fullPage: true });

  // Two trains to compare.
  const boxes = page.getByRole("checkbox", { name: /to compare/ });
  await boxes.nth(0).check();
  await boxes.nth(1).check();
  await page.getByTestId("compare-selected").click();
  await expect(page).toHaveURL(/\/compare\?ids=/);
  await appReady(page);
  await expect(page.getByTestId("compare-card")).toHaveCount(2);
  const differences = page.getByTestId("compare-differences");
  await expect(differences).toContainText("Yield of B");
  await expect(differences).toContainText("Yield below the best");
  await expect(differences).toContainText("best");
  await expect(page.getByTestId("composition-table")).toHaveCount(2);
  // Each train's concentration path over the single tube's, and the feed row once each train's own answer is in.
  await expect(page.getByTestId("path-chart")).toHaveCount(2);
  await expect(page.getByTestId("composition-table").first().getByTestId("composition-row")).toHaveCount(1 + byYield[0]!.stages.length);
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: `${SCREENS}/network-compare.png`, fullPage: true });

  // The best train: its outlet composition, its profiles and its concentration path.
  await page.goBack();
  await appReady(page);
  await page.getByTestId("candidate-link").first().click();
  await expect(page).toHaveURL(/\/candidates\//);
  await appReady(page);
  const best = byYield[0]!;
  const table = page.getByTestId("composition-table");
  await expect(table).toBeVisible();
  await expect(table.getByTestId("composition-row")).toHaveCount(1 + best.stages.length);
  await expect(table.getByRole("columnheader", { name: "B, mol/L" })).toBeVisible();
  // The last stage's B as stored (mol/m3), shown in the unit the model was typed in (1 mol/L = 1000 mol/m3).
  const lastRow = table.getByTestId("composition-row").last();
  const shownB = leadingNumber(await lastRow.locator("td").nth(1).innerText());
  expect(shownB).toBeCloseTo(best.stages[best.stages.length - 1]!.outlet.B! / 1000, 3);
  await expect(page.getByTestId("path-chart")).toBeVisible();
  await expect(page.getByTestId("path-chart").locator("[data-series='Single tube'] path")).toHaveCount(1);
  await expect(page.getByTestId("profiles-chart")).toBeVisible();
  await expect(page.getByTestId("profiles-chart").locator("[data-series]")).toHaveCount(4);
  await expect(page.getByTestId("network-summary")).toContainText("Yield of B · ranked by");
  await expect(page.getByTestId("cautions")).toBeVisible();
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: `${SCREENS}/network-candidate.png`, fullPage: true });

  // Pinned as today, with the frozen outlet composition.
  await page.getByLabel("Note for the reviewer").fill("Best yield of B within 20 m³; check the heat removal of the tank");
  await page.getByTestId("pin-button").click();
  // The project may already hold a current design (the seeded one, or another spec's): then pinning asks first.
  const supersede = page.getByRole("dialog", { name: "Supersede the current design?" });
  await expect(page.getByTestId("pin-done").or(supersede)).toBeVisible();
  if (await supersede.isVisible()) await supersede.getByRole("button", { name: "Pin and supersede" }).click();
  await expect(page.getByTestId("pin-done")).toBeVisible();
  const pins = (await (await engineer.get(`/api/projects/${projectId}/pins`)).json()) as { pins: { candidate: { kind?: string; outlet?: Record<string, number> | null } }[] };
  // Newest first: the one just pinned.
  const frozen = pins.pins[0]!;
  expect(frozen.candidate.kind).toBe("network");
  expect(frozen.candidate.outlet?.B).toBeCloseTo(best.stages[best.stages.length - 1]!.outlet.B!, 6);
  await page.close();
});

test("network sweep builder: errors at their fields, then a yield sweep with a volume limit in litres reaches the queue as the contract says", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}/sweeps/new?version=${versionId}`);
  await expect(page.getByText("Highest yield of B")).toBeVisible();
  await expect(page.getByLabel("Wanted product", { exact: true })).toHaveValue("B");
  await page.getByLabel("Volume unit", { exact: true }).selectOption("L");
  await page.getByLabel("Largest number of stages (1–5)", { exact: true }).fill("1");
  await expect(page.getByTestId("optimisation-count")).toHaveText("2");

  // What the engine refuses comes back at the field a person corrects, and nothing is queued.
  await page.getByRole("radio", { name: /Least total volume/ }).check();
  await page.getByLabel("Minimum conversion, %", { exact: true }).fill("50");
  await page.getByLabel("Largest total volume", { exact: true }).fill("100");
  await page.getByRole("button", { name: "Submit sweep" }).click();
  await expect(page.locator("#n-minConversion-error")).toContainText("no train reaches the minimum conversion");
  await expect(page).toHaveURL(/\/sweeps\/new/);

  await page.getByRole("radio", { name: /Highest yield of B/ }).check();
  await page.getByLabel("Largest total volume", { exact: true }).fill("5000");
  // A bad limit is refused at its field, in words, before anything is sent.
  await page.getByLabel("Minimum conversion, %", { exact: true }).fill("150");
  await expect(page.getByText("Minimum conversion is a percentage from 0 to 100")).toBeVisible();
  await page.getByLabel("Minimum conversion, %", { exact: true }).fill("40");
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: `${SCREENS}/network-builder.png`, fullPage: true });
  await page.getByRole("button", { name: "Submit sweep" }).click();
  await expect(page).toHaveURL(/\/sweeps\/[0-9a-f-]{36}$/, { timeout: 60_000 });
  await appReady(page);
  const id = new URL(page.url()).pathname.split("/").pop()!;
  const { sweep } = (await (await engineer.get(`/api/sweeps/${id}`)).json()) as { sweep: { kind: string; spec: { objective: unknown; constraints: { maxTotalVolume: number; minConversion: number } } } };
  expect(sweep.kind).toBe("network");
  expect(sweep.spec.objective).toEqual({ maximise: "yield", product: "B" });
  expect(sweep.spec.constraints.maxTotalVolume).toBeCloseTo(5, 9);
  expect(sweep.spec.constraints.minConversion).toBeCloseTo(0.4, 12);
  await expect(page.getByTestId("sweep-objective")).toContainText("Highest yield of B");
  await page.close();
});
