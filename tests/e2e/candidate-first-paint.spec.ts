import { expect, test, type APIRequestContext, type BrowserContext } from "@playwright/test";
import { appReady, signedInContext } from "./fixtures";
import { browserAs, closeAll, DESKTOP } from "./helpers/sign-in";
import { createModel, firstProjectId, submitSweep, waitForSweep, type CandidatePage } from "./sweep-fixtures";

/**
 * The candidate page arrives with its content: the title, the stage table and the Levenspiel chart
 * are in the page the server sends, not fetched by the browser after it loads. A browser with
 * scripts turned off shows exactly what the server sent, so the checks below run there; another
 * team's reader still learns nothing from the page and sees the same refusal as before.
 */
let engineer: APIRequestContext;
let outsider: APIRequestContext;
let noScripts: BrowserContext;
let outsiderNoScripts: BrowserContext;
let outsiderBrowser: BrowserContext;
let pageUrl = "";
let best: CandidatePage["items"][number];

test.beforeAll(async ({ browser }) => {
  engineer = await signedInContext("engineer");
  outsider = await signedInContext("otherTeam");
  noScripts = await browser.newContext({ storageState: await engineer.storageState(), viewport: DESKTOP, javaScriptEnabled: false });
  outsiderNoScripts = await browser.newContext({ storageState: await outsider.storageState(), viewport: DESKTOP, javaScriptEnabled: false });
  outsiderBrowser = await browserAs(browser, outsider);
  const projectId = await firstProjectId(engineer);
  const { version } = await createModel(engineer, projectId, `First paint kinetics ${Date.now()}`);
  const sweep = await submitSweep(engineer, projectId, version.id, [], 2);
  expect((await waitForSweep(engineer, sweep.id)).status).toBe("succeeded");
  const page = (await (await engineer.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates`)).json()) as CandidatePage;
  best = page.items.find((c) => c.feasible)!;
  pageUrl = `/projects/${projectId}/sweeps/${sweep.id}/candidates/${best.id}`;
});
test.afterAll(() => closeAll(noScripts, outsiderNoScripts, outsiderBrowser, engineer, outsider));

test("the candidate page's title, stage table and Levenspiel chart come with the page itself", async () => {
  const page = await noScripts.newPage();
  await page.goto(pageUrl);
  await expect(page.getByTestId("candidate-title")).toContainText(`Rank ${best.rank}`);
  for (const stage of best.sequence) await expect(page.getByTestId("candidate-title")).toContainText(stage);
  // The chart is drawn from the plot data the server read: its summary names every stage.
  const chart = page.getByRole("img", { name: new RegExp(`^Levenspiel chart, \\d+ stages?: stage 1 ${best.sequence[0]} from X`) });
  await expect(chart).toBeVisible();
  await expect(page.getByRole("table", { name: `Stages of rank ${best.rank}` })).toBeVisible();
  await expect(page.getByText("Loading the candidate…")).toHaveCount(0);
  await page.close();
});

test("another team's reader gets no part of the candidate from the server, and the same refusal as before once the page runs", async () => {
  const bare = await outsiderNoScripts.newPage();
  const res = await bare.goto(pageUrl);
  expect(res?.status()).toBe(200);
  await expect(bare.getByTestId("candidate-title")).toHaveCount(0);
  await expect(bare.getByRole("img", { name: /^Levenspiel chart/ })).toHaveCount(0);
  await bare.close();

  const page = await outsiderBrowser.newPage();
  await page.goto(pageUrl);
  await appReady(page);
  await expect(page.getByTestId("error-panel")).toHaveText("There is no such candidate in your team.");
  await expect(page.getByTestId("candidate-title")).toHaveCount(0);
  await page.close();
});
