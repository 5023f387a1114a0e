import { randomUUID } from "node:crypto";
import { expect, test, type APIRequestContext, type BrowserContext } from "@playwright/test";
import Papa from "papaparse";
import { CAUTIONS } from "@/lib/engine";
import { DEMO_NETWORK } from "@/lib/demo/network-demo";
import type { DesignReport } from "@/lib/reports/design-report";
import { openPage, signedInContext, USERS } from "./fixtures";
import { firstProjectId } from "./sweep-fixtures";
import { browserAs, closeAll } from "./helpers/sign-in";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { pdfText } from "./helpers/pdf-text";
import { insertNetworkPin } from "./network-pin-fixtures";

// Unique per worker: a worker restarted after a failure inserts its own pin.
const NOTE = `Tank first, then a tube stopped before B over-reacts (network report check ${randomUUID().slice(0, 8)})`;

let engineer: APIRequestContext;
let browserCtx: BrowserContext;
let projectId: string;
let pin: Awaited<ReturnType<typeof insertNetworkPin>>;

test.beforeAll(async ({ browser }) => {
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  pin = await insertNetworkPin({ email: USERS.engineer, projectId, note: NOTE });
  browserCtx = await browserAs(browser, engineer, { acceptDownloads: true });
});
test.afterAll(() => closeAll(browserCtx, engineer));

test("the report of a pinned train of several reactions shows its composition table, path chart and reactions; its exports carry them", async () => {
  const report = ((await (await engineer.get(`/api/pins/${pin.pinId}/export.json`)).json()) as { report: DesignReport }).report;
  expect(report.kind).toBe("network");
  const page = await openPage(browserCtx, `/projects/${projectId}/pins/${pin.pinId}/report`);
  await expect(page.getByTestId("report-train")).toHaveText(pin.frozen.sequence.join(" → "));
  const composition = page.getByTestId("report-composition-table");
  await expect(composition.locator("tbody tr")).toHaveCount(pin.frozen.stages.length + 1);
  await expect(composition.locator("thead")).toContainText("C_D, mol/m³");
  await expect(composition.locator("tbody tr").first()).toContainText("1200");
  await expect(page.getByTestId("report-path-chart").getByRole("img", { name: /^Concentration path of B against A/ })).toBeVisible();
  await expect(page.getByTestId("report-reactions")).toContainText("Reaction 3: 2 A → D");
  await expect(page.getByTestId("report-reactions")).toContainText("0.002 L/(mol*s)");
  await expect(page.getByTestId("levenspiel-chart")).toHaveCount(0);
  for (const c of CAUTIONS) await expect(page.getByTestId("cautions").first()).toContainText(c);
  await page.screenshot({ path: "test-results/screens/network-report.png", fullPage: true });
  await expectNoSeriousA11yViolations(page);
  await page.close();

  const csv = await (await engineer.get(`/api/pins/${pin.pinId}/export.csv`)).text();
  const lines = csv.split("\n");
  expect(lines[1]).toContain(CAUTIONS[0]);
  const rows = Papa.parse<Record<string, string>>(lines.slice(2).join("\n"), { header: true, skipEmptyLines: true }).data;
  expect(rows.map((r) => r.stream)).toEqual(["Feed", ...pin.frozen.stages.map((s, i) => `Stage ${i + 1} (${s.type}) outlet`), "Train outlet (totals)"]);
  expect(Number(rows.at(-1)!["yield of B (-)"])).toBeCloseTo(pin.frozen.yield!, 12);

  const pdf = Buffer.from(await (await engineer.get(`/api/pins/${pin.pinId}/report.pdf`)).body());
  const text = await pdfText(pdf);
  for (const h of ["Outlet composition", "C_A, mol/m³", "C_D, mol/m³", "Concentration path", "Reaction 3: 2 A → D", "Highest yield of B"]) expect(text).toContain(h);
});

test("robustness of the pinned train: a rate constant ± 30 % gives the chance of missing the minimum yield and the yield's histogram", async () => {
  const page = await openPage(browserCtx, `/projects/${projectId}`);
  const item = page.getByTestId("pin").filter({ hasText: NOTE });
  await item.getByRole("button", { name: "Robustness" }).click();
  const panel = item.getByRole("region", { name: "Robustness of this pinned design" });
  await expect(panel).toContainText("the minimum yield 45.0 % of B");
  await panel.getByLabel("Input", { exact: true }).selectOption("reactions.1.rate.k");
  await panel.getByLabel("± %", { exact: true }).fill("30");
  await panel.getByLabel("Samples", { exact: true }).fill("150");
  await panel.getByLabel("Random seed (repeatable draws)", { exact: true }).fill("12");
  await panel.getByTestId("robustness-run").click();
  await expect(panel.getByTestId("robustness-miss-yield")).toContainText(/Chance of missing the minimum yield: \d+ %/);
  // A minimum yield just below the train's nominal yield: some of the draws of the over-reaction's constant miss it.
  await expect(panel.getByTestId("robustness-histogram").getByRole("img", { name: /^Histogram of the yield/ })).toBeVisible();
  await expect(panel.getByTestId("robustness-histogram-limit")).toContainText("minimum yield 45.0 %");
  await expect(panel.getByTestId("robustness-summary")).toContainText("150 samples (random seed 12)");

  // The figure on screen is the stored run's.
  const list = (await (await engineer.get(`/api/pins/${pin.pinId}/robustness`)).json()) as { runs: { request: { seed: number }; result: { probabilityMissMinYield: number } }[] };
  const run = list.runs.find((r) => r.request.seed === 12)!;
  await expect(panel.getByTestId("robustness-miss-yield")).toHaveText(`Chance of missing the minimum yield: ${(100 * run.result.probabilityMissMinYield).toFixed(0)} %`);
  await panel.screenshot({ path: "test-results/screens/network-robustness.png" });
  await expectNoSeriousA11yViolations(page);
  await page.close();
});

test("the seeded demo candidate of several reactions: the robustness panel rates it and shows the yield's spread", async () => {
  const projects = ((await (await engineer.get("/api/projects")).json()) as { projects: { id: string; name: string }[] }).projects;
  const demoProject = projects.find((p) => p.name === DEMO_NETWORK.project.name)!;
  const pins = ((await (await engineer.get(`/api/projects/${demoProject.id}/pins`)).json()) as { pins: { sweepId: string; candidateId: string; note: string }[] }).pins;
  const demo = pins.find((p) => p.note.includes("(demo)"))!;
  const page = await openPage(browserCtx, `/projects/${demoProject.id}/sweeps/${demo.sweepId}/candidates/${demo.candidateId}`);
  const panel = page.getByRole("region", { name: "Robustness" });
  await expect(panel.getByLabel("± %", { exact: true })).toBeVisible();
  await panel.getByLabel("Input", { exact: true }).selectOption("reactions.0.rate.k");
  await panel.getByLabel("± %", { exact: true }).fill("25");
  await panel.getByLabel("Samples", { exact: true }).fill("80");
  await panel.getByLabel("Random seed (repeatable draws)", { exact: true }).fill("3");
  await panel.getByTestId("robustness-run").click();
  // The demo sweep sets no minimum yield: the panel says so, and draws the yield's histogram without a limit.
  await expect(panel.getByTestId("robustness-miss-yield")).toHaveText("No minimum yield is set for this sweep");
  await expect(panel.getByTestId("robustness-histogram").getByRole("img", { name: /^Histogram of the yield/ })).toBeVisible();
  await expect(panel.getByTestId("robustness-summary")).toContainText("80 samples (random seed 3)");
  await expectNoSeriousA11yViolations(page);
  await page.close();
});
