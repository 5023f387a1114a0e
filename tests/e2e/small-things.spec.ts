import { expect, test } from "@playwright/test";
import { appReady, DEMO_PASSWORD, openPage, signedInContext, USERS } from "./fixtures";
import { SignInPage } from "./pages/sign-in-page";
import { firstProjectId } from "./sweep-fixtures";

const FIXTURES = "tests/fixtures/datasets";
// The eight-byte signature that opens every PNG file (PNG specification, section 5.2), then an
// IHDR chunk's length and type, and a run of NULs as any image carries.
const PNG_BYTES = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]), Buffer.from("IHDR"), Buffer.alloc(200, 0)]);

test("sign-in: a stale 'Wrong e-mail or password.' goes once the user edits or a new error appears (visitor)", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword(USERS.engineer, "not-the-password");
  const stale = page.getByRole("alert").filter({ hasText: "Wrong e-mail or password" });
  await expect(stale).toBeVisible();

  // A format error after it: only the new message stands.
  const form = page.getByRole("form", { name: "Sign in with password" });
  await form.getByLabel("E-mail").fill("not-an-address");
  await form.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("Enter a valid e-mail address")).toBeVisible();
  await expect(stale).toHaveCount(0);

  // Wrong again, then merely editing a field clears it.
  await form.getByLabel("E-mail").fill(USERS.engineer);
  await form.getByRole("button", { name: "Sign in" }).click();
  await expect(stale).toBeVisible();
  await form.getByLabel("Password").fill("another try");
  await expect(stale).toHaveCount(0);
});

test("upload: the page says the file was read once reading is done, and a PNG renamed .csv is not a table (engineer)", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword(USERS.engineer, DEMO_PASSWORD);
  await appReady(page);
  await page.getByRole("link", { name: "Ester line 3 revamp" }).click();
  await page.getByRole("region", { name: "Rate data" }).getByRole("link", { name: "Upload rate data" }).click();
  await expect(page.getByRole("heading", { name: "Upload rate data", level: 1 })).toBeVisible();

  await page.getByLabel("CSV or XLSX file").setInputFiles(`${FIXTURES}/ester-bench.csv`);
  await expect(page.getByTestId("column-mapping")).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId("chosen-file")).toHaveText(/^Read ester-bench\.csv$/);

  await page.getByLabel("CSV or XLSX file").setInputFiles({ name: "picture.csv", mimeType: "text/csv", buffer: PNG_BYTES });
  await expect(page.getByText("This file is not a CSV or Excel table")).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId("chosen-file")).toHaveText(/^Could not read picture\.csv$/);
  await expect(page.getByText(/rows read/)).toHaveCount(0);
});

test("upload API: a PNG renamed .csv is a 400 naming the file field (engineer)", async () => {
  const engineer = await signedInContext("engineer");
  const projectId = await firstProjectId(engineer);
  const mapping = JSON.stringify({ columns: { h1: "conversion", h2: "rate" }, units: {} });
  const res = await engineer.post(`/api/projects/${projectId}/datasets/preview`, { multipart: { file: { name: "picture.csv", mimeType: "text/csv", buffer: PNG_BYTES }, mapping } });
  expect(res.status()).toBe(400);
  const body = (await res.json()) as { error: { message: string; fields: Record<string, string[]> } };
  expect(body.error.fields.file.join(" ")).toContain("This file is not a CSV or Excel table");
  // Invalid UTF-8 without a NUL byte is refused too; a real table of the same size is read.
  const latin1 = await engineer.post(`/api/projects/${projectId}/datasets/preview`, { multipart: { file: { name: "l.csv", mimeType: "text/csv", buffer: Buffer.from([0x68, 0x31, 0x2c, 0xe9, 0xff, 0x0a]) }, mapping } });
  expect(latin1.status()).toBe(400);
  const good = await engineer.post(`/api/projects/${projectId}/datasets/preview`, { multipart: { file: { name: "g.csv", mimeType: "text/csv", buffer: Buffer.from("h1,h2\n0.1,2\n") }, mapping } });
  expect(good.status()).toBe(200);
  await engineer.dispose();
});

test("the printed report leaves out the chart's pointing hint (manager)", async ({ browser }) => {
  const manager = await signedInContext("manager");
  const projectId = await firstProjectId(manager);
  const pins = (await (await manager.get(`/api/projects/${projectId}/pins`)).json()) as { pins: { id: string }[] };
  const ctx = await browser.newContext({ storageState: await manager.storageState() });
  const page = await openPage(ctx, `/projects/${projectId}/pins/${pins.pins[0].id}/report`);
  const hint = page.getByText("Hover or focus the chart").first();
  await expect(hint).toBeVisible();
  await page.emulateMedia({ media: "print" });
  await expect(hint).toBeHidden();
  await page.emulateMedia({ media: "screen" });
  await expect(hint).toBeVisible();
  await ctx.close();
  await manager.dispose();
});

test("the inventory title counts idle vessels only (engineer)", async ({ browser }) => {
  const engineer = await signedInContext("engineer");
  const { vessels } = (await (await engineer.get("/api/inventory")).json()) as { vessels: { available: boolean }[] };
  const idle = vessels.filter((v) => v.available).length;
  const inUse = vessels.length - idle;
  // The demo inventory holds a vessel on loan (lib/demo/inventory.ts), so the two counts differ.
  expect(inUse).toBeGreaterThan(0);
  const ctx = await browser.newContext({ storageState: await engineer.storageState() });
  const page = await openPage(ctx, "/inventory");
  await expect(page.getByTestId("inventory-count")).toHaveText(`(${idle}; ${inUse} more in use)`);
  await ctx.close();
  await engineer.dispose();
});

test("the demo project reads as the bench study its litre-sized reactor is (engineer)", async ({ browser }) => {
  const engineer = await signedInContext("engineer");
  const ctx = await browser.newContext({ storageState: await engineer.storageState() });
  const page = await openPage(ctx, "/");
  await page.getByRole("link", { name: "Ester line 3 revamp" }).click();
  await expect(page.getByTestId("project-title")).toHaveText("Ester line 3 revamp");
  await expect(page.getByText(/bench-scale study/)).toBeVisible();
  await expect(page.getByText(/kt\/a/)).toHaveCount(0);
  await ctx.close();
  await engineer.dispose();
});
