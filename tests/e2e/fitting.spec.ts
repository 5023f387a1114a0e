import { mkdirSync } from "node:fs";
import { expect, test } from "@playwright/test";
import { insertDatasetVersion } from "./dataset-fixtures";
import { expectReadableAxes } from "./chart-fixtures";
import { appReady, signedInContext, USERS } from "./fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { signInWithForm } from "./helpers/sign-in";

const SHOTS = "test-results/screens";
mkdirSync(SHOTS, { recursive: true });

// Demo bench data (invented): a saturating rate with ±1 % deterministic scatter, so R² < 1.
const ROWS = Array.from({ length: 12 }, (_, i) => {
  const c = 50 + i * 80;
  return { concA: c, rate: ((1.8 * c) / (220 + c)) * (1 + 0.01 * Math.sin(3 * i + 1)) };
});

test("an engineer fits two laws to a dataset version, compares them and saves one as kinetics", async ({ page }) => {
  const name = `Lipase bench rates ${Date.now()}`;
  const { projectId, datasetId } = await insertDatasetVersion({ email: USERS.engineer, projectName: "Ester line 3 revamp", name, rows: ROWS });

  await signInWithForm(page, "engineer");

  await page.goto(`/projects/${projectId}/datasets/${datasetId}/fit?version=1`);
  await appReady(page);
  await expect(page.getByTestId("fit-title")).toHaveText(`Fit a rate law to ${name} v1`);
  await expect(page.getByTestId("fit-points")).toContainText("12 points");
  // No temperature column: power and saturation are chosen by default; make it explicit.
  await expect(page.getByRole("checkbox", { name: /^Power law -rA/ })).toBeChecked();
  await expect(page.getByRole("checkbox", { name: /^Saturation -rA/ })).toBeChecked();
  await page.getByRole("button", { name: "Fit", exact: true }).click();

  const table = page.getByTestId("fit-comparison");
  await expect(table.getByTestId("fit-row-power")).toBeVisible();
  await expect(table.getByTestId("fit-row-saturation")).toBeVisible();
  await expect(page.getByTestId("fit-range")).toContainText("C_A 50 to 930 mol/m³");
  // Sorting by R² puts the better fit (the saturation law the data came from) first.
  await table.getByRole("button", { name: /^R²/ }).click();
  await expect(table.locator("tbody tr").first()).toHaveAttribute("data-testid", "fit-row-saturation");

  await page.getByRole("radio", { name: "Show plots of the saturation" }).check();
  await expect(page.getByTestId("parity-plot")).toContainText("Parity plot: Saturation");
  await expect(page.getByTestId("residual-plot")).toContainText("Residuals: Saturation");
  await expect(page.getByTestId("parity-plot").locator("svg").first()).toBeVisible();
  await expectReadableAxes(page.getByTestId("parity-plot"), ["Measured −rA, mol/(m³·s)", "Fitted −rA, mol/(m³·s)"]);
  await expectReadableAxes(page.getByTestId("residual-plot"), ["Measured −rA, mol/(m³·s)", "Residual, mol/(m³·s)"]);
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: `${SHOTS}/fit-screen.png`, fullPage: true });

  const save = page.getByTestId("save-fit-form");
  await save.getByLabel("Model name").fill(`Lipase saturation ${Date.now()}`);
  await save.getByLabel("Molar flow of A, FA0", { exact: true }).fill("0.2");
  await save.getByLabel("Concentration of A, CA0", { exact: true }).fill("1");
  await save.getByRole("button", { name: "Save as kinetics" }).click();

  await expect(page).toHaveURL(/\/kinetics\/[0-9a-f-]{36}\?saved=1$/);
  const source = page.getByTestId("kinetics-source");
  await expect(source).toContainText(`Fitted to ${name} v1 — saturation, vmax = `);
  await expect(source).toContainText("R² = 0.99");
  await expect(source.getByRole("link", { name: `${name} v1` })).toHaveAttribute("href", `/projects/${projectId}/datasets/${datasetId}/fit?version=1`);
  await page.screenshot({ path: `${SHOTS}/kinetics-fitted-source.png`, fullPage: true });
  await expectNoSeriousA11yViolations(page);
});

test("the fit endpoints answer a bad body with 400 naming the field, and write nothing", async () => {
  const { versionId, projectId } = await insertDatasetVersion({ email: USERS.engineer, projectName: "Ester line 3 revamp", name: `Bad body ${Date.now()}`, rows: ROWS });
  const api = await signedInContext("engineer");
  const fits = await api.post(`/api/dataset-versions/${versionId}/fits`, { data: { laws: ["cubic"] } });
  expect(fits.status()).toBe(400);
  expect(Object.keys(((await fits.json()) as { error: { fields: Record<string, string[]> } }).error.fields)).toEqual(["laws.0"]);
  const before = ((await (await api.get(`/api/projects/${projectId}/kinetics`)).json()) as { models: unknown[] }).models.length;
  const save = await api.post(`/api/dataset-versions/${versionId}/kinetics`, { data: { law: "power", modelName: "Never saved", feed: { flowA: "lots", concA: 1000 } } });
  expect(save.status()).toBe(400);
  expect(((await save.json()) as { error: { fields: Record<string, string[]> } }).error.fields).toHaveProperty(["feed.flowA"]);
  const after = ((await (await api.get(`/api/projects/${projectId}/kinetics`)).json()) as { models: unknown[] }).models.length;
  expect(after).toBe(before);
  await api.dispose();
});
