import { expect, test, type APIRequestContext, type BrowserContext } from "@playwright/test";
import { openPage, signedInContext } from "./fixtures";
import { emptyStageCount, leadingNumber, listCandidates } from "./ranked-rows";
import { createModel, firstProjectId, submitSweep, waitForSweep } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll, signInWithForm } from "./helpers/sign-in";

let engineer: APIRequestContext;
let browserCtx: BrowserContext;
let projectId: string;
let versionId: string;
let modelLabel: string;

test.beforeAll(async ({ browser }) => {
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  modelLabel = `Read-right kinetics ${Date.now()}`;
  versionId = (await createModel(engineer, projectId, modelLabel)).version.id;
  browserCtx = await browserAs(browser, engineer);
});
test.afterAll(() => closeAll(browserCtx, engineer));

test("the kinetics preview never shows a figure it cannot stand behind", async ({ page }) => {
  await signInWithForm(page, "engineer");
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
  await expectNoSeriousA11yViolations(page, "[data-testid=kinetics-preview]");
});

test("an expression whose rate overflows is named in the preview, never drawn as 0 L", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}/kinetics/new`);
  const pfr = page.getByTestId("single-pfr-volume");
  await expect(pfr).not.toHaveText("—");
  await page.getByRole("radiogroup", { name: "Rate law" }).getByRole("radio", { name: /Expression/ }).check();
  // exp(1000 X) passes the largest double (about 1.8e308, from memory) beyond X = 0.71: no volume can be computed.
  await page.getByLabel("Expression for −rA").fill("exp(1000*X)");
  await expect(page.getByTestId("preview-error")).toContainText("rate overflows");
  await expect(pfr).toHaveText("—");
  await expect(page.getByTestId("single-cstr-volume")).toHaveText("—");
  await expect(page.getByTestId("kinetics-preview")).not.toContainText(/(^|[^0-9.])0 L/);
  await page.close();
});

test("rating a 1e30 m³ vessel is refused with a message naming the stage volume", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}/rate`);
  await expect(page.getByRole("heading", { name: "Rate a fixed train", level: 1 })).toBeVisible();
  await page.getByLabel("Kinetics version").selectOption({ label: `${modelLabel} · v1` });
  await page.getByLabel("Target conversion").fill("0.8");
  const first = page.getByTestId("rate-stage").first();
  await first.getByLabel("Volume").fill("1e30");
  await first.getByLabel("Unit").selectOption("m3");
  await page.getByRole("button", { name: "Rate the train" }).click();
  await expect(first).toContainText("Stage 1 volume");
  await expect(page.getByText("Nothing was rated")).toBeVisible();
  await expect(page.getByTestId("rating-result")).toHaveCount(0);
  await expectNoSeriousA11yViolations(page, "main");
  // A sensible vessel after the slip is rated as usual.
  await first.getByLabel("Volume").fill("10");
  await first.getByLabel("Unit").selectOption("L");
  await page.getByRole("button", { name: "Rate the train" }).click();
  await expect(page.getByTestId("rating-result")).toBeVisible();
  await page.close();

  // The server refuses it too, whoever sends it, naming the field as the form labels it.
  const res = await engineer.post(`/api/projects/${projectId}/rate`, {
    data: { kineticsVersionId: versionId, target: 0.8, stages: [{ type: "CSTR", volume: 1e30 }] },
  });
  expect(res.status()).toBe(400);
  const { error } = (await res.json()) as { error: { message: string; fields: Record<string, string[]> } };
  expect(error.message).toContain("Stage 1 volume");
  expect(error.message).not.toContain("stages.0");
  expect(error.fields["stages.0.volume"]).toBeDefined();
});

test("least volume: the top rows are trains whose every stage does work; padded trains come after", async () => {
  // Second order, irreversible: the rate only falls with X, so a stirred tank before or after a tube
  // only adds volume and its best size is zero (common practice): trains like CSTR then PFR are padded.
  const sweep = await submitSweep(engineer, projectId, versionId, [], 3);
  await waitForSweep(engineer, sweep.id);
  const page = await openPage(browserCtx, `/projects/${projectId}/sweeps/${sweep.id}`);
  await expect(page.getByTestId("sweep-status")).toHaveText("Finished");

  const items = await listCandidates(engineer, sweep.id);
  const feasible = items.filter((c) => c.feasible);
  const padded = feasible.map((c, i) => (emptyStageCount(c) > 0 ? i : -1)).filter((i) => i >= 0);
  const whole = feasible.map((c, i) => (emptyStageCount(c) === 0 ? i : -1)).filter((i) => i >= 0);
  expect(padded.length, "this kinetics gives padded trains").toBeGreaterThan(0);
  expect(whole.length).toBeGreaterThan(0);
  expect(Math.max(...whole)).toBeLessThan(Math.min(...padded));
  // Rank 1 is the single tube (the least volume for a rate that only falls, common practice).
  expect(feasible[0].sequence).toEqual(["PFR"]);

  // The page shows the same order, and the top rows' stages each have a volume.
  const top = whole.length;
  const rows = page.getByTestId("candidate-row");
  await expect(rows.first()).toBeVisible();
  const shown = await rows.count();
  expect(shown).toBeGreaterThanOrEqual(top);
  await expect(rows.locator("td:nth-child(2)")).toHaveText(items.slice(0, shown).map((c) => String(c.rank)));
  // The API counts the empty stages as this test does, and the table marks the padded rows only.
  for (const c of feasible) expect((c as { emptyStages?: number }).emptyStages ?? 0).toBe(emptyStageCount(c));
  await expect(rows.first().getByTestId("empty-stages")).toHaveCount(0);
  const firstPadded = Math.min(...padded);
  if (firstPadded < shown) await expect(rows.nth(firstPadded).getByTestId("empty-stages")).toHaveText(/^\d+ empty stages?$/);
  for (let r = 0; r < top; r++) {
    const cells = await rows.nth(r).locator("li").allInnerTexts();
    expect(cells.length).toBe(feasible[r].stages.length);
    for (const cell of cells) {
      // "1 0.92 L → 0.9": the stage number, then its volume.
      const volume = leadingNumber(cell.replace(/^\s*[0-9]+\s+/, ""));
      expect(volume, `row ${r + 1}: ${cell}`).toBeGreaterThan(0);
    }
  }
  await page.close();
});

test("with reuse of idle vessels and the cost objective, ranks follow the cost with reuse; both costs shown", async () => {
  // A free idle stirred tank far larger than any stage here (about 6 L for one CSTR): it equips any CSTR stage.
  const tag = `RR-${Date.now().toString(36)}`;
  const added = await engineer.post("/api/inventory", { data: { tag, type: "CSTR", volume: 0.05, reuseCost: 0 } });
  expect(added.status(), await added.text()).toBe(201);

  const page = await openPage(browserCtx, `/projects/${projectId}/sweeps/new?version=${versionId}`);
  await page.getByLabel("Least vessel cost").check();
  await expect(page.getByText(/Filled from the project's cost basis/)).toBeVisible();
  await page.getByLabel("Reuse idle vessels from the inventory").check();
  await page.getByRole("button", { name: "Submit sweep" }).click();
  await expect(page).toHaveURL(/\/sweeps\/[0-9a-f-]{36}/);
  const sweepId = /\/sweeps\/([0-9a-f-]{36})/.exec(page.url())![1];
  await waitForSweep(engineer, sweepId);
  await expect(page.getByTestId("sweep-status")).toHaveText("Finished");

  const items = await listCandidates(engineer, sweepId);
  const costed = items.filter((c) => c.feasible);
  expect(costed.length).toBeGreaterThan(1);
  for (const c of costed) {
    expect(typeof c.installedCost, `rank ${c.rank}`).toBe("number");
    expect(typeof c.allNewCost, `rank ${c.rank}`).toBe("number");
    // Reuse can only lower what the user pays.
    expect(c.installedCost!).toBeLessThanOrEqual(c.allNewCost! * (1 + 1e-9));
  }
  // The ranks follow the cost with reuse ...
  for (let i = 1; i < costed.length; i++) expect(costed[i].installedCost!).toBeGreaterThanOrEqual(costed[i - 1].installedCost!);
  // ... and not the all-new cost: somewhere a train that costs more all new ranks first, because it reuses the free tank.
  const inverted = costed.some((a, i) => costed.slice(i + 1).some((b) => a.allNewCost! > b.allNewCost! && a.installedCost! < b.installedCost!));
  expect(inverted, "a reused vessel reorders the trains").toBe(true);

  // The page shows both costs, in the rank order of the API.
  const rows = page.getByTestId("candidate-row");
  await expect(rows.first()).toBeVisible();
  await expect(page.getByRole("columnheader", { name: "Installed, all new" })).toBeVisible();
  // Text content, not inner text: the headers are styled in capitals.
  const headers = await page.getByTestId("ranked-table").locator("thead th").allTextContents();
  const withReuse = headers.findIndex((h) => h.trim().startsWith("Installed cost"));
  const allNew = headers.findIndex((h) => h.trim().startsWith("Installed, all new"));
  expect(withReuse).toBeGreaterThan(0);
  expect(allNew).toBeGreaterThan(0);
  const shown = Math.min(await rows.count(), costed.length);
  await expect(rows.locator("td:nth-child(2)")).toHaveText(items.slice(0, await rows.count()).map((c) => String(c.rank)));
  const paid = (await rows.locator(`td:nth-child(${withReuse + 1})`).allInnerTexts()).slice(0, shown).map(leadingNumber);
  const fullPrice = (await rows.locator(`td:nth-child(${allNew + 1})`).allInnerTexts()).slice(0, shown).map(leadingNumber);
  for (let i = 0; i < shown; i++) {
    // Shown to 4 significant figures: compare with the API's figures at that precision.
    expect(paid[i]).toBeCloseTo(Number(costed[i].installedCost!.toPrecision(4)), 6);
    expect(fullPrice[i]).toBeCloseTo(Number(costed[i].allNewCost!.toPrecision(4)), 6);
    if (i > 0) expect(paid[i]).toBeGreaterThanOrEqual(paid[i - 1]);
  }
  await page.close();
});

test("sweep builder: refuses bad values as typed, starts costs from the project's basis, drops a stale server message", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}/sweeps/new?version=${versionId}`);
  const trains = page.getByTestId("optimisation-count");
  await expect(trains).not.toHaveText("—");

  // A conversion above 1: the message is beside the field before any submit, and no trains are counted.
  const target = page.getByLabel("Target conversion X", { exact: true });
  await target.fill("1.5");
  await expect(page.locator("#s-target-error")).toContainText("between 0 and 1");
  await expect(trains).toHaveText("—");
  await target.fill("0");
  await expect(page.locator("#s-target-error")).toContainText("between 0 and 1");
  await expect(trains).toHaveText("—");
  await target.fill("0.9");
  await expect(page.locator("#s-target-error")).toHaveCount(0);
  await expect(trains).not.toHaveText("—");

  // Nine stages is beyond the engine's eight: refused as typed (not 1,022 sequences counted).
  const stages = page.getByLabel("Largest number of stages (1–8)");
  await stages.fill("9");
  await expect(page.locator("#s-maxStages-error")).toContainText("from 1 to 8");
  await expect(trains).toHaveText("—");
  await expect(page.getByTestId("sequence-count")).toHaveText("—");
  await stages.fill("2.5");
  await expect(page.locator("#s-maxStages-error")).toContainText("whole number");
  await expect(trains).toHaveText("—");
  await stages.fill("3");
  await expect(page.locator("#s-maxStages-error")).toHaveCount(0);
  await expect(page.getByTestId("sequence-count")).toHaveText("14"); // 2 + 4 + 8 sequences of 1..3 stages

  // Grid values: a negative flow and a value left out between two commas.
  await page.getByRole("button", { name: "+ Vary a field" }).click();
  const values = page.getByLabel("Values (comma separated)");
  await values.fill("-1, 2");
  await expect(page.locator("#s-grid-0-values-error")).toContainText("above zero");
  await expect(trains).toHaveText("—");
  await values.fill("1,,2");
  await expect(page.locator("#s-grid-0-values-error")).toContainText("missing between two commas");
  await expect(trains).toHaveText("—");
  await expectNoSeriousA11yViolations(page, "form[aria-label='New sweep']");
  await values.fill("1, 2");
  await expect(page.getByTestId("scenario-count")).toHaveText("2");
  await expect(trains).toHaveText("28");

  // The cost objective starts from the project's cost basis, not from numbers of its own.
  const { costs } = (await (await engineer.get(`/api/projects/${projectId}/costs`)).json()) as {
    costs: { basis: { vessels: Record<"CSTR" | "PFR", { a: number; b: number; n: number }>; installationFactor: { value: number } } };
  };
  await page.getByLabel("Least vessel cost").check();
  await expect(page.getByText(/Filled from the project's cost basis/)).toBeVisible();
  for (const t of ["CSTR", "PFR"] as const) {
    await expect(page.locator(`#s-vessel${t}-a`)).toHaveValue(String(costs.basis.vessels[t].a));
    await expect(page.locator(`#s-vessel${t}-b`)).toHaveValue(String(costs.basis.vessels[t].b));
    await expect(page.locator(`#s-vessel${t}-n`)).toHaveValue(String(costs.basis.vessels[t].n));
  }
  await expect(page.locator("#s-installationFactor")).toHaveValue(String(costs.basis.installationFactor.value));
  await page.getByLabel("Least total volume").check();

  // A server refusal (3,000 scenarios, above the 2,000 a sweep holds) shows beside the button ...
  const axis1 = page.getByRole("group", { name: "Varied field 1" });
  await axis1.getByLabel("Range", { exact: true }).check();
  // A range may not start below zero either.
  await axis1.getByLabel("From", { exact: true }).fill("-1");
  await axis1.getByLabel("To", { exact: true }).fill("0.05");
  await expect(page.locator("#s-grid-0-from-error")).toContainText("above zero");
  await expect(trains).toHaveText("—");
  await axis1.getByLabel("From", { exact: true }).fill("0.01");
  await axis1.getByLabel("To", { exact: true }).fill("0.05");
  await axis1.getByLabel("Steps", { exact: true }).fill("1000");
  await page.getByRole("button", { name: "+ Vary a field" }).click();
  await page.getByRole("group", { name: "Varied field 2" }).getByLabel("Values (comma separated)").fill("0.7, 0.8, 0.9");
  await expect(page.getByTestId("scenario-count")).toHaveText(/3,?000/);
  await page.getByRole("button", { name: "Submit sweep" }).click();
  const aside = page.locator("aside");
  await expect(aside.getByText(/at most 2,?000/)).toBeVisible();
  await expect(page).toHaveURL(/\/sweeps\/new/);
  // ... and goes once a field is changed: it spoke of values no longer in the form.
  await axis1.getByLabel("Steps", { exact: true }).fill("3");
  await expect(page.getByTestId("scenario-count")).toHaveText("9");
  await expect(aside.getByText(/at most 2,?000/)).toHaveCount(0);
  await page.close();
});
