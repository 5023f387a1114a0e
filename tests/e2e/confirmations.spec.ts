import { expect, test, type APIRequestContext, type BrowserContext } from "@playwright/test";
import { appReady, openPage, signedInContext } from "./fixtures";
import { createModel, submitSweep, waitForSweep, type CandidatePage } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll } from "./helpers/sign-in";

let engineer: APIRequestContext;
let browserCtx: BrowserContext;
const stamp = Date.now().toString(36);

async function newProject(name: string) {
  const res = await engineer.post("/api/projects", { data: { name, description: "confirmations" } });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { project: { id: string } }).project.id;
}

test.beforeAll(async ({ browser }) => {
  engineer = await signedInContext("engineer");
  browserCtx = await browserAs(browser, engineer);
});
test.afterAll(() => closeAll(browserCtx, engineer));

test("removing a vessel asks first; Escape keeps it, confirming removes it and says so", async () => {
  const tag = `R-${stamp}`;
  expect((await engineer.post("/api/inventory", { data: { tag, type: "CSTR", volume: 2, available: true } })).status()).toBe(201);
  const page = await openPage(browserCtx, "/inventory");
  const remove = page.getByRole("button", { name: `Remove ${tag}` });
  await remove.click();
  const dialog = page.getByRole("dialog", { name: `Remove ${tag}?` });
  await expect(dialog).toBeVisible();
  await expectNoSeriousA11yViolations(page);
  await page.keyboard.press("Escape");
  await expect(dialog).toBeHidden();
  await expect(remove).toBeFocused();
  await expect(page.getByTestId("inventory-row").filter({ hasText: tag })).toHaveCount(1);

  await remove.click();
  await dialog.getByRole("button", { name: "Remove vessel" }).click();
  await expect(page.getByTestId("inventory-notice")).toHaveText(`Removed ${tag}.`);
  await expect(page.getByTestId("inventory-row").filter({ hasText: tag })).toHaveCount(0);
  await page.close();
});

test("a candidate already pinned says so, pinning over a waiting design warns first, and the candidate's robustness run reaches the pin report", async () => {
  const projectName = `Confirm pins ${stamp}`;
  const projectId = await newProject(projectName);
  const { version } = await createModel(engineer, projectId);
  const sweep = await submitSweep(engineer, projectId, version.id, [], 2);
  await waitForSweep(engineer, sweep.id);
  const { items } = (await (await engineer.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates`)).json()) as CandidatePage;
  const [first, second] = items.filter((c) => c.feasible);
  const page = await browserCtx.newPage();

  // The first pin: nothing to supersede, so no question; then the page shows the pin instead of the form.
  await page.goto(`/projects/${projectId}/sweeps/${sweep.id}/candidates/${first.id}`);
  await appReady(page);
  await page.getByLabel("Note for the reviewer").fill("first choice");
  await page.getByTestId("pin-button").click();
  await expect(page.getByTestId("pin-done")).toHaveText(new RegExp(`Pinned to ${projectName} — pending review`));
  await expect(page.getByTestId("pin-button")).toHaveCount(0);
  await page.reload();
  await appReady(page);
  await expect(page.getByTestId("pin-done")).toContainText("pending review");

  // The second candidate: the warning, Escape changes nothing, confirming supersedes.
  await page.goto(`/projects/${projectId}/sweeps/${sweep.id}/candidates/${second.id}`);
  await appReady(page);
  await expect(page.getByTestId("pin-supersede-note")).toContainText("supersedes it");
  await page.getByTestId("pin-button").click();
  const dialog = page.getByRole("dialog", { name: "Supersede the current design?" });
  await expect(dialog).toContainText("pending review");
  await expectNoSeriousA11yViolations(page);
  await page.keyboard.press("Escape");
  await expect(dialog).toBeHidden();
  const before = (await (await engineer.get(`/api/projects/${projectId}/pins`)).json()) as { pins: { state: string }[] };
  expect(before.pins.map((p) => p.state)).toEqual(["proposed"]);
  await page.getByTestId("pin-button").click();
  await dialog.getByRole("button", { name: "Pin and supersede" }).click();
  await expect(page.getByTestId("pin-done")).toContainText("pending review");
  const after = (await (await engineer.get(`/api/projects/${projectId}/pins`)).json()) as { pins: { id: string; candidateId: string; state: string }[] };
  expect(after.pins.map((p) => p.state).sort()).toEqual(["proposed", "superseded"]);
  const pin = after.pins.find((p) => p.state === "proposed")!;
  expect(pin.candidateId).toBe(second.id);

  // A robustness run started on the candidate shows in the report of the pin made from it.
  const run = await engineer.post(`/api/candidates/${second.id}/robustness`, {
    data: { uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction: 0.2 }], samples: 50, seed: 7 },
  });
  expect(run.status(), await run.text()).toBe(201);
  const runId = ((await run.json()) as { run: { id: string } }).run.id;
  await expect.poll(async () => ((await (await engineer.get(`/api/robustness/${runId}`)).json()) as { run: { status: string } }).run.status, { timeout: 120_000 }).toBe("succeeded");
  await page.goto(`/projects/${projectId}/pins/${pin.id}/report`);
  await appReady(page);
  await expect(page.getByText("no finished Monte Carlo run for this pinned design")).toHaveCount(0);
  await expect(page.getByRole("main")).toContainText(/P50|P95/);
  await page.close();
});

test("the compare page shows every stage table's volume column and links back to the sweep", async () => {
  const projectId = await newProject(`Confirm compare ${stamp}`);
  const { version } = await createModel(engineer, projectId);
  const sweep = await submitSweep(engineer, projectId, version.id, [], 2);
  await waitForSweep(engineer, sweep.id);
  const { items } = (await (await engineer.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates`)).json()) as CandidatePage;
  const ids = items.filter((c) => c.feasible).slice(0, 3).map((c) => c.id);
  const page = await browserCtx.newPage();
  for (const width of [1280, 1024]) {
    await page.setViewportSize({ width, height: 900 });
    await page.goto(`/compare?ids=${ids.join(",")}`);
    await appReady(page);
    const tables = page.getByTestId("stage-table");
    await expect(tables).toHaveCount(ids.length);
    for (const table of await tables.all()) {
      await expect(table.getByRole("columnheader", { name: /Volume/ }).first()).toBeVisible();
      // The whole table fits its box: nothing, the volume column included, hides past the right edge.
      expect(await table.evaluate((t) => t.parentElement!.scrollWidth <= t.parentElement!.clientWidth + 1)).toBe(true);
    }
    await expect(page.getByTestId("compare-back").getByRole("link")).toHaveAttribute("href", `/projects/${projectId}/sweeps/${sweep.id}`);
  }
  await page.close();
});

test("a second project with the same name, whatever its case and spacing, is refused naming the field", async () => {
  const name = `Duplicate Check ${stamp}`;
  await newProject(name);
  const res = await engineer.post("/api/projects", { data: { name: `  duplicate   check ${stamp.toUpperCase()} `, description: "" } });
  expect(res.status()).toBe(409);
  const body = (await res.json()) as { error: { message: string; fields: Record<string, string[]> } };
  expect(body.error.message).toContain("Project name");
  const page = await openPage(browserCtx, "/");
  const form = page.getByRole("form", { name: "New project" });
  await form.getByLabel("New project").fill(name.toLowerCase());
  await form.getByRole("button", { name: "Create project" }).click();
  await expect(page.getByText(`A project named ${name} already exists`)).toBeVisible();
  await page.close();
});
