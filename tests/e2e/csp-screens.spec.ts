import { expect, test, type APIRequestContext, type BrowserContext, type Page } from "@playwright/test";
import { signedInContext } from "./fixtures";
import { createModel, firstProjectId, submitSweep, waitForSweep, type CandidatePage } from "./sweep-fixtures";
import { browserAs, closeAll } from "./helpers/sign-in";

let engineer: APIRequestContext;
let browserCtx: BrowserContext;
const violations: string[] = [];

test.beforeAll(async ({ browser }) => {
  engineer = await signedInContext("engineer");
  browserCtx = await browserAs(browser, engineer);
  // Every violation the page itself sees, reported back through a binding.
  await browserCtx.exposeBinding("reportCspViolation", (_source, text: string) => void violations.push(text));
  await browserCtx.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      void (window as unknown as { reportCspViolation: (t: string) => Promise<void> }).reportCspViolation(`${e.violatedDirective} blocked ${e.blockedURI || "inline"} on ${location.pathname}`);
    });
  });
});
test.afterAll(() => closeAll(browserCtx, engineer));

function watchConsole(page: Page) {
  page.on("console", (m) => {
    if (/Content Security Policy/i.test(m.text())) violations.push(`console: ${m.text()}`);
  });
}

async function openAndSettle(page: Page, path: string, ready: Parameters<Page["getByTestId"]>[0] | null) {
  const res = await page.goto(path);
  expect(res?.headers()["content-security-policy"], path).toMatch(/'nonce-/);
  if (ready) await expect(page.getByTestId(ready).first(), `${path}: ${violations.join("; ")}`).toBeVisible({ timeout: 30_000 });
  await page.waitForLoadState("networkidle");
}

test("the demo screens load and run under the Content-Security-Policy without a single violation", async () => {
  test.setTimeout(120_000);
  const projectId = await firstProjectId(engineer);
  const { model } = await createModel(engineer, projectId, `CSP kinetics ${Date.now()}`);
  const sweep = await submitSweep(engineer, projectId, (await createModel(engineer, projectId, `CSP sweep kinetics ${Date.now()}`)).version.id, [{ field: "feed.flowA", values: [0.01, 0.02] }], 2);
  expect((await waitForSweep(engineer, sweep.id)).status).toBe("succeeded");
  const candidates = (await (await engineer.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates`)).json()) as CandidatePage;
  const pins = (await (await engineer.get(`/api/projects/${projectId}/pins`)).json()) as { pins: { id: string }[] };

  const page = await browserCtx.newPage();
  watchConsole(page);
  await openAndSettle(page, "/", null);
  await openAndSettle(page, `/projects/${projectId}`, null);
  await openAndSettle(page, `/projects/${projectId}/kinetics/${model.id}`, null);
  // The editor's live plot is drawn in the browser: hydration and charts ran.
  await expect(page.locator("svg").first()).toBeVisible();
  await openAndSettle(page, `/projects/${projectId}/kinetics/new`, null);
  await openAndSettle(page, `/projects/${projectId}/sweeps/${sweep.id}`, "candidate-row");
  await openAndSettle(page, `/projects/${projectId}/sweeps/${sweep.id}/candidates/${candidates.items[0].id}`, "levenspiel-chart");
  await openAndSettle(page, `/projects/${projectId}/pins/${pins.pins[0].id}/report`, "levenspiel-chart");
  await openAndSettle(page, "/inventory", null);
  // A client-side navigation after hydration: scripts loaded by Next's own (nonce'd) scripts run.
  await page.goto(`/projects/${projectId}`);
  await page.getByRole("link", { name: "Inventory" }).first().click();
  await expect(page).toHaveURL(/\/inventory$/);
  await page.close();
  expect(violations).toEqual([]);
});
