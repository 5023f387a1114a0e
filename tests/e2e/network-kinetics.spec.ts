import { mkdirSync } from "node:fs";
import { expect, test, type Locator } from "@playwright/test";
import { appReady, signedInContext } from "./fixtures";
import { firstProjectId } from "./sweep-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs } from "./helpers/sign-in";

const SHOTS = "test-results/screens";
mkdirSync(SHOTS, { recursive: true });

// A → B → C, first order, C_A0 = 1 mol/L (Levenspiel, Chemical Reaction Engineering, 3rd ed., ch. 8):
// plug flow C_B,max = C_A0 (k1/k2)^(k2/(k2-k1)); one stirred tank C_B,max = C_A0 / ((k2/k1)^(1/2) + 1)^2.
const tubeBest = (k1: number, k2: number) => (k1 / k2) ** (k2 / (k2 - k1));
const tankBest = (k1: number, k2: number) => 1 / (Math.sqrt(k2 / k1) + 1) ** 2;
/** The number a readout shows (four significant digits), read again until it settles. */
const reading = (cell: Locator) => async () => Number((await cell.textContent())?.trim().split(" ")[0]);

test("an engineer models several reactions, sees the path charts follow a rate constant, saves and reopens as typed", async ({ browser }) => {
  const engineer = await signedInContext("engineer");
  const projectId = await firstProjectId(engineer);
  const ctx = await browserAs(browser, engineer);
  const page = await ctx.newPage();
  await page.goto(`/projects/${projectId}/kinetics/new`);
  await appReady(page);

  await page.getByRole("link", { name: /Several reactions/ }).click();
  await expect(page.getByRole("link", { name: /Several reactions/ })).toHaveAttribute("aria-current", "page");
  await expect(page.getByTestId("reaction-1-equation")).toHaveText("A → B");
  await expect(page.getByTestId("reaction-2-equation")).toHaveText("B → C");

  // The default draft: k1 = 0.02 1/s, k2 = 0.005 1/s.
  const tube = page.getByTestId("best-tube-product");
  const tank = page.getByTestId("best-tank-product");
  await expect(page.getByTestId("network-path-chart")).toBeVisible();
  await expect(page.getByTestId("network-selectivity-chart")).toBeVisible();
  await expect.poll(reading(tube)).toBeCloseTo(tubeBest(0.02, 0.005), 3);
  await expect.poll(reading(tank)).toBeCloseTo(tankBest(0.02, 0.005), 3);

  // A slower over-reaction leaves more B: the readout follows reaction 2's rate constant.
  const k2 = page.getByTestId("reaction-2").getByLabel("Rate constant k", { exact: true });
  await k2.fill("0.0025");
  await expect.poll(reading(tube)).toBeCloseTo(tubeBest(0.02, 0.0025), 3);
  await expect.poll(reading(tank)).toBeCloseTo(tankBest(0.02, 0.0025), 3);

  // The form's own check, at the field.
  await k2.fill("-1");
  await expect(page.locator("#f-reactions-1-k-value-error")).toHaveText(/Must not be negative/);
  await k2.fill("0.0025");
  await expect(page.locator("#f-reactions-1-k-value-error")).toHaveCount(0);

  // The engine's refusal of an expression it cannot read, at the field too.
  const reaction2 = page.getByTestId("reaction-2");
  await reaction2.getByRole("radio", { name: /Expression/ }).check();
  await reaction2.getByLabel("Rate of reaction 2, mol/(m³·s)").fill("0.005 * C_B +* 2");
  await expect(page.locator("#f-reactions-1-expression-error")).toBeVisible();
  await expect(page.getByTestId("preview-error")).toContainText("Reaction 2, rate expression");
  // Read in labels, never a key or a dotted path.
  expect(await page.getByTestId("preview-error").textContent()).not.toMatch(/\b[a-z]+[A-Z]\w*\b|\w+\.\d+\.\w+/);
  await reaction2.getByRole("radio", { name: /Power law/ }).check();
  await expect.poll(reading(tube)).toBeCloseTo(tubeBest(0.02, 0.0025), 3);

  // Units stay as typed: the flow in L/min, the feed of A in kmol/m³ (the charts read in it).
  await page.getByLabel("Feed volumetric flow", { exact: true }).fill("90");
  await page.getByLabel("Feed volumetric flow unit").selectOption("L/min");
  await page.getByLabel("Feed concentration of A unit").selectOption("kmol/m3");
  await expect(tube).toContainText("kmol/m³");
  await expect.poll(reading(tube)).toBeCloseTo(tubeBest(0.02, 0.0025), 3);

  // Without a wanted product the path chart shows the key reactant against residence time, with a hint.
  await page.getByLabel("Wanted product").selectOption({ label: "None chosen" });
  await expect(page.getByText("Choose a wanted product above")).toBeVisible();
  await expect(page.getByTestId("key-readout")).toContainText("Single tube to 90 % conversion");
  await page.getByLabel("Wanted product").selectOption({ label: "B" });
  await expect(tube).toBeVisible();

  await page.getByLabel("Model name").fill(`Series chemistry ${Date.now()}`);
  await page.screenshot({ path: `${SHOTS}/network-kinetics-editor.png`, fullPage: true });
  await expectNoSeriousA11yViolations(page);

  await page.getByRole("button", { name: "Save kinetics" }).click();
  await expect(page).toHaveURL(/\/kinetics\/[0-9a-f-]{36}\?saved=1$/);
  await appReady(page);
  await expect(page.getByTestId("versions-table")).toContainText("2 reactions, key reactant A, wanted product B");

  // Reopened in the editor of several reactions, every number and unit as typed.
  await expect(page.getByTestId("reaction-2").getByLabel("Rate constant k", { exact: true })).toHaveValue("0.0025");
  await expect(page.getByLabel("Feed volumetric flow", { exact: true })).toHaveValue("90");
  await expect(page.getByLabel("Feed volumetric flow unit")).toHaveValue("L/min");
  await expect(page.getByLabel("Feed concentration of A", { exact: true })).toHaveValue("1");
  await expect(page.getByLabel("Feed concentration of A unit")).toHaveValue("kmol/m3");
  await expect(page.getByTestId("best-tube-product")).toContainText("kmol/m³");
  await expect.poll(reading(page.getByTestId("best-tube-product"))).toBeCloseTo(tubeBest(0.02, 0.0025), 3);

  // A new version from the reopened editor.
  await page.getByTestId("reaction-1").getByLabel("Rate constant k", { exact: true }).fill("0.04");
  await page.getByRole("button", { name: "Save as version 2" }).click();
  await expect(page.getByText(/^Saved as version 2\./).first()).toBeVisible();
  await expect(page.getByTestId("versions-table")).toContainText("v2");
  await expect(page.getByRole("button", { name: "Save as version 3" })).toBeVisible();
  await expect(page.getByTestId("reaction-1").getByLabel("Rate constant k", { exact: true })).toHaveValue("0.04");
  await ctx.close();
  await engineer.dispose();
});
