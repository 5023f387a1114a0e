import { mkdirSync } from "node:fs";
import { expect, test, type APIRequestContext, type BrowserContext } from "@playwright/test";
import { appReady, openPage, signedInContext } from "./fixtures";
import { firstProjectId, waitForSweep } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll } from "./helpers/sign-in";

const SCREENS = "test-results/screens";
// Invented demo kinetics: an autocatalytic liquid reaction A + R -> 2R with a little R in the feed.
const AUTOCATALYTIC = {
  feed: { flowA: 0.1, concA: "0.9 mol/L", temperature: "37 degC", ratios: { R: 0.03 } },
  reaction: { stoichiometry: { A: -1, R: 1 }, phase: "liquid", rate: { law: "power", k: 3e-6, orders: { A: 1, R: 1 } } },
};

interface Row {
  id: string;
  rank: number;
  sequence: string[];
  feasible: boolean;
  stages: { type: string; recycleRatio?: number }[];
}

let engineer: APIRequestContext;
let browserCtx: BrowserContext;
let projectId: string;
let versionId: string;
let modelName: string;

test.beforeAll(async ({ browser }) => {
  mkdirSync(SCREENS, { recursive: true });
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  modelName = `Autocatalytic ${Date.now()}`;
  const res = await engineer.post(`/api/projects/${projectId}/kinetics`, { data: { name: modelName, spec: AUTOCATALYTIC, note: "invented" } });
  expect(res.status(), await res.text()).toBe(201);
  versionId = ((await res.json()) as { version: { id: string } }).version.id;
  browserCtx = await browserAs(browser, engineer);
});
test.afterAll(() => closeAll(browserCtx, engineer));

/** "R = 0.43" as the table writes a ratio: three significant digits, no thousands commas. */
const shownRatio = (r: number) => String(Number(r.toPrecision(3)));

test("a sweep with the tube with recycle: its recycle ratio on the ranked table and on the candidate page", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}/sweeps/new?version=${versionId}`);
  await page.getByLabel("Largest number of stages (1–8)").fill("2");
  await page.getByLabel("Tube with recycle", { exact: true }).check();
  // 3 + 9 sequences of one and two stages of three types.
  await expect(page.getByTestId("sequence-count")).toHaveText("12");
  await expect(page.getByLabel("Chosen for the least volume")).toBeChecked();

  // A fixed ratio below zero is refused at its box, as typed; back to the design's choice before submitting.
  await page.getByLabel("Fixed", { exact: true }).check();
  const ratio = page.getByLabel("Recycle ratio R (recycled flow / flow leaving)");
  await ratio.fill("-0.5");
  await expect(page.locator("#s-recycleRatio-error")).toContainText("0 or more");
  await expect(page.getByTestId("optimisation-count")).toHaveText("—");
  await expectNoSeriousA11yViolations(page, "form[aria-label='New sweep']");
  await page.getByLabel("Chosen for the least volume").check();
  await expect(page.locator("#s-recycleRatio-error")).toHaveCount(0);
  await page.screenshot({ path: `${SCREENS}/recycle-builder.png`, fullPage: true });

  await page.getByRole("button", { name: "Submit sweep" }).click();
  await expect(page).toHaveURL(/\/sweeps\/[0-9a-f-]{36}/);
  const sweepId = /\/sweeps\/([0-9a-f-]{36})/.exec(page.url())![1];
  await waitForSweep(engineer, sweepId);
  await expect(page.getByTestId("sweep-status")).toHaveText("Finished");
  await expect(page.getByTestId("cautions")).toContainText("the recycle pump and line");

  // Only the trains with a tube with recycle: each row says its ratio, as the API gives it.
  await page.getByLabel("Contains the sequence").selectOption("PFR-recycle");
  await expect(page).toHaveURL(/contains=PFR-recycle/);
  const res = await engineer.get(`/api/sweeps/${sweepId}/scenarios/0/candidates?contains=PFR-recycle&pageSize=25`);
  expect(res.status()).toBe(200);
  const items = ((await res.json()) as { items: Row[] }).items;
  expect(items.length).toBe(6);
  const expected = items.map((c) => `R = ${c.stages.filter((s) => s.type === "PFR-recycle").map((s) => shownRatio(s.recycleRatio!)).join("; ")}`);
  await expect(page.getByTestId("recycle-ratios")).toHaveText(expected);
  await expect(page.getByTestId("candidate-row").first().getByRole("img", { name: /Tube with recycle/ }).first()).toBeVisible();
  await page.screenshot({ path: `${SCREENS}/recycle-ranked-table.png`, fullPage: true });

  // The tube with recycle alone: its page shows the type in words, its ratio and its two areas on the chart.
  const alone = items.find((c) => c.sequence.join(" ") === "PFR-recycle")!;
  expect(alone.feasible).toBe(true);
  await page.getByTestId("candidate-row").filter({ has: page.getByRole("img", { name: "Tube with recycle", exact: true }) }).getByTestId("candidate-link").click();
  await expect(page).toHaveURL(new RegExp(`/candidates/${alone.id}`));
  const stages = page.getByTestId("stage-table");
  await expect(stages.getByRole("columnheader", { name: "Recycle ratio R" })).toBeVisible();
  await expect(stages.getByRole("row").nth(1)).toContainText("Tube with recycle");
  await expect(stages.getByRole("row").nth(1)).toContainText(shownRatio(alone.stages[0]!.recycleRatio!));
  await expect(page.getByTestId("chart-under-curve-1")).toBeVisible();
  await expect(page.getByTestId("chart-stage-1")).toHaveAttribute("data-stage-type", "PFR-recycle");
  await expect(page.getByTestId("cautions")).toContainText("the recycle pump and line");
  await page.screenshot({ path: `${SCREENS}/recycle-candidate.png`, fullPage: true });

  // Two trains with a tube with recycle side by side: both charts draw its area under the curve.
  const two = items.filter((c) => c.feasible && c.sequence.length === 2).slice(0, 2);
  await page.goto(`/compare?ids=${two.map((c) => c.id).join(",")}`);
  await appReady(page);
  await expect(page.getByTestId("compare-card")).toHaveCount(2);
  for (const [i, c] of two.entries()) {
    const k = c.sequence.indexOf("PFR-recycle") + 1;
    await expect(page.getByTestId("compare-card").nth(i).getByTestId(`chart-under-curve-${k}`)).toBeVisible();
    await expect(page.getByTestId("compare-card").nth(i).getByTestId("stage-table").getByRole("columnheader", { name: "Recycle ratio R" })).toBeVisible();
  }
  await expect(page.getByTestId("cautions")).toContainText("the recycle pump and line");
  await page.close();
});

test("the API refuses a bad recycle ratio with a 400 naming the field", async () => {
  for (const recycleRatio of [-1, "lots"]) {
    const res = await engineer.post(`/api/projects/${projectId}/sweeps`, {
      data: { kineticsVersionId: versionId, target: { conversion: 0.9 }, train: { candidates: [["PFR-recycle"]], recycleRatio }, grid: [] },
    });
    expect(res.status()).toBe(400);
    const body = (await res.json()) as { error: { message: string; fields: Record<string, string[]> } };
    expect(Object.keys(body.error.fields)).toEqual(["train.recycleRatio"]);
    expect(body.error.message).toMatch(/^Recycle ratio: /);
  }
});

test("rate a fixed train with a tube with recycle: its ratio as an input, named when missing, shown with the result", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}/rate`);
  await page.getByLabel("Kinetics version").selectOption({ label: `${modelName} · v1` });
  await page.getByLabel("Target conversion").fill("0.9");
  const first = page.getByTestId("rate-stage").first();
  await first.getByLabel("Type").selectOption({ label: "Tube with recycle" });
  await first.getByLabel("Volume").fill("180");
  await first.getByLabel("Unit").selectOption("L");
  // Without its ratio the server names the field; nothing is rated.
  await page.getByRole("button", { name: "Rate the train" }).click();
  await expect(first.getByRole("alert")).toContainText("Give the recycle ratio");
  await expect(page.getByTestId("rating-result")).toHaveCount(0);

  await first.getByLabel("Recycle ratio R").fill("0.4");
  await page.getByRole("button", { name: "Rate the train" }).click();
  const api = await engineer.post(`/api/projects/${projectId}/rate`, { data: { kineticsVersionId: versionId, stages: [{ type: "PFR-recycle", volume: 0.18, recycleRatio: 0.4 }], target: 0.9 } });
  expect(api.status()).toBe(200);
  const conversion = ((await api.json()) as { rating: { conversionOut: number } }).rating.conversionOut;
  const stages = page.getByTestId("rating-stages");
  await expect(stages.getByRole("columnheader", { name: "Recycle ratio R" })).toBeVisible();
  await expect(stages.getByRole("row").nth(1)).toContainText("Tube with recycle");
  await expect(stages.getByRole("row").nth(1).getByRole("cell").nth(2)).toHaveText("0.4");
  await expect(page.getByTestId("rating-conversion")).toContainText(String(Number(conversion.toPrecision(5))));
  await expect(page.getByTestId("cautions")).toContainText("the recycle pump and line");
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: `${SCREENS}/recycle-rating.png`, fullPage: true });
  await page.close();
});
