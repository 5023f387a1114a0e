import { expect, test } from "@playwright/test";
import { appReady, DEMO_PASSWORD, firstLink, lastMailId, signedInContext, USERS, waitForMail } from "./fixtures";
import { SignInPage } from "./pages/sign-in-page";

test("an admin invites by e-mail; the link creates the account and signs it in with its role", async ({ page, browser }) => {
  const invitee = `new.engineer.${Date.now()}@brightwater.example`;
  const before = await lastMailId();

  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword(USERS.admin, DEMO_PASSWORD);
  await appReady(page);
  await page.getByRole("link", { name: "Members" }).click();
  const form = page.getByRole("form", { name: "Invite a member" });
  await form.getByLabel("Invite by e-mail").fill("not an address");
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByText("Enter a valid e-mail address")).toBeVisible();
  await form.getByLabel("Invite by e-mail").fill(invitee);
  await form.getByLabel("Role").selectOption("engineer");
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByText(`Invitation sent to ${invitee}`)).toBeVisible();
  await expect(page.getByTestId("invitations-table")).toContainText(invitee);

  const mail = await waitForMail(invitee, before);
  expect(mail.subject).toContain("Brightwater Fine Chemicals");
  const link = firstLink(mail.text);

  const fresh = await browser.newContext();
  const p = await fresh.newPage();
  await p.goto(link);
  await expect(p.getByRole("heading", { name: "Join Brightwater Fine Chemicals" })).toBeVisible();
  const accept = p.getByRole("form", { name: "Accept invitation" });
  // Its button stays disabled until React runs in the page; a name typed before that is lost.
  await expect(accept.getByRole("button", { name: "Create account and sign in" })).toBeEnabled();
  await accept.getByLabel("Your name").fill("Rosa Ferreira");
  await accept.getByLabel("Password").fill("short");
  await accept.getByRole("button", { name: "Create account and sign in" }).click();
  await expect(accept.getByText("Use at least 10 characters")).toBeVisible();
  await expect(accept.getByLabel("Your name")).toHaveValue("Rosa Ferreira");
  await accept.getByLabel("Password").fill("rosa-chooses-a-long-one");
  await accept.getByRole("button", { name: "Create account and sign in" }).click();
  await expect(p.getByTestId("user-name")).toHaveText("Rosa Ferreira");
  await expect(p.getByTestId("role-badge")).toHaveText("engineer");

  // The link is spent.
  await p.goto(link);
  await expect(p.getByRole("heading", { name: "Invitation not valid" })).toBeVisible();
  await fresh.close();

  // The admin sees the new member and can remove them; the removed user loses access at once.
  const admin = await signedInContext("admin");
  const members = (await (await admin.get("/api/team/members")).json()) as { members: { userId: string; email: string }[] };
  const rosa = members.members.find((m) => m.email === invitee)!;
  expect(rosa).toBeTruthy();
  expect((await admin.delete(`/api/team/members/${rosa.userId}`)).status()).toBe(204);
  const after = (await (await admin.get("/api/team/members")).json()) as { members: { email: string }[] };
  expect(after.members.map((m) => m.email)).not.toContain(invitee);
  await admin.dispose();
});
