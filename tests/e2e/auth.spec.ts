import { expect, test } from "@playwright/test";
import { apiContext, baseURL, DEMO_PASSWORD, firstLink, lastMailId, postCredentials, USERS, waitForMail } from "./fixtures";
import { SignInPage } from "./pages/sign-in-page";

test("password sign-in shows the user, team and role in the header", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword(USERS.manager, DEMO_PASSWORD);
  await expect(page.getByRole("heading", { name: "Brightwater Fine Chemicals" })).toBeVisible();
  await expect(page.getByTestId("user-name")).toHaveText("Marta Lindqvist");
  await expect(page.getByTestId("team-name")).toHaveText("Brightwater Fine Chemicals");
  await expect(page.getByTestId("role-badge")).toHaveText("manager");
  const cookies = await page.context().cookies();
  const session = cookies.find((c) => c.name.includes("authjs.session-token"));
  expect(session?.httpOnly).toBe(true);
  expect(session?.sameSite).toBe("Lax");

  await page.getByRole("button", { name: "Sign out" }).click();
  // Sign-out is three round trips (token, sign-out, page load): on a loaded machine they can take longer than 5 s.
  await expect(page).toHaveURL(/\/signin/, { timeout: 20_000 });
  await page.goto("/");
  await expect(page).toHaveURL(/\/signin/);
});

test("a wrong password is refused in place and keeps what was typed", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword(USERS.engineer, "not-the-password");
  await expect(page.getByRole("alert").filter({ hasText: "Wrong e-mail or password" })).toBeVisible();
  await expect(page.getByRole("form", { name: "Sign in with password" }).getByLabel("E-mail")).toHaveValue(USERS.engineer);
});

test("the sign-in form checks the address before sending", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword("not-an-address", "x");
  await expect(page.getByText("Enter a valid e-mail address")).toBeVisible();
});

test("e-mail link sign-in: the link from the captured mail signs the user in, once", async ({ page, browser }) => {
  const before = await lastMailId();
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.askForLink(USERS.viewer);
  await expect(page.getByRole("status")).toContainText("sign-in link is on its way");

  const mail = await waitForMail(USERS.viewer, before);
  expect(mail.subject).toBe("Your Seriatim sign-in link");
  const link = firstLink(mail.text);
  expect(link.startsWith(baseURL)).toBe(true);

  await page.goto(link);
  await expect(page.getByTestId("user-name")).toHaveText("Vic Moreau");
  await expect(page.getByTestId("role-badge")).toHaveText("viewer");

  // A used link does not work a second time, in a fresh browser.
  const other = await browser.newContext();
  const p2 = await other.newPage();
  await p2.goto(link);
  await expect(p2).toHaveURL(/\/signin/);
  await expect(p2.getByRole("alert").filter({ hasText: "expired or was already used" })).toBeVisible();
  await other.close();
});

test("a link request for an unknown address looks the same and sends nothing", async ({ page }) => {
  const before = await lastMailId();
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.askForLink("stranger@nowhere.example");
  await expect(page.getByRole("status")).toContainText("sign-in link is on its way");
  await expect(waitForMail("stranger@nowhere.example", before, 1500)).rejects.toThrow(/no mail/);
});

test("ten failed sign-ins for one address get 429 with a clear message, in the API and on screen", async ({ page }) => {
  const ctx = await apiContext();
  const email = "throttle.target@brightwater.example";
  for (let i = 0; i < 10; i++) {
    const res = await postCredentials(ctx, email, `wrong-${i}`);
    expect(res.status(), `attempt ${i + 1}`).toBe(200);
    expect(((await res.json()) as { url: string }).url).toContain("error=");
  }
  const blocked = await postCredentials(ctx, email, "wrong-again");
  expect(blocked.status()).toBe(429);
  expect(Number(blocked.headers()["retry-after"])).toBeGreaterThan(0);
  const body = (await blocked.json()) as { error: { code: string; message: string } };
  expect(body.error.code).toBe("rate_limited");
  expect(body.error.message).toMatch(/Too many failed sign-ins/);
  await ctx.dispose();

  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.withPassword(email, "wrong-once-more");
  await expect(page.getByRole("alert").filter({ hasText: "Too many failed sign-ins" })).toBeVisible();
});
