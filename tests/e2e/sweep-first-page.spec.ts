import { expect, test, type APIRequestContext, type BrowserContext, type Route } from "@playwright/test";
import { appReady, signedInContext } from "./fixtures";
import { browserAs, closeAll } from "./helpers/sign-in";
import { createModel, firstProjectId, submitSweep, waitForSweep, type CandidatePage } from "./sweep-fixtures";

let engineer: APIRequestContext;
let browserCtx: BrowserContext;
let projectId: string;
let sweepId: string;
let byRank: CandidatePage;

/** A held request, released by the test once it has checked what the page shows meanwhile. */
function holder() {
  let release!: () => void;
  const released = new Promise<void>((r) => (release = r));
  const seen: Route[] = [];
  const handler = async (route: Route) => {
    seen.push(route);
    await released;
    await route.continue();
  };
  return { handler, release, seen };
}

test.beforeAll(async ({ browser }) => {
  engineer = await signedInContext("engineer");
  projectId = await firstProjectId(engineer);
  const versionId = (await createModel(engineer, projectId, `First page kinetics ${Date.now()}`)).version.id;
  // Up to four stages: 30 trains, so the table has a second page of 25.
  const sweep = await submitSweep(engineer, projectId, versionId, [], 4);
  sweepId = sweep.id;
  expect((await waitForSweep(engineer, sweepId)).status).toBe("succeeded");
  byRank = (await (await engineer.get(`/api/sweeps/${sweepId}/scenarios/0/candidates?sort=rank&dir=asc&page=1&pageSize=25`)).json()) as CandidatePage;
  expect(byRank.total).toBe(30);
  browserCtx = await browserAs(browser, engineer);
});
test.afterAll(() => closeAll(browserCtx, engineer));

test("the sweep page's HTML already holds the first ranked rows and their thumbnails", async () => {
  const res = await engineer.get(`/projects/${projectId}/sweeps/${sweepId}`);
  expect(res.status()).toBe(200);
  const html = await res.text();
  const first = byRank.items[0];
  // The compare box of each row names the train's rank and sequence: the first and the last row of page 1 are in the server's answer.
  expect(html).toContain(`Select rank ${first.rank} (${first.sequence.join("-")}) to compare`);
  const last = byRank.items[24];
  expect(html).toContain(`Select rank ${last.rank} (${last.sequence.join("-")}) to compare`);
  expect(html).toContain('data-testid="thumbnail"');
  expect(html).not.toContain("Loading the ranked trains");
});

test("a page in the URL comes with the page too: page 2 sorted by volume, largest first", async () => {
  const api = (await (await engineer.get(`/api/sweeps/${sweepId}/scenarios/0/candidates?sort=totalVolume&dir=desc&page=2&pageSize=25`)).json()) as CandidatePage;
  const html = await (await engineer.get(`/projects/${projectId}/sweeps/${sweepId}?sort=totalVolume&dir=desc&page=2`)).text();
  for (const c of api.items) expect(html).toContain(`Select rank ${c.rank} (${c.sequence.join("-")}) to compare`);
  expect(html).not.toContain(`Select rank ${byRank.items[0].rank} (${byRank.items[0].sequence.join("-")}) to compare`);
});

test("no refetch of the first page on opening; a sort keeps the old rows until the new ones arrive; a compare box ticks without waiting for the server", async () => {
  const page = await browserCtx.newPage();
  // The browser takes over the server's rows as they are: a mismatch would be thrown away and redrawn (React's error 418).
  const pageErrors: string[] = [];
  page.on("pageerror", (e) => pageErrors.push(e.message));
  page.on("console", (m) => m.type() === "error" && pageErrors.push(m.text()));
  const candidateCalls: string[] = [];
  page.on("request", (r) => {
    if (r.url().includes(`/api/sweeps/${sweepId}/scenarios/0/candidates`)) candidateCalls.push(r.url());
  });
  await page.goto(`/projects/${projectId}/sweeps/${sweepId}`);
  await appReady(page);
  const rows = page.getByTestId("candidate-row");
  await expect(rows).toHaveCount(25);
  await expect(rows.first().getByTestId("thumbnail")).toBeVisible();
  expect(pageErrors.filter((e) => /418|hydrat/i.test(e))).toEqual([]);
  // The page shown came with the HTML; the next one is read ahead, once the page is idle.
  await expect.poll(() => candidateCalls.some((u) => new URL(u).searchParams.get("page") === "2")).toBe(true);
  const opening = candidateCalls.length;

  // Sort by volume with the answer held: the 25 rows stay on screen meanwhile.
  const held = holder();
  await page.route(`**/api/sweeps/${sweepId}/scenarios/0/candidates?*`, held.handler);
  await page.getByTestId("sort-totalVolume").click();
  await expect.poll(() => held.seen.length).toBeGreaterThan(0);
  await expect(rows).toHaveCount(25);
  await expect(page.getByTestId("candidate-row").first().getByRole("checkbox")).toHaveAccessibleName(`Select rank ${byRank.items[0].rank} (${byRank.items[0].sequence.join("-")}) to compare`);
  const sorted = page.waitForResponse((r) => r.url().includes("sort=totalVolume") && new URL(r.url()).searchParams.get("page") === "1" && r.status() === 200);
  // Once the sorted rows are shown, their next page is read ahead too: waited for, so that it is not caught by the hold below.
  const sortedAhead = page.waitForResponse((r) => r.url().includes("sort=totalVolume") && new URL(r.url()).searchParams.get("page") === "2" && r.status() === 200);
  held.release();
  await sorted;
  await sortedAhead;
  await page.unroute(`**/api/sweeps/${sweepId}/scenarios/0/candidates?*`);
  // Opening asked for no first page of its own (a refetch on mount would): only the next page, read ahead.
  expect(candidateCalls.slice(0, opening).every((u) => new URL(u).searchParams.get("page") === "2" && u.includes("sort=rank"))).toBe(true);
  expect(candidateCalls.slice(opening).some((u) => u.includes("sort=totalVolume"))).toBe(true);
  await expect(page.getByRole("columnheader", { name: /Total volume/ })).toHaveAttribute("aria-sort", "ascending");

  // Every request of the page held: ticking a compare box needs none, so it shows at once.
  const all = holder();
  await page.route("**/api/**", all.handler);
  const box = page.getByTestId("candidate-row").first().getByRole("checkbox");
  await box.check();
  await expect(box).toBeChecked();
  await expect(page.getByTestId("compare-selected")).toHaveText("Compare selected (1)");
  all.release();
  await page.unroute("**/api/**");
  await page.close();
});

test("the next page was read ahead: Next → shows it with every request of the page held", async () => {
  const page2 = (await (await engineer.get(`/api/sweeps/${sweepId}/scenarios/0/candidates?sort=rank&dir=asc&page=2&pageSize=25`)).json()) as CandidatePage;
  const page = await browserCtx.newPage();
  const readAhead = page.waitForResponse((r) => r.url().includes(`/api/sweeps/${sweepId}/scenarios/0/candidates?`) && new URL(r.url()).searchParams.get("page") === "2" && r.status() === 200);
  await page.goto(`/projects/${projectId}/sweeps/${sweepId}`);
  await appReady(page);
  await readAhead;
  const all = holder();
  await page.route("**/api/**", all.handler);
  await page.getByRole("button", { name: "Next →" }).click();
  const rows = page.getByTestId("candidate-row");
  await expect(rows).toHaveCount(page2.items.length);
  await expect(rows.first().getByRole("checkbox")).toHaveAccessibleName(`Select rank ${page2.items[0].rank} (${page2.items[0].sequence.join("-")}) to compare`);
  await expect(page.getByTestId("page-info")).toHaveText("26–30 of 30 trains");
  // Shown from what was read ahead: no request for page 2 was made (and held) after the click.
  expect(all.seen.filter((r) => r.request().url().includes("/candidates?") && new URL(r.request().url()).searchParams.get("page") === "2")).toEqual([]);
  all.release();
  await page.unroute("**/api/**");
  await page.close();
});
