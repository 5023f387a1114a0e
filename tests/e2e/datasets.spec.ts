import { mkdirSync } from "node:fs";
import { expect as baseExpect, test } from "@playwright/test";
import { expectReadableAxes } from "./chart-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { signInWithForm } from "./helpers/sign-in";

const SHOTS = "test-results/screens";
mkdirSync(SHOTS, { recursive: true });
const FIXTURES = "tests/fixtures/datasets";
// Server pages and previews can take several seconds while other jobs share the machine.
const expect = baseExpect.configure({ timeout: 20_000 });

test("an engineer uploads bench rates, fixes the bad rows, accepts them and uses them as a measured rate table", async ({ page }) => {
  await signInWithForm(page, "engineer");
  await page.getByRole("link", { name: "Ester line 3 revamp" }).click();
  await expect(page.getByTestId("project-title")).toHaveText("Ester line 3 revamp");
  const rateData = page.getByRole("region", { name: "Rate data" });
  await expect(rateData.getByTestId("datasets-table")).toContainText("Bench runs at 67 °C");
  await rateData.getByRole("link", { name: "Upload rate data" }).click();
  await expect(page.getByRole("heading", { name: "Upload rate data", level: 1 })).toBeVisible();

  // A file with bad rows: the columns are recognised, every bad row is marked with its reason.
  await page.getByLabel("CSV or XLSX file").setInputFiles(`${FIXTURES}/ester-bench-with-errors.csv`);
  await expect(page.getByLabel('Column "X" holds')).toHaveValue("conversion");
  await expect(page.getByLabel('Column "rate (mol/L/min)" holds')).toHaveValue("rate");
  await expect(page.getByLabel('Unit of column "rate (mol/L/min)"')).toHaveValue("mol/(L min)");
  await expect(page.getByLabel('Unit of column "T (degC)"')).toHaveValue("degC");
  await expect(page.getByTestId("preview-counts")).toHaveText("10 rows read: 5 good, 5 with problems.", { timeout: 15_000 });
  await expect(page.getByTestId("fix-advice")).toContainText("choose the corrected file");
  const table = page.getByTestId("preview-table");
  const reasons: [number, string][] = [
    [4, "rate (mol/L/min): missing"],
    [6, 'rate (mol/L/min): "n/a" is not a number'],
    [7, "rate (mol/L/min): the rate must be positive"],
    [9, "X: conversion must be in [0, 1)"],
    [10, "duplicate conversion 0.6 at one temperature (first on line 8)"],
  ];
  for (const [line, reason] of reasons) {
    const row = table.getByRole("row").filter({ has: page.getByRole("cell", { name: String(line), exact: true }) });
    await expect(row, `line ${line}`).toContainText(`Problem: ${reason}`);
  }
  await expect(page.getByRole("button", { name: /^Accept/ })).toHaveCount(0);
  await page.getByLabel("Show only rows with problems").check();
  await expect(table.locator("tbody tr")).toHaveCount(5);
  await expect(table.locator('tbody tr[data-problem="no"]')).toHaveCount(0);
  await page.screenshot({ path: `${SHOTS}/dataset-upload-problems.png`, fullPage: true });
  await expectNoSeriousA11yViolations(page);

  // The corrected file, with the column choices kept.
  await page.getByLabel('Unit of column "T (degC)"').selectOption("degC");
  await page.getByLabel("CSV or XLSX file").setInputFiles(`${FIXTURES}/ester-bench.csv`);
  await expect(page.getByTestId("preview-counts")).toHaveText("10 rows read: 10 good, 0 with problems.");
  await expect(page.getByLabel('Column "X" holds')).toHaveValue("conversion");
  const name = `Bench re-run ${Date.now()}`;
  await page.getByLabel("Dataset name").fill(name);
  await page.getByLabel("Feed concentration of A (optional)").fill("1");
  await page.getByRole("button", { name: "Accept 10 rows" }).click();

  await expect(page).toHaveURL(/\/datasets\/[0-9a-f-]{36}\?version=1&saved=1$/);
  await expect(page.getByTestId("dataset-title")).toHaveText(name);
  await expect(page.getByText("Accepted 10 rows as version 1.")).toBeVisible();
  const rows = page.getByTestId("dataset-rows");
  await expect(rows.locator("tbody tr")).toHaveCount(10);
  // 7.344 mol/(L·min) shown back in the unit it was uploaded in; 67 °C stored as 340.15 K and shown as 67.
  await expect(rows.locator("tbody tr").first()).toContainText("7.344");
  await expect(rows.locator("tbody tr").first()).toContainText("67");
  await page.getByLabel("Show the rate in").selectOption("mol/(m3 s)");
  await expect(rows.locator("tbody tr").first()).toContainText("122.4"); // 7.344 × 1000/60, exact unit factors
  await expect(page.getByTestId("inverse-rate-plot").getByRole("img", { name: /1\/\(−rA\) against conversion: 10 points/ })).toBeVisible();
  await expectReadableAxes(page.getByTestId("inverse-rate-plot"), ["Conversion X", "1/(−rA), m³·s/mol"]);
  await expect(page.getByRole("link", { name: "Fit a rate law" })).toHaveAttribute("href", /\/fit\?version=1$/);
  await expect(page.getByRole("link", { name: "Upload a new version" })).toBeVisible();
  await page.screenshot({ path: `${SHOTS}/dataset-page.png`, fullPage: true });
  await expectNoSeriousA11yViolations(page);

  // Use the version as a measured rate table.
  const useForm = page.getByRole("form", { name: "Use as measured rate table" });
  await expect(useForm.getByLabel("Feed concentration of A, CA0", { exact: true })).toHaveValue("1");
  await useForm.getByLabel("Model name").fill(`${name} table`);
  await useForm.getByRole("button", { name: "Create kinetics from this table" }).click();
  const created = useForm.getByRole("link", { name: `${name} table v1` });
  await expect(created).toBeVisible();
  await created.click();
  await expect(page.getByTestId("kinetics-title")).toHaveText(`${name} table`);
  await expect(page.getByTestId("versions-table")).toContainText("table");
  // Back on the dataset page, the kinetics made from it are listed.
  await page.goBack();
  await page.reload();
  await expect(page.getByTestId("dataset-sources")).toContainText(`${name} table, version 1 — measured rate table from version 1`);
});
