import { mkdirSync, readFileSync } from "node:fs";
import { expect as baseExpect, test } from "@playwright/test";
import { CAUTIONS as CAUTION_TEXTS } from "@/lib/engine";
import { appReady } from "./fixtures";
import { leadingNumber } from "./ranked-rows";
import { signInWithForm } from "./helpers/sign-in";
import { pdfText } from "./helpers/pdf-text";
import { approveAsManager, pinWithNote } from "./helpers/pin-and-approve";

/**
 * The whole path for a chemistry with side reactions, through the screens only: a model of several
 * reactions whose concentration path follows a changed rate constant, a sweep on it ranked by yield,
 * the best train opened, pinned, approved by the manager, and its report downloaded with the outlet
 * composition table in its text.
 */

const SHOTS = "test-results/screens";
mkdirSync(SHOTS, { recursive: true });
// The machine is shared by several jobs: every wait is generous, none is asserted as a speed.
const expect = baseExpect.configure({ timeout: 30_000 });

test("several reactions, end to end: model, path chart, sweep, sort by yield, candidate, pin, approve, report", async ({ browser }) => {
  test.setTimeout(600_000);
  const stamp = Date.now();
  const modelName = `Series chemistry journey ${stamp}`;
  const note = `Best yield of B, journey check ${stamp}`;

  const engineerCtx = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  const page = await engineerCtx.newPage();
  await signInWithForm(page, "engineer", 60_000);

  // 1. A new model of several reactions in the demo's series-parallel project.
  await page.getByRole("link", { name: "Mono-adduct campaign" }).click();
  await expect(page.getByTestId("project-title")).toHaveText("Mono-adduct campaign");
  const projectUrl = page.url();
  await page.goto(`${projectUrl}/kinetics/new`);
  await appReady(page);
  await page.getByRole("link", { name: /Several reactions/ }).click();
  await expect(page.getByTestId("reaction-2-equation")).toHaveText("B → C");

  // 2. The concentration path follows reaction 2's rate constant: a slower over-reaction leaves more B.
  const tube = page.getByTestId("best-tube-product");
  await expect(page.getByTestId("network-path-chart")).toBeVisible();
  await expect(tube).toHaveText(/\d/);
  const before = leadingNumber((await tube.textContent()) ?? "");
  const k2 = page.getByTestId("reaction-2").getByLabel("Rate constant k", { exact: true });
  const k2Before = Number(await k2.inputValue());
  await k2.fill(String(k2Before / 2));
  await expect.poll(async () => leadingNumber((await tube.textContent()) ?? "")).toBeGreaterThan(before);
  await page.getByLabel("Model name").fill(modelName);
  await page.getByRole("button", { name: "Save kinetics" }).click();
  await expect(page).toHaveURL(/\/kinetics\/[0-9a-f-]{36}\?saved=1$/);
  await appReady(page);

  // 3. A sweep on it: up to two stages, ranked by the yield of the wanted product.
  await page.getByRole("link", { name: "Build a sweep on version 1" }).click();
  await expect(page.getByRole("heading", { name: "New sweep" })).toBeVisible();
  await expect(page.getByLabel("Wanted product", { exact: true })).toHaveValue("B");
  await page.getByLabel("Largest number of stages (1–5)", { exact: true }).fill("2");
  await expect(page.getByTestId("optimisation-count")).toHaveText("6"); // 2 + 4 sequences of 1..2 stages
  await page.getByRole("button", { name: "Submit sweep" }).click();
  await expect(page).toHaveURL(/\/projects\/[0-9a-f-]{36}\/sweeps\/[0-9a-f-]{36}$/, { timeout: 60_000 });
  await expect(page.getByTestId("sweep-status")).toHaveText("Finished", { timeout: 240_000 });
  await expect(page.getByTestId("sweep-objective")).toContainText("Highest yield of B");

  // 4. Sorted by yield on the server: the first row holds the largest yield of the page.
  await page.getByTestId("sort-yield").click();
  await expect(page).toHaveURL(/sort=yield/);
  await expect(page.getByRole("columnheader", { name: /Yield of B/ })).toHaveAttribute("aria-sort", "descending");
  const yieldColumn = async () => {
    const headers = await page.getByTestId("ranked-table").locator("thead th").allInnerTexts();
    // Headers are set in capitals by the stylesheet, and innerText follows it.
    const index = headers.findIndex((h) => /yield of b/i.test(h));
    const cells = await page.getByTestId("candidate-row").locator(`td:nth-child(${index + 1})`).allInnerTexts();
    return cells.map(leadingNumber).filter(Number.isFinite);
  };
  await expect.poll(async () => (await yieldColumn()).length).toBeGreaterThan(1);
  const yields = await yieldColumn();
  expect(yields[0]).toBe(Math.max(...yields));

  // 5. The best train: its outlet composition and charts, then pinned with a note.
  await page.getByTestId("candidate-link").first().click();
  await expect(page).toHaveURL(/\/candidates\//);
  await appReady(page);
  await expect(page.getByTestId("composition-table")).toBeVisible();
  await expect(page.getByTestId("path-chart")).toBeVisible();
  await expect(page.getByTestId("profiles-chart")).toBeVisible();
  const train = ((await page.getByTestId("candidate-title").textContent()) ?? "").match(/CSTR|PFR/g)?.join(" → ") ?? "";
  expect(train).toMatch(/^(CSTR|PFR)( → (CSTR|PFR))?$/);
  // The demo project already holds a current design: pinning asks first.
  const pinned = await pinWithNote(page, note);

  // 6. The manager approves it on the project page.
  await approveAsManager(browser, "Mono-adduct campaign", note, `Approved for the campaign's design basis ${stamp}`);

  // 7. The report names the train and carries the composition table, the path chart and the cautions.
  await page.reload();
  await appReady(page);
  await expect(pinned.getByTestId("pin-state")).toHaveText(/approved/i);
  await pinned.getByTestId("pin-report").click();
  await expect(page).toHaveURL(/\/pins\/[0-9a-f-]{36}\/report$/);
  await expect(page.getByTestId("report-train")).toHaveText(train);
  const composition = page.getByTestId("report-composition-table");
  await expect(composition.locator("tbody tr")).toHaveCount(train.split(" → ").length + 1);
  await expect(page.getByTestId("design-report")).toContainText(modelName);
  for (const c of CAUTION_TEXTS) await expect(page.getByTestId("cautions").first()).toContainText(c);
  await page.screenshot({ path: `${SHOTS}/network-journey-report.png`, fullPage: true });

  // 8. The PDF, downloaded from the report page, holds the composition table.
  const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("report-pdf").click()]);
  expect(download.suggestedFilename()).toMatch(/\.pdf$/);
  const text = await pdfText(readFileSync((await download.path())!));
  for (const h of ["Outlet composition", "C_A, mol/m³", "C_B, mol/m³", "C_C, mol/m³", "Highest yield of B", modelName]) expect(text).toContain(h);
  for (const c of CAUTION_TEXTS) expect(text).toContain(c);
  await engineerCtx.close();
});
