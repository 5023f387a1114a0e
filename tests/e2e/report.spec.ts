import { mkdirSync, readFileSync } from "node:fs";
import { expect, test, type APIRequestContext, type BrowserContext } from "@playwright/test";
import Papa from "papaparse";
import { CAUTIONS as CAUTION_TEXTS } from "@/lib/engine";
import type { DesignReport } from "@/lib/reports/design-report";
import { signedInContext, USERS } from "./fixtures";
import { firstProjectId } from "./sweep-fixtures";
import { browserAs, closeAll } from "./helpers/sign-in";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { pdfText } from "./helpers/pdf-text";

const DEMO_NOTE = "Least volume at the design feed of 0.02 mol/s and X = 0.9 (demo).";

let manager: APIRequestContext;
let browserCtx: BrowserContext;
let projectId: string;
let pinId: string;

test.beforeAll(async ({ browser }) => {
  expect(USERS.manager).toBe("marta.manager@brightwater.example");
  manager = await signedInContext("manager");
  projectId = await firstProjectId(manager);
  const pins = (await (await manager.get(`/api/projects/${projectId}/pins`)).json()) as { pins: { id: string; note: string }[] };
  // The seeded demo pin (other specs may pin more designs to the same project).
  pinId = pins.pins.find((p) => p.note === DEMO_NOTE)!.id;
  browserCtx = await browserAs(browser, manager, { acceptDownloads: true });
});
test.afterAll(() => closeAll(browserCtx, manager));

test("the manager opens the demo pin's report from the project page, reads the train and cautions, and downloads the PDF", async () => {
  const report = ((await (await manager.get(`/api/pins/${pinId}/export.json`)).json()) as { report: DesignReport }).report;
  const page = await browserCtx.newPage();
  await page.goto(`/projects/${projectId}`);
  const pinItem = page.getByTestId("pin").filter({ hasText: DEMO_NOTE });
  await pinItem.getByTestId("pin-report").click();
  await expect(page).toHaveURL(new RegExp(`/projects/${projectId}/pins/${pinId}/report$`));

  await expect(page.getByTestId("report-train")).toHaveText(report.train.label);
  const table = page.getByTestId("report-stage-table");
  await expect(table.locator("tbody tr")).toHaveCount(report.stages.length);
  await expect(page.getByTestId("levenspiel-chart")).toBeVisible();
  // Cautions boxed before the results and again at the end.
  await expect(page.getByTestId("cautions")).toHaveCount(1);
  for (const c of CAUTION_TEXTS) await expect(page.getByTestId("cautions").first()).toContainText(c);
  await expect(page.getByTestId("report-costs")).toContainText("not recorded");

  mkdirSync("test-results/screens", { recursive: true });
  await page.screenshot({ path: "test-results/screens/design-report.png", fullPage: true });
  await expectNoSeriousA11yViolations(page);

  // Printing hides the app's header and the buttons.
  await page.emulateMedia({ media: "print" });
  await expect(page.getByTestId("report-pdf")).toBeHidden();
  await expect(page.getByRole("link", { name: "Seriatim home" })).toBeHidden();
  await page.emulateMedia({ media: "screen" });

  const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("report-pdf").click()]);
  expect(download.suggestedFilename()).toMatch(/^ester-line-3-revamp-.+\.pdf$/);
  const pdf = readFileSync((await download.path())!);
  const text = await pdfText(pdf);
  expect(text).toContain(report.train.label);
  expect(text).toContain("Esterification, second order");
  for (const c of CAUTION_TEXTS) expect(text).toContain(c);
});

test("the CSV export of the pin parses to the JSON export's stage numbers", async () => {
  const report = ((await (await manager.get(`/api/pins/${pinId}/export.json`)).json()) as { report: DesignReport }).report;
  const res = await manager.get(`/api/pins/${pinId}/export.csv`);
  expect(res.headers()["content-disposition"]).toMatch(/^attachment; filename="[a-z0-9-]+\.csv"$/);
  const parsed = Papa.parse<Record<string, unknown>>(await res.text(), { header: true, comments: "#", dynamicTyping: true, skipEmptyLines: true });
  expect(parsed.data.map((r) => r["volume (m3)"])).toEqual(report.stages.map((s) => s.volume));
});

test("the ranked list export holds every candidate, the same in CSV and JSON", async () => {
  const sweeps = (await (await manager.get(`/api/projects/${projectId}/sweeps`)).json()) as { sweeps: { id: string; name: string }[] };
  const sweep = sweeps.sweeps.find((s) => s.name.startsWith("Demo:"))!;
  const json = (await (await manager.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates/export?format=json&sort=totalVolume`)).json()) as {
    total: number;
    units: Record<string, string>;
    candidates: { sequence: string; totalVolume: number | null }[];
  };
  expect(json.units.totalVolume).toBe("m3");
  expect(json.candidates).toHaveLength(json.total);
  const csv = Papa.parse<Record<string, unknown>>(await (await manager.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates/export?format=csv&sort=totalVolume`)).text(), {
    header: true,
    comments: "#",
    dynamicTyping: true,
    skipEmptyLines: true,
  });
  expect(csv.data.map((r) => [r.sequence, r["total volume (m3)"]])).toEqual(json.candidates.map((c) => [c.sequence, c.totalVolume]));
  const bad = await manager.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates/export?format=xml`);
  expect(bad.status()).toBe(400);
  expect(((await bad.json()) as { error: { fields: Record<string, string[]> } }).error.fields).toHaveProperty("format");
});
