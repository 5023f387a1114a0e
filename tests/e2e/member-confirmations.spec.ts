import { expect, test, type APIRequestContext, type BrowserContext, type Page } from "@playwright/test";
import { appReady, openPage, signedInContext } from "./fixtures";
import { insertMember } from "./member-fixtures";
import { expectNoSeriousA11yViolations } from "./helpers/accessibility";
import { browserAs, closeAll } from "./helpers/sign-in";

// The team page asks before revoking an invitation or changing a role. Every test works on an
// invitation or member it makes itself: the demo users' roles are what other specs sign in as.
let admin: APIRequestContext;
let browserCtx: BrowserContext;

async function openInvitationEmails(): Promise<string[]> {
  const res = await admin.get("/api/team/invitations");
  expect(res.status()).toBe(200);
  return ((await res.json()) as { invitations: { email: string }[] }).invitations.map((i) => i.email);
}

async function roleOf(userId: string): Promise<string | undefined> {
  const res = await admin.get("/api/team/members");
  expect(res.status()).toBe(200);
  return ((await res.json()) as { members: { userId: string; role: string }[] }).members.find((m) => m.userId === userId)?.role;
}

async function teamPage(): Promise<Page> {
  const page = await openPage(browserCtx, "/team");
  return page;
}

test.beforeAll(async ({ browser }) => {
  admin = await signedInContext("admin");
  browserCtx = await browserAs(browser, admin);
});
test.afterAll(() => closeAll(browserCtx, admin));

test("revoking an invitation asks first; Escape keeps it and gives focus back, confirming revokes it", async () => {
  const invitee = `revoke.me.${Date.now()}@brightwater.example`;
  const made = await admin.post("/api/team/invitations", { data: { email: invitee, role: "viewer" } });
  expect(made.status(), await made.text()).toBe(201);

  const page = await teamPage();
  const rows = page.getByTestId("invitations-table").getByRole("row").filter({ hasText: invitee });
  await expect(rows).toHaveCount(1);
  const revoke = page.getByRole("button", { name: `Revoke the invitation of ${invitee}` });
  await revoke.click();
  const dialog = page.getByRole("dialog", { name: `Revoke the invitation of ${invitee}?` });
  await expect(dialog).toBeVisible();
  await expect(dialog).toContainText(invitee);
  await expect(dialog.getByRole("button", { name: "Revoke invitation" })).toBeVisible();
  await expectNoSeriousA11yViolations(page);

  await page.keyboard.press("Escape");
  await expect(dialog).toBeHidden();
  await expect(revoke).toBeFocused();
  await expect(rows).toHaveCount(1);
  expect(await openInvitationEmails()).toContain(invitee);

  // The Cancel button is the other way out, and it changes nothing either.
  await revoke.click();
  await dialog.getByRole("button", { name: "Cancel" }).click();
  await expect(dialog).toBeHidden();
  expect(await openInvitationEmails()).toContain(invitee);

  await revoke.click();
  await dialog.getByRole("button", { name: "Revoke invitation" }).click();
  await expect(dialog).toBeHidden();
  await expect(page.getByText(invitee)).toHaveCount(0);
  await expect.poll(openInvitationEmails).not.toContain(invitee);
  await page.close();
});

test("changing a role asks first; the drop-down keeps the old role until confirmed, then the new one is saved", async () => {
  const member = await insertMember("engineer");
  const page = await teamPage();
  // Scoped to the table: the open dialog's title names the member too, and getByLabel would match it.
  const select = page.getByTestId("members-table").getByLabel(`Role of ${member.email}`);
  await expect(select).toHaveValue("engineer");
  await expect(select).toBeEnabled();

  await select.selectOption("viewer");
  const dialog = page.getByRole("dialog", { name: `Change the role of ${member.email}?` });
  await expect(dialog).toBeVisible();
  await expect(dialog).toContainText(`${member.email} goes from engineer to viewer`);
  // Nothing is changed yet: the drop-down behind the question still shows the role the member has.
  await expect(select).toHaveValue("engineer");
  await expectNoSeriousA11yViolations(page);

  await page.keyboard.press("Escape");
  await expect(dialog).toBeHidden();
  await expect(select).toHaveValue("engineer");
  expect(await roleOf(member.userId)).toBe("engineer");

  await select.selectOption("manager");
  await expect(dialog).toContainText("goes from engineer to manager");
  await dialog.getByRole("button", { name: "Cancel" }).click();
  await expect(dialog).toBeHidden();
  await expect(select).toHaveValue("engineer");
  expect(await roleOf(member.userId)).toBe("engineer");

  await select.selectOption("viewer");
  await dialog.getByRole("button", { name: "Make viewer" }).click();
  await expect(dialog).toBeHidden();
  await expect(select).toHaveValue("viewer");
  await expect.poll(() => roleOf(member.userId)).toBe("viewer");

  // The saved role is what the page shows after a fresh load too.
  await page.reload();
  await appReady(page);
  await expect(page.getByTestId("members-table").getByLabel(`Role of ${member.email}`)).toHaveValue("viewer");
  await page.close();
});
