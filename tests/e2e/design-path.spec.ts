import { mkdirSync, readFileSync } from "node:fs";
import { expect as baseExpect, test } from "@playwright/test";
import { CAUTIONS as CAUTION_TEXTS } from "@/lib/engine";
import { appReady } from "./fixtures";
import { signInWithForm } from "./helpers/sign-in";
import { pdfText } from "./helpers/pdf-text";
import { approveAsManager, pinWithNote } from "./helpers/pin-and-approve";

/**
 * The whole path through the screens, from bench data to the downloaded report: upload rates with
 * bad rows, fix them, accept, fit, save the fit as kinetics, sweep on it, pin the best train, have
 * it approved, read the report and its PDF. Only screens are used; nothing is set up over the API.
 */

const SHOTS = "test-results/screens";
mkdirSync(SHOTS, { recursive: true });
const FIXTURES = "tests/fixtures/datasets";
// The machine is shared by several jobs: every wait is generous, none is asserted as a speed.
const expect = baseExpect.configure({ timeout: 30_000 });

test("bench data to downloaded report: upload, fix, accept, fit, sweep, pin, approve, report and PDF", async ({ browser }) => {
  test.setTimeout(600_000);
  const stamp = Date.now();
  const datasetName = `Ester bench path ${stamp}`;
  const modelName = `Ester power law path ${stamp}`;
  const note = `Best train from the bench fit ${stamp}; check the jacket duty`;

  const engineerCtx = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  const page = await engineerCtx.newPage();
  await signInWithForm(page, "engineer", 60_000);

  // 1. Upload the file with bad rows, say what the columns hold, see each bad row marked.
  await page.getByRole("link", { name: "Ester line 3 revamp" }).click();
  await expect(page.getByTestId("project-title")).toHaveText("Ester line 3 revamp");
  const projectUrl = page.url();
  await page.getByRole("region", { name: "Rate data" }).getByRole("link", { name: "Upload rate data" }).click();
  await expect(page.getByRole("heading", { name: "Upload rate data", level: 1 })).toBeVisible();
  await page.getByLabel("CSV or XLSX file").setInputFiles(`${FIXTURES}/ester-bench-with-errors.csv`);
  await page.getByLabel('Column "X" holds').selectOption("conversion");
  await page.getByLabel('Column "rate (mol/L/min)" holds').selectOption("rate");
  await page.getByLabel('Unit of column "rate (mol/L/min)"').selectOption("mol/(L min)");
  await page.getByLabel('Unit of column "T (degC)"').selectOption("degC");
  await expect(page.getByTestId("preview-counts")).toHaveText("10 rows read: 5 good, 5 with problems.");
  const preview = page.getByTestId("preview-table");
  const rowAtLine = (line: number) => preview.getByRole("row").filter({ has: page.getByRole("cell", { name: String(line), exact: true }) });
  await expect(rowAtLine(6)).toContainText('Problem: rate (mol/L/min): "n/a" is not a number');
  await expect(rowAtLine(9)).toContainText("Problem: X: conversion must be in [0, 1)");
  await expect(preview.locator('tbody tr[data-problem="yes"]')).toHaveCount(5);
  await expect(page.getByRole("button", { name: /^Accept/ })).toHaveCount(0);

  // 2. The corrected file, accepted as version 1.
  await page.getByLabel("CSV or XLSX file").setInputFiles(`${FIXTURES}/ester-bench.csv`);
  await expect(page.getByTestId("preview-counts")).toHaveText("10 rows read: 10 good, 0 with problems.");
  await page.getByLabel("Dataset name").fill(datasetName);
  await page.getByLabel("Feed concentration of A (optional)").fill("1");
  await page.getByRole("button", { name: "Accept 10 rows" }).click();
  await expect(page).toHaveURL(/\/datasets\/[0-9a-f-]{36}\?version=1&saved=1$/);
  await expect(page.getByTestId("dataset-title")).toHaveText(datasetName);

  // 3. The dataset from the project page, then the fit screen: two laws, the power law saved as new kinetics.
  await page.goto(projectUrl);
  await appReady(page);
  await page.getByRole("region", { name: "Rate data" }).getByRole("link", { name: datasetName }).click();
  await expect(page.getByTestId("dataset-title")).toHaveText(datasetName);
  await page.getByRole("link", { name: "Fit a rate law" }).click();
  await expect(page.getByTestId("fit-title")).toHaveText(`Fit a rate law to ${datasetName} v1`);
  await page.getByRole("checkbox", { name: /^Power law -rA/ }).check();
  await page.getByRole("checkbox", { name: /^Reversible first order -rA/ }).check();
  // One temperature only: the Arrhenius law has nothing to fit its activation energy to.
  await page.getByRole("checkbox", { name: /^Power law with Arrhenius/ }).uncheck();
  await page.getByRole("checkbox", { name: /^Saturation -rA/ }).uncheck();
  await page.getByRole("button", { name: "Fit", exact: true }).click();
  const comparison = page.getByTestId("fit-comparison");
  await expect(comparison.getByTestId("fit-row-power")).toBeVisible();
  await expect(comparison.getByTestId("fit-row-reversible")).toBeVisible();
  await expect(comparison.locator("tbody tr")).toHaveCount(2);
  // The rates fall faster than first order with conversion, so the power law fits closer: it heads the R² order.
  await comparison.getByRole("button", { name: /^R²/ }).click();
  await expect(comparison.locator("tbody tr").first()).toHaveAttribute("data-testid", "fit-row-power");
  await page.getByRole("radio", { name: "Show plots of the power law" }).check();
  const save = page.getByTestId("save-fit-form");
  await expect(save.getByRole("heading", { name: "Save the power law as kinetics" })).toBeVisible();
  await save.getByLabel("Model name").fill(modelName);
  await save.getByLabel("Molar flow of A, FA0", { exact: true }).fill("0.02");
  await expect(save.getByLabel("Concentration of A, CA0", { exact: true })).toHaveValue("1");
  await save.getByRole("button", { name: "Save as kinetics" }).click();
  await expect(page).toHaveURL(/\/kinetics\/[0-9a-f-]{36}\?saved=1$/);
  await expect(page.getByTestId("kinetics-title")).toHaveText(modelName);
  await expect(page.getByTestId("kinetics-source")).toContainText(`Fitted to ${datasetName} v1 — power`);

  // 4. A small sweep on that version: up to two stages, no grid.
  await page.getByRole("link", { name: "Build a sweep on version 1" }).click();
  await expect(page.getByRole("heading", { name: "New sweep" })).toBeVisible();
  await expect(page.getByLabel("Kinetics version").locator("option:checked")).toHaveText(`${modelName} · v1`);
  await page.getByLabel("Largest number of stages (1–8)").fill("2");
  await expect(page.getByTestId("scenario-count")).toHaveText("1");
  await expect(page.getByTestId("optimisation-count")).toHaveText("6"); // 2 + 4 sequences of 1..2 stages
  await page.getByRole("button", { name: "Submit sweep" }).click();
  await expect(page).toHaveURL(/\/projects\/[0-9a-f-]{36}\/sweeps\/[0-9a-f-]{36}$/);
  await expect(page.getByTestId("sweep-status")).toHaveText("Finished", { timeout: 240_000 });

  // 5. The best candidate (least total volume), pinned with a note.
  await page.getByTestId("sort-totalVolume").click();
  await expect(page).toHaveURL(/sort=totalVolume/);
  await expect(page.getByRole("columnheader", { name: /Total volume/ })).toHaveAttribute("aria-sort", "ascending");
  await page.getByTestId("candidate-link").first().click();
  await expect(page).toHaveURL(/\/candidates\//);
  await expect(page.getByTestId("stage-table")).toBeVisible();
  await expect(page.getByTestId("candidate-title")).toContainText("Rank 1");
  // The train as the candidate page draws it (stage badges), written the way the report writes it.
  const train = ((await page.getByTestId("candidate-title").textContent()) ?? "").match(/CSTR|PFR/g)?.join(" → ") ?? "";
  expect(train).toMatch(/^(CSTR|PFR)( → (CSTR|PFR))?$/);
  // The project may already hold a current design (the seeded one, or another spec's): then pinning asks first.
  const pinned = await pinWithNote(page, note);

  // 6. The manager approves it on the project page.
  await approveAsManager(browser, "Ester line 3 revamp", note, `Approved for the line 3 design basis ${stamp}`);

  // 7. The engineer opens the report: it names the train, the kinetics and the fit's source dataset.
  await page.reload();
  await appReady(page);
  await expect(pinned.getByTestId("pin-state")).toHaveText(/approved/i);
  await pinned.getByTestId("pin-report").click();
  await expect(page).toHaveURL(/\/pins\/[0-9a-f-]{36}\/report$/);
  await expect(page.getByTestId("report-train")).toHaveText(train);
  const report = page.getByTestId("design-report");
  await expect(report).toContainText(`${modelName}, version 1`);
  await expect(report).toContainText(`${datasetName}, version 1 (ester-bench.csv, 10 rows)`);
  await expect(report).toContainText("fitted rate law");
  await expect(report).toContainText(note);
  for (const c of CAUTION_TEXTS) await expect(page.getByTestId("cautions").first()).toContainText(c);
  await page.screenshot({ path: `${SHOTS}/design-path-report.png`, fullPage: true });

  // 8. The PDF, downloaded from the report page, says the same.
  const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("report-pdf").click()]);
  expect(download.suggestedFilename()).toMatch(/\.pdf$/);
  const text = await pdfText(readFileSync((await download.path())!));
  expect(text).toContain(`Sequence ${train}`);
  expect(text).toContain(modelName);
  expect(text).toContain(datasetName);
  expect(text).toContain("ester-bench.csv");
  expect(text).toContain("fitted rate law");
  for (const c of CAUTION_TEXTS) expect(text).toContain(c);
  await engineerCtx.close();
});
