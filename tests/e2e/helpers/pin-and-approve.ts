import { expect as baseExpect, type Browser, type Locator, type Page } from "@playwright/test";
import { signInWithForm } from "./sign-in";

// The journeys' own patience: each step waits on a loaded, shared machine.
const expect = baseExpect.configure({ timeout: 30_000 });

/**
 * From an open candidate page: pins it with `note` (superseding the project's current design if the
 * project already holds one), opens the project and returns the new pin's card, shown pending review.
 */
export async function pinWithNote(page: Page, note: string): Promise<Locator> {
  await page.getByLabel("Note for the reviewer").fill(note);
  await page.getByTestId("pin-button").click();
  const supersede = page.getByRole("dialog", { name: "Supersede the current design?" });
  await expect(page.getByTestId("pin-done").or(supersede)).toBeVisible();
  if (await supersede.isVisible()) await supersede.getByRole("button", { name: "Pin and supersede" }).click();
  await expect(page.getByTestId("pin-done")).toBeVisible();
  await page.getByTestId("pin-done").getByRole("link", { name: "Open the project" }).click();
  const pinned = page.getByTestId("pin").filter({ hasText: note });
  await expect(pinned.getByTestId("pin-state")).toHaveText(/pending review/i);
  return pinned;
}

/** The manager signs in in a context of their own, approves the pin carrying `note` in `projectName` with `comment`, and leaves. */
export async function approveAsManager(browser: Browser, projectName: string, note: string, comment: string): Promise<void> {
  const managerCtx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const managerPage = await managerCtx.newPage();
  await signInWithForm(managerPage, "manager", 60_000);
  await managerPage.getByRole("link", { name: projectName }).click();
  const toReview = managerPage.getByTestId("pin").filter({ hasText: note });
  await toReview.getByLabel("Review comment").fill(comment);
  await toReview.getByRole("button", { name: "Approve" }).click();
  await expect(toReview.getByTestId("pin-state")).toHaveText(/approved/i);
  await managerCtx.close();
}
