import { expect, type APIRequestContext, type Browser, type BrowserContext, type Page } from "@playwright/test";
import { appReady, DEMO_PASSWORD, USERS, type Who } from "../fixtures";
import { SignInPage } from "../pages/sign-in-page";

/** The window size the screen specs use (and their screenshots are taken at). */
export const DESKTOP = { width: 1280, height: 900 };

/**
 * Signs a demo user in through the sign-in form, as a person would, and waits for the projects
 * page to be ready. `timeout` is how long the first page may take on a loaded machine.
 */
export async function signInWithForm(page: Page, who: Who, timeout = 30_000) {
  await page.setViewportSize(DESKTOP);
  const form = new SignInPage(page);
  await form.open();
  await form.withPassword(USERS[who], DEMO_PASSWORD);
  await expect(page.getByRole("heading", { name: "Brightwater Fine Chemicals" })).toBeVisible({ timeout });
  await appReady(page);
}

/** A browser context signed in as the API context's user (its session cookie), at desktop size. */
export async function browserAs(browser: Browser, api: APIRequestContext, opts: { acceptDownloads?: boolean } = {}): Promise<BrowserContext> {
  return browser.newContext({ storageState: await api.storageState(), viewport: DESKTOP, ...opts });
}

type Closable = { close(): Promise<void> } | { dispose(): Promise<void> } | undefined;

/** For afterAll: closes the browser contexts and disposes the API contexts a spec opened, in the order given. */
export async function closeAll(...opened: Closable[]) {
  for (const c of opened) {
    if (!c) continue;
    if ("close" in c) await c.close();
    else await c.dispose();
  }
}
