import { expect, test, type APIRequestContext } from "@playwright/test";
import { appReady, signedInContext } from "./fixtures";
import { createModel, firstProjectId } from "./sweep-fixtures";

// A message a person reads names fields by their labels: no camel-case key, no dotted path.
const PATHY = /\b[a-z]+[A-Z]\w*\b|\w+\.\d+\.\w+/;

let engineer: APIRequestContext;
let projectId: string;
let versionId: string;
test.beforeAll(async () => {
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  versionId = (await createModel(engineer, projectId)).version.id;
});
test.afterAll(() => engineer.dispose());

async function refusal(res: { status(): number; json(): Promise<unknown> }) {
  expect(res.status()).toBe(400);
  return ((await res.json()) as { error: { message: string; fields: Record<string, string[]> } }).error;
}

test("rating a stage volume that is not a quantity names the stage as the form does", async () => {
  const error = await refusal(await engineer.post(`/api/projects/${projectId}/rate`, { data: { kineticsVersionId: versionId, stages: [{ type: "CSTR", volume: "abc" }], target: 0.9 } }));
  expect(error.message).toContain('Stage 1 volume: "abc" is not a quantity with a unit, e.g. 2.5 m³');
  expect(error.message).not.toMatch(PATHY);
  expect(Object.keys(error.fields)).toContain("stages.0.volume");
});

test("a sweep of 9 stages reads as the builder's label with its range", async () => {
  const error = await refusal(await engineer.post(`/api/projects/${projectId}/sweeps`, { data: { kineticsVersionId: versionId, target: { conversion: 0.9 }, train: { maxStages: 9 } } }));
  expect(error.message).toContain("Largest number of stages: a whole number from 1 to 8");
  expect(error.message).not.toMatch(PATHY);
});

test("a cost basis with a negative fixed part names the correlation, not its key", async () => {
  const correlation = { a: -1, b: 45000, n: 0.6, source: "invented for the test" };
  const error = await refusal(
    await engineer.put(`/api/projects/${projectId}/costs`, {
      data: { vessels: { CSTR: correlation, PFR: { ...correlation, a: 1 } }, currency: "EUR", basisYear: 2026, sizes: { mode: "any" }, maxVesselVolume: null, installationFactor: { value: 3, source: "common practice" } },
    }),
  );
  expect(error.message).toContain("CSTR cost: fixed part a");
  expect(error.message).not.toMatch(PATHY);
});

test("kinetics with an unreadable unit and a project of one letter read in labels", async () => {
  const k = await refusal(await engineer.post(`/api/projects/${projectId}/kinetics`, { data: { name: "Bad unit", spec: { feed: { flowA: 0.02, concA: "1 furlong" }, reaction: { rate: { law: "power", k: 1e-3, orders: { A: 1 } } } } } }));
  expect(k.message).toMatch(/^Feed concentration of A: /);
  expect(k.message).not.toMatch(PATHY);
  const p = await refusal(await engineer.post("/api/projects", { data: { name: "A" } }));
  expect(p.message).toBe("Name: Use at least 2 characters");
});

test("a finished sweep reads the same on the project list and on its page", async ({ browser }) => {
  const ctx = await browser.newContext({ storageState: await engineer.storageState() });
  const page = await ctx.newPage();
  await page.goto(`/projects/${projectId}`);
  await appReady(page);
  const row = page.getByRole("row").filter({ has: page.getByRole("link") }).filter({ hasText: "Finished" }).first();
  await expect(row).toBeVisible({ timeout: 60_000 });
  await row.getByRole("link").first().click();
  await expect(page.getByTestId("sweep-status")).toHaveText("Finished", { timeout: 60_000 });
  await ctx.close();
});
