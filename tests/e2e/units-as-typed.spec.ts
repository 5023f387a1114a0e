import { expect, test } from "@playwright/test";
import { appReady, signedInContext } from "./fixtures";
import { createModel, firstProjectId, waitForSweep } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { signInWithForm } from "./helpers/sign-in";

// Exact definitions (lib/units/display.ts): T[K] = T[degC] + 273.15; 1 kmol/h = 1000 mol / 3600 s.

test("the design engineer's units stay as typed: picking a unit keeps the number, the model reopens as typed", async ({ page }) => {
  const api = await signedInContext("engineer");
  const projectId = await firstProjectId(api);
  await signInWithForm(page, "engineer");
  await page.goto(`/projects/${projectId}/kinetics/new`);
  await appReady(page);
  await expect(page.getByRole("heading", { name: "New kinetics" })).toBeVisible();

  await page.getByLabel("Model name").fill(`Units as typed ${Date.now()}`);
  const temperature = page.getByLabel("Feed temperature", { exact: true });
  await temperature.fill("60");
  await page.getByLabel("Feed temperature unit").selectOption("degC");
  await expect(temperature).toHaveValue("60");
  await expect(page.getByTestId("f-feed-temperature-value-echo")).toHaveText("= 333.15 K");

  const flow = page.getByLabel("Molar flow of A, FA0", { exact: true });
  await flow.fill("5");
  await page.getByLabel("Molar flow of A, FA0 unit").selectOption("kmol/h");
  await expect(flow).toHaveValue("5");
  await expect(page.getByTestId("f-feed-flowA-value-echo")).toHaveText("= 1.38889 mol/s");
  await expectNoSeriousA11yViolations(page);

  await page.getByRole("button", { name: "Save kinetics" }).click();
  await expect(page).toHaveURL(/\/kinetics\/[0-9a-f-]{36}\?saved=1$/);
  const modelId = /kinetics\/([0-9a-f-]{36})/.exec(page.url())![1];

  await page.reload();
  await appReady(page);
  await expect(page.getByLabel("Feed temperature", { exact: true })).toHaveValue("60");
  await expect(page.getByLabel("Feed temperature unit")).toHaveValue("degC");
  await expect(page.getByLabel("Molar flow of A, FA0", { exact: true })).toHaveValue("5");
  await expect(page.getByLabel("Molar flow of A, FA0 unit")).toHaveValue("kmol/h");

  const { model } = (await (await api.get(`/api/kinetics/${modelId}`)).json()) as { model: { versions: { spec: { feed: { flowA: number; temperature: number } } }[] } };
  expect(model.versions[0].spec.feed.temperature).toBeCloseTo(333.15, 9);
  expect(model.versions[0].spec.feed.flowA).toBeCloseTo(5000 / 3600, 9);
  await api.dispose();
});

test("a spec with a target of \"90 %\" is accepted and the sweep's grid axis shows FA0 in the kinetics' kmol/h", async ({ page }) => {
  const api = await signedInContext("engineer");
  const projectId = await firstProjectId(api);
  const { model } = await createModel(api, projectId);
  // The API model above carries no shown units; a version typed in kmol/h does.
  const typed = await api.post(`/api/kinetics/${model.id}/versions`, {
    data: {
      spec: { feed: { flowA: 5000 / 3600, concA: 1000, temperature: 340, ratios: { B: "1.2" } }, reaction: { stoichiometry: { A: -1, B: -1, R: 1 }, rate: { law: "power", k: 1e-4, orders: { A: 1, B: 1 } } }, shownUnits: { "feed.flowA": "kmol/h", "feed.concA": "mol/L" } },
      note: "typed in kmol/h",
    },
  });
  expect(typed.status(), await typed.text()).toBe(201);
  const typedVersion = ((await typed.json()) as { version: { id: string } }).version;

  const res = await api.post(`/api/projects/${projectId}/sweeps`, {
    data: {
      kineticsVersionId: typedVersion.id,
      target: { conversion: "90 %" },
      train: { maxStages: 2, types: ["CSTR", "PFR"] },
      grid: [
        { field: "feed.flowA", values: [5000 / 3600, 10000 / 3600] },
        { field: "target.conversion", values: [0.8, 0.9] },
      ],
    },
  });
  expect(res.status(), await res.text()).toBe(201);
  const sweep = ((await res.json()) as { sweep: { id: string } }).sweep;
  const bad = await api.post(`/api/projects/${projectId}/sweeps`, {
    data: { kineticsVersionId: typedVersion.id, target: { conversion: "ninety" }, train: { maxStages: 2 } },
  });
  expect(bad.status()).toBe(400);
  expect(await bad.text()).toContain("Target conversion");
  await waitForSweep(api, sweep.id);

  await signInWithForm(page, "engineer");
  await page.goto(`/projects/${projectId}/sweeps/${sweep.id}`);
  await appReady(page);
  const map = page.getByTestId("heat-map");
  await expect(map).toContainText("kmol/h", { timeout: 60_000 });
  await expect(map.getByRole("columnheader", { name: "5", exact: true }).or(map.getByRole("rowheader", { name: "5", exact: true }))).toBeVisible();
  await expect(map).not.toContainText("mol/s");
  await api.dispose();
});
