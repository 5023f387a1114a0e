import { readFileSync } from "node:fs";
import { PDFParse } from "pdf-parse";
import type { DesignReport } from "@/lib/reports/design-report";
import { reportUnits } from "@/lib/reports/report-format";
import { unitLabel } from "@/lib/units/display";
import { expect, test, type APIRequestContext, type Page } from "@playwright/test";
import { resolveDisplayUnits } from "@/lib/units/display-preference";
import { appReady, signedInContext } from "./fixtures";
import { createModel, firstProjectId, submitSweep, waitForSweep, type CandidatePage } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";

let engineer: APIRequestContext;
let manager: APIRequestContext;

test.beforeAll(async () => {
  engineer = await signedInContext("engineer");
  manager = await signedInContext("manager");
});
test.afterAll(async () => {
  // Other specs run as the same demo users: put their choice back to the default.
  for (const ctx of [engineer, manager]) {
    await ctx.put("/api/me/display-units", { data: { displayUnits: "as-typed" } });
    await ctx.dispose();
  }
});

async function chooseUnits(page: Page, label: RegExp) {
  await page.goto("/");
  await appReady(page);
  await page.getByTestId("user-name").click();
  await expect(page).toHaveURL(/\/settings$/);
  await appReady(page);
  await page.getByRole("radio", { name: label }).check();
  await page.getByRole("button", { name: "Save units" }).click();
  await expect(page.getByTestId("display-units-status")).toContainText("Saved");
  await expect(page).toHaveTitle(/Settings/);
  await expectNoSeriousA11yViolations(page);
}

test("a choice outside the offered sets is a 400 naming the field, and nothing changes", async () => {
  const before = await (await engineer.get("/api/me/display-units")).json();
  const res = await engineer.put("/api/me/display-units", { data: { displayUnits: "metric-ish" } });
  expect(res.status()).toBe(400);
  const body = await res.json();
  expect(Object.keys(body.error.fields)).toContain("displayUnits");
  expect(await (await engineer.get("/api/me/display-units")).json()).toEqual(before);
});

test("engineer and manager see results in the units they chose: ranked table, candidate stages, CSV", async ({ browser }) => {
  const projectId = await firstProjectId(engineer);
  const versionId = (await createModel(engineer, projectId, `Display units ${Date.now()}`)).version.id;
  const sweep = await submitSweep(engineer, projectId, versionId);
  await waitForSweep(engineer, sweep.id);
  const first = (await (await engineer.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates?sort=rank&dir=asc&page=1&pageSize=25`)).json()) as CandidatePage;
  const largest = Math.max(...first.items.map((c) => c.totalVolume ?? 0));

  // The engineer: SI with litres and hours.
  const eCtx = await browser.newContext({ storageState: await engineer.storageState() });
  const page = await eCtx.newPage();
  await chooseUnits(page, /SI with litres and hours/);
  const metric = resolveDisplayUnits("si-litres-hours", undefined, { largestVolume: largest });
  const volumeLabel = metric.volume === "L" ? "L" : "m³";
  await page.goto(`/projects/${projectId}/sweeps/${sweep.id}`);
  await appReady(page);
  await expect(page.getByRole("columnheader", { name: `Total volume, ${volumeLabel}` })).toBeVisible({ timeout: 60_000 });

  // CSV with the shown-unit columns: SI columns with their unit, the shown ones beside them, 6 digits at most.
  await page.getByTestId("export-shown-units").check();
  const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("export-csv").click()]);
  const csv = readFileSync((await download.path())!, "utf8");
  const header = csv.split("\n")[1]!;
  expect(header).toContain("total volume (m³)");
  if (metric.volume === "L") expect(header).toContain("total volume (L)");
  const longest = Math.max(...[...csv.matchAll(/\d+\.\d+/g)].map((m) => m[0].replace(/^0\.0*|\./g, "").length));
  expect(longest).toBeLessThanOrEqual(6);

  await page.getByTestId("candidate-link").first().click();
  await expect(page.getByTestId("stage-table")).toBeVisible({ timeout: 60_000 });
  await expect(page.getByRole("columnheader", { name: "T in → out, °C" })).toBeVisible();
  await expectNoSeriousA11yViolations(page);
  const candidateUrl = page.url().replace(/\?.*$/, "");
  await eCtx.close();

  // The manager: US customary, on the same candidate.
  const mCtx = await browser.newContext({ storageState: await manager.storageState() });
  const mPage = await mCtx.newPage();
  await chooseUnits(mPage, /US customary/);
  await mPage.goto(candidateUrl);
  await appReady(mPage);
  await expect(mPage.getByRole("columnheader", { name: "T in → out, °F" })).toBeVisible({ timeout: 60_000 });
  const usVolume = resolveDisplayUnits("us-customary", undefined, { largestVolume: largest }).volume === "gal" ? "US gal" : "ft³";
  await expect(mPage.getByTestId("stage-table")).toContainText(usVolume);
  await mCtx.close();
});

test("the manager reads the demo design report and its PDF in litres and degrees Celsius", async ({ browser }) => {
  const projectId = await firstProjectId(manager);
  const pins = (await (await manager.get(`/api/projects/${projectId}/pins`)).json()) as { pins: { id: string }[] };
  const pinId = pins.pins[0]!.id;
  const report = ((await (await manager.get(`/api/pins/${pinId}/export.json`)).json()) as { report: DesignReport }).report;
  const units = reportUnits(report, "si-litres-hours");
  const volume = unitLabel("volume", units.volume);

  const ctx = await browser.newContext({ storageState: await manager.storageState(), acceptDownloads: true });
  const page = await ctx.newPage();
  await chooseUnits(page, /SI with litres and hours/);
  await page.goto(`/projects/${projectId}/pins/${pinId}/report`);
  await appReady(page);
  const table = page.getByTestId("report-stage-table");
  await expect(table.locator("tbody tr").first()).toContainText(` ${volume}`);
  await expect(table.locator("tbody tr").first()).toContainText("°C");
  await expect(table).not.toContainText(" K");
  await expectNoSeriousA11yViolations(page);

  // The PDF speaks the same units; its CSV keeps SI with the unit in each header.
  const pdf = await manager.get(`/api/pins/${pinId}/report.pdf`);
  expect(pdf.status()).toBe(200);
  const parser = new PDFParse({ data: new Uint8Array(await pdf.body()) });
  const text = (await parser.getText()).text.replace(/\s+/g, " ");
  await parser.destroy();
  expect(text).toMatch(new RegExp(`Total volume [0-9.,e+-]+ ${volume}`));
  expect(text).toContain("°C");
  const csv = await (await manager.get(`/api/pins/${pinId}/export.csv`)).text();
  expect(csv).toContain("volume (m3)");
  expect(csv).toContain("temperature in (K)");
  await ctx.close();
});
