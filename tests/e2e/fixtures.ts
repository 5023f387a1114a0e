import { expect, request as playwrightRequest, type APIRequestContext, type BrowserContext, type Page } from "@playwright/test";
import { DEMO_USERS, type DemoPerson } from "../helpers/demo-people";

export const DEMO_PASSWORD = "seriatim-demo-2026";
export const USERS = DEMO_USERS;
export type Who = DemoPerson;

export const baseURL = `http://127.0.0.1:${process.env.E2E_PORT ?? 3100}`;
const mailApi = `http://127.0.0.1:${process.env.MAIL_FAKE_HTTP_PORT ?? 2680}/api/messages`;

export interface CapturedMail {
  id: number;
  to: string[];
  subject: string;
  text: string;
}

/**
 * Waits (30 s by default: the worker may be busy on a loaded machine) for the newest mail to `to`
 * whose id is above `afterId` and, if given, that `match` accepts, read from the SMTP fake.
 */
export async function waitForMail(to: string, afterId = 0, timeoutMs = 30_000, match: (m: CapturedMail) => boolean = () => true): Promise<CapturedMail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const res = await fetch(`${mailApi}?to=${encodeURIComponent(to)}`);
    const list = (await res.json()) as CapturedMail[];
    const fresh = list.filter((m) => m.id > afterId && match(m));
    if (fresh.length) return fresh[fresh.length - 1];
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
}

export async function lastMailId(): Promise<number> {
  const list = (await (await fetch(mailApi)).json()) as CapturedMail[];
  return list.at(-1)?.id ?? 0;
}

export function firstLink(text: string): string {
  const m = text.match(/https?:\/\/\S+/);
  if (!m) throw new Error(`no link in mail:\n${text}`);
  return m[0];
}

/** Signs in over HTTP the way the sign-in form does; returns the raw response. */
export async function postCredentials(ctx: APIRequestContext, email: string, password: string) {
  const { csrfToken } = (await (await ctx.get("/api/auth/csrf")).json()) as { csrfToken: string };
  return ctx.post("/api/auth/callback/credentials", {
    form: { email, password, csrfToken, callbackUrl: "/" },
    headers: { "X-Auth-Return-Redirect": "1" },
  });
}

/**
 * An API context that behaves like the app's own pages: a browser sends Origin on every
 * state-changing request, and proxy.ts refuses a cookie-carrying write that names no page.
 */
export function apiContext(opts: { headers?: Record<string, string>; storageState?: Awaited<ReturnType<APIRequestContext["storageState"]>> } = {}): Promise<APIRequestContext> {
  return playwrightRequest.newContext({ baseURL, storageState: opts.storageState, extraHTTPHeaders: { origin: baseURL, ...opts.headers } });
}

/** A request context holding a signed-in session of one demo user. */
export async function signedInContext(who: Who | "anonymous"): Promise<APIRequestContext> {
  const ctx = await apiContext();
  if (who !== "anonymous") {
    const res = await postCredentials(ctx, USERS[who], DEMO_PASSWORD);
    const body = (await res.json()) as { url?: string };
    if (!res.ok() || !body.url || body.url.includes("error=")) throw new Error(`sign-in of ${who} failed: ${res.status()} ${JSON.stringify(body)}`);
  }
  return ctx;
}

/**
 * Waits until React has taken over a page loaded in full (page.goto, reload, the redirect after
 * signing in): the header's Sign out button stays disabled until then. A click or a typed value
 * before that is lost, and a link clicked then loads the next page in full as well.
 */
export async function appReady(page: Page) {
  await expect(page.getByRole("button", { name: "Sign out" })).toBeEnabled();
}

/** A new tab of a signed-in browser context on `url`, loaded and ready for typing and clicking. */
export async function openPage(ctx: BrowserContext, url: string): Promise<Page> {
  const page = await ctx.newPage();
  await page.goto(url);
  await appReady(page);
  return page;
}
