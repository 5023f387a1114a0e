import { expect, test } from "@playwright/test";
import { appReady, DEMO_PASSWORD, USERS } from "./fixtures";
import { SignInPage } from "./pages/sign-in-page";

test("an engineer creates, renames and archives a project; errors stay beside the field", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword(USERS.engineer, DEMO_PASSWORD);
  await expect(page.getByRole("heading", { name: "Brightwater Fine Chemicals" })).toBeVisible();
  await appReady(page);

  const form = page.getByRole("form", { name: "New project" });
  await form.getByLabel("New project").fill("X");
  await form.getByLabel("Purpose").fill("Hydrogenation train, 3 t/h");
  await form.getByRole("button", { name: "Create project" }).click();
  await expect(form.getByText("Use at least 2 characters")).toBeVisible();
  await expect(form.getByLabel("Purpose")).toHaveValue("Hydrogenation train, 3 t/h");

  const name = `Hydrogenation study ${Date.now()}`;
  await form.getByLabel("New project").fill(name);
  await form.getByRole("button", { name: "Create project" }).click();
  const table = page.getByTestId("projects-table");
  const row = table.getByRole("row").filter({ hasText: name });
  await expect(row).toBeVisible();

  await row.getByRole("button", { name: "Rename" }).click();
  // In edit mode the name sits in an input, so the row no longer matches by text.
  await table.getByLabel("Project name").fill(`${name} (rev B)`);
  await table.getByRole("button", { name: "Save" }).click();
  const renamed = table.getByRole("row").filter({ hasText: `${name} (rev B)` });
  await expect(renamed).toBeVisible();

  await renamed.getByRole("link").click();
  await expect(page.getByTestId("project-title")).toHaveText(`${name} (rev B)`);
  await page.goBack();

  await table.getByRole("row").filter({ hasText: `${name} (rev B)` }).getByRole("button", { name: "Archive" }).click();
  await expect(table.getByRole("row").filter({ hasText: `${name} (rev B)` })).toHaveCount(0);
  await page.getByLabel("Show archived").check();
  await expect(page.getByTestId("projects-table").getByRole("row").filter({ hasText: `${name} (rev B)` })).toContainText("archived");
});

test("a viewer sees projects but no controls to change them", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword(USERS.viewer, DEMO_PASSWORD);
  await expect(page.getByTestId("projects-table")).toContainText("Ester line 3 revamp");
  await expect(page.getByRole("form", { name: "New project" })).toHaveCount(0);
  await expect(page.getByRole("button", { name: "Rename" })).toHaveCount(0);
  await expect(page.getByRole("link", { name: "Members" })).toHaveCount(0);
});

test("a manager sees the project's audit trail", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword(USERS.manager, DEMO_PASSWORD);
  await appReady(page);
  const form = page.getByRole("form", { name: "New project" });
  const name = `Audit trail check ${Date.now()}`;
  await form.getByLabel("New project").fill(name);
  await form.getByRole("button", { name: "Create project" }).click();
  await page.getByRole("link", { name }).click();
  await expect(page.getByTestId("audit-table")).toContainText("project.created");
  await expect(page.getByTestId("audit-table")).toContainText("Marta Lindqvist");
});
