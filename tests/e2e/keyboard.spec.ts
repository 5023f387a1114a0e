import { expect, test, type APIRequestContext, type BrowserContext, type Locator, type Page } from "@playwright/test";
import { appReady, openPage, signedInContext } from "./fixtures";
import { SignInPage } from "./pages/sign-in-page";
import { createModel, firstProjectId, submitSweep, waitForSweep } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll } from "./helpers/sign-in";

// The keyboard path of an engineer on the sweep page: a 4 x 3 grid, so the heat map has twelve
// cells, any of which used to be its own tab stop.
let engineer: APIRequestContext;
let browserCtx: BrowserContext;
let sweepUrl: string;

test.beforeAll(async ({ browser }) => {
  engineer = await signedInContext("engineer");
  const projectId = await firstProjectId(engineer);
  const versionId = (await createModel(engineer, projectId, `Keyboard kinetics ${Date.now()}`)).version.id;
  const sweep = await submitSweep(
    engineer,
    projectId,
    versionId,
    [
      { field: "feed.flowA", values: [0.01, 0.02, 0.04, 0.08] },
      { field: "target.conversion", values: [0.8, 0.9, 0.95] },
    ],
    2,
  );
  const done = await waitForSweep(engineer, sweep.id);
  expect(done.status).toBe("succeeded");
  sweepUrl = `/projects/${projectId}/sweeps/${sweep.id}`;
  browserCtx = await browserAs(browser, engineer);
});
test.afterAll(() => closeAll(browserCtx, engineer));

async function openSweep(page: Page) {
  await page.goto(sweepUrl);
  await appReady(page);
  await expect(page.getByTestId("ranked-table")).toBeVisible();
  await expect(page.getByTestId("heat-map").getByRole("button")).toHaveCount(12);
}

const focusedText = (page: Page) => page.evaluate(() => document.activeElement?.textContent?.trim() ?? "");
const focusIn = (page: Page, selector: string) => page.evaluate((sel) => !!document.activeElement?.closest(sel), selector);
const RANKED = '[role="region"][aria-label="Ranked trains table"]';
const HEAT_MAP = '[data-testid="heat-map"]';
const focusedCell = (page: Page) => page.evaluate(() => document.activeElement?.getAttribute("data-cell") ?? null);

test("from page load to the ranked table takes at most 10 Tab presses", async () => {
  const page = await browserCtx.newPage();
  await openSweep(page);
  // Tab until the focus is inside the ranked table; Enter on the skip link, as a keyboard user would.
  let tabs = 0;
  const path: string[] = [];
  while (!(await focusIn(page, RANKED)) && tabs < 200) {
    await page.keyboard.press("Tab");
    tabs++;
    const text = await focusedText(page);
    path.push(text.slice(0, 40));
    if (text === "Skip to the ranked table") await page.keyboard.press("Enter");
  }
  test.info().annotations.push({ type: "tab path", description: `${tabs} Tab presses: ${path.join(" | ")}` });
  expect(await focusIn(page, RANKED), path.join(" | ")).toBe(true);
  expect(tabs, path.join(" | ")).toBeLessThanOrEqual(10);

  // Without the skip link, Tab alone still gets there, and the heat map is a single stop on the way.
  await page.goto(sweepUrl);
  await appReady(page);
  await expect(page.getByTestId("ranked-table")).toBeVisible();
  let plainTabs = 0;
  let heatMapStops = 0;
  while (!(await focusIn(page, RANKED)) && plainTabs < 200) {
    await page.keyboard.press("Tab");
    plainTabs++;
    if (await focusIn(page, HEAT_MAP)) heatMapStops++;
  }
  test.info().annotations.push({ type: "tab path without the skip link", description: `${plainTabs} Tab presses` });
  expect(await focusIn(page, RANKED)).toBe(true);
  expect(heatMapStops).toBe(1);
  await page.close();
});

test("the heat map is one tab stop: arrows, Home and End move, Enter opens the scenario", async () => {
  const page = await browserCtx.newPage();
  await openSweep(page);
  const cells = page.getByTestId("heat-map").getByRole("button");
  // Exactly one cell is reachable with Tab, and it is the selected one.
  await expect(page.getByTestId("heat-map").locator('button[tabindex="0"]')).toHaveCount(1);
  const stop = page.getByTestId("heat-map").locator('button[tabindex="0"]');
  await expect(stop).toHaveAttribute("aria-pressed", "true");
  await expect(page.getByRole("grid")).toBeVisible();

  let tabs = 0;
  while (!(await focusIn(page, HEAT_MAP)) && tabs < 60) {
    await page.keyboard.press("Tab");
    tabs++;
  }
  expect(await focusIn(page, HEAT_MAP)).toBe(true);
  const start = await focusedCell(page);
  expect(start).toBe(await stop.getAttribute("data-cell"));
  const [r0] = start!.split("-").map(Number);

  // Home, then right and down: one column, then one row.
  await page.keyboard.press("Home");
  await expect.poll(() => focusedCell(page)).toBe(`${r0}-0`);
  await page.keyboard.press("ArrowRight");
  await expect.poll(() => focusedCell(page)).toBe(`${r0}-1`);
  const down = r0 + 1 < 3 ? r0 + 1 : r0 - 1;
  await page.keyboard.press(down > r0 ? "ArrowDown" : "ArrowUp");
  await expect.poll(() => focusedCell(page)).toBe(`${down}-1`);
  await page.keyboard.press("End");
  await expect.poll(() => focusedCell(page)).toBe(`${down}-3`);
  // Past the edge the focus stays put.
  await page.keyboard.press("ArrowRight");
  await expect.poll(() => focusedCell(page)).toBe(`${down}-3`);
  // The roving stop follows the focus: still one tab stop in the grid.
  await expect(page.getByTestId("heat-map").locator('button[tabindex="0"]')).toHaveCount(1);
  await expect(page.getByTestId("heat-map").locator('button[tabindex="0"]')).toHaveAttribute("data-cell", `${down}-3`);

  // Enter opens that scenario: it is marked selected and the URL names it.
  const before = page.url();
  await page.keyboard.press("Enter");
  await expect(page).not.toHaveURL(before);
  await expect(page).toHaveURL(/scenario=\d+/);
  const target = page.getByTestId("heat-map").locator(`button[data-cell="${down}-3"]`);
  await expect(target).toHaveAttribute("aria-pressed", "true");
  await expect(cells.and(page.locator('[aria-pressed="true"]'))).toHaveCount(1);
  // Space opens too.
  await page.keyboard.press("Home");
  await expect.poll(() => focusedCell(page)).toBe(`${down}-0`);
  await page.keyboard.press(" ");
  await expect(page.getByTestId("heat-map").locator(`button[data-cell="${down}-0"]`)).toHaveAttribute("aria-pressed", "true");
  await expectNoSeriousA11yViolations(page);
  await page.close();
});

test("skip links: the first Tab on every page offers the main content, the sweep page also the ranked table", async ({ page }) => {
  // Sign-in page, signed out.
  const signIn = new SignInPage(page);
  await signIn.open();
  await page.keyboard.press("Tab");
  const skipMain = page.getByRole("link", { name: "Skip to main content" });
  await expect(skipMain).toBeFocused();
  await expect(skipMain).toBeVisible();
  await page.keyboard.press("Enter");
  await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe("main-content");
  await expectNoSeriousA11yViolations(page);

  // A signed-in page: the project list.
  const own = await openPage(browserCtx, "/");
  await own.keyboard.press("Tab");
  await expect(own.getByRole("link", { name: "Skip to main content" })).toBeFocused();
  await expect(own.getByRole("link", { name: "Skip to the ranked table" })).toHaveCount(0);
  await own.keyboard.press("Enter");
  await expect.poll(() => own.evaluate(() => document.activeElement?.tagName)).toBe("MAIN");

  // The sweep page: the second stop jumps to the ranked table.
  await openSweep(own);
  await own.keyboard.press("Tab");
  await own.keyboard.press("Tab");
  const skipTable = own.getByRole("link", { name: "Skip to the ranked table" });
  await expect(skipTable).toBeFocused();
  await expect(skipTable).toBeVisible();
  await own.keyboard.press("Enter");
  await expect.poll(() => focusIn(own, RANKED)).toBe(true);
  await own.close();
});

/** WCAG 2.1 relative luminance of an sRGB colour given as rgb()/rgba() (published definition). */
function luminance(css: string): number {
  const [r, g, b] = (css.match(/[\d.]+/g) ?? []).slice(0, 3).map(Number);
  const lin = (v: number) => {
    const s = v / 255;
    return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
}
/** WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05). */
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

/** The focused field's outline, and the first opaque background behind it. */
async function focusRing(field: Locator) {
  await field.focus();
  await expect(field).toBeFocused();
  return field.evaluate((el) => {
    const style = getComputedStyle(el);
    let bg = "rgb(255, 255, 255)";
    for (let p = el.parentElement; p; p = p.parentElement) {
      const c = getComputedStyle(p).backgroundColor;
      if (c && c !== "transparent" && !c.startsWith("rgba(0, 0, 0, 0")) {
        bg = c;
        break;
      }
    }
    return { width: parseFloat(style.outlineWidth), style: style.outlineStyle, color: style.outlineColor, bg };
  });
}

test("a focused drop-down list and a focused text field show a solid outline of at least 2 px at 3:1 contrast", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  const input = await focusRing(page.getByRole("form", { name: "Sign in with password" }).getByLabel("E-mail"));
  expect(input.style).toBe("solid");
  expect(input.width).toBeGreaterThanOrEqual(2);
  // 3:1 for a focus indicator against what is around it: WCAG 2.1, non-text contrast.
  expect(contrast(input.color, input.bg)).toBeGreaterThanOrEqual(3);

  const own = await browserCtx.newPage();
  await openSweep(own);
  const select = await focusRing(own.getByTestId("scenario-picker"));
  expect(select.style).toBe("solid");
  expect(select.width).toBeGreaterThanOrEqual(2);
  expect(contrast(select.color, select.bg)).toBeGreaterThanOrEqual(3);
  await expectNoSeriousA11yViolations(own);
  await own.close();
});
