import type { ErrorBody, FieldErrors } from "@/lib/errors";

export type AuthOutcome = { ok: true; url: string } | { ok: false; status: number; message: string; fields?: FieldErrors };

async function getCsrfToken(): Promise<string> {
  const res = await fetch("/api/auth/csrf", { cache: "no-store" });
  const body = (await res.json()) as { csrfToken: string };
  return body.csrfToken;
}

async function postAuthForm(path: string, fields: Record<string, string>): Promise<AuthOutcome> {
  const csrfToken = await getCsrfToken();
  const res = await fetch(`/api/auth/${path}`, {
    method: "POST",
    // Ask Auth.js for {url} instead of a 302 so the page can show errors in place.
    headers: { "content-type": "application/x-www-form-urlencoded", "X-Auth-Return-Redirect": "1" },
    body: new URLSearchParams({ ...fields, csrfToken }),
  });
  const body = (await res.json().catch(() => ({}))) as Partial<ErrorBody> & { url?: string };
  if (!res.ok || body.error) {
    return { ok: false, status: res.status, message: body.error?.message ?? "Sign-in failed", fields: body.error?.fields };
  }
  const url = new URL(body.url ?? "/", window.location.origin);
  if (url.searchParams.get("error")) {
    return { ok: false, status: 401, message: "Wrong e-mail or password." };
  }
  return { ok: true, url: url.pathname + url.search };
}

export function signInWithPassword(email: string, password: string, callbackUrl = "/"): Promise<AuthOutcome> {
  return postAuthForm("callback/credentials", { email, password, callbackUrl });
}

export function requestSignInLink(email: string, callbackUrl = "/"): Promise<AuthOutcome> {
  return postAuthForm("signin/nodemailer", { email, callbackUrl });
}

export async function signOutNow(): Promise<void> {
  await postAuthForm("signout", { callbackUrl: "/signin" });
  // A full page load, not a client navigation: nothing of the old session may stay cached.
  // eslint-disable-next-line @next/next/no-location-assign-relative-destination
  window.location.assign("/signin");
}
