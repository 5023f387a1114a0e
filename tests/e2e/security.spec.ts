import http from "node:http";
import type { AddressInfo } from "node:net";
import { expect, request as playwrightRequest, test, type APIRequestContext, type APIResponse } from "@playwright/test";
import Papa from "papaparse";
import { apiContext, baseURL, postCredentials, signedInContext } from "./fixtures";
import { insertMember, MEMBER_PASSWORD } from "./member-fixtures";
import { createModel, submitSweep, waitForSweep, type CandidatePage } from "./sweep-fixtures";
import { closeAll } from "./helpers/sign-in";

let engineer: APIRequestContext;
let admin: APIRequestContext;
const port = new URL(baseURL).port;

test.beforeAll(async () => {
  engineer = await signedInContext("engineer");
  admin = await signedInContext("admin");
});
test.afterAll(() => closeAll(engineer, admin));

async function projectNames(): Promise<string[]> {
  const body = (await (await engineer.get("/api/projects")).json()) as { projects: { name: string }[] };
  return body.projects.map((p) => p.name);
}

async function errorOf(res: APIResponse) {
  return ((await res.json()) as { error: { code: string; message: string; fields?: Record<string, string[]> } }).error;
}

/** The engineer's session cookie in a context that sends no Origin of its own: each test says where the request claims to come from. */
async function engineerCookieOnly(): Promise<APIRequestContext> {
  return playwrightRequest.newContext({ baseURL, storageState: await engineer.storageState() });
}

test.describe("cross-site writes", () => {
  const jsonShaped = (name: string) => JSON.stringify({ name, description: "" });

  test("a JSON-shaped text/plain or form body from another site, another port or with only a foreign Referer is refused with 403 and creates nothing", async () => {
    const raw = await engineerCookieOnly();
    const attempts: [string, Record<string, string>][] = [
      ["text/plain from another site", { origin: "https://evil.example", "content-type": "text/plain" }],
      ["form-encoded from another port of this host", { origin: `http://127.0.0.1:${Number(port) + 1}`, "content-type": "application/x-www-form-urlencoded" }],
      ["JSON from another port under localhost", { origin: `http://localhost:${Number(port) + 1}`, "content-type": "application/json" }],
      ["only a foreign Referer", { referer: "https://evil.example/page.html", "content-type": "text/plain" }],
      ["Sec-Fetch-Site same-site (another port)", { "sec-fetch-site": "same-site", "content-type": "application/json" }],
      ["an opaque origin", { origin: "null", "content-type": "text/plain" }],
      ["no page headers at all, but the cookie", { "content-type": "application/json" }],
    ];
    for (const [what, headers] of attempts) {
      const name = `Cross-site ${what}`;
      const res = await raw.post("/api/projects", { headers, data: jsonShaped(name) });
      expect(res.status(), what).toBe(403);
      const err = await errorOf(res);
      expect(err.code, what).toBe("forbidden");
      expect(err.message, what).toMatch(/refused/);
      expect(await projectNames(), what).not.toContain(name);
    }
    await raw.dispose();
  });

  test("the app's own origin may write JSON, under 127.0.0.1 or localhost, but not a text/plain or form body (415 naming the body)", async () => {
    const raw = await engineerCookieOnly();
    const ok = await raw.post("/api/projects", { headers: { origin: `http://localhost:${port}`, "content-type": "application/json" }, data: jsonShaped("Same-origin write (localhost)") });
    expect(ok.status()).toBe(201);
    const plain = await raw.post("/api/projects", { headers: { origin: baseURL, "content-type": "text/plain" }, data: jsonShaped("Same-origin text body") });
    expect(plain.status()).toBe(415);
    expect(await errorOf(plain)).toMatchObject({ code: "unsupported_media_type", message: "The request body must be JSON (Content-Type: application/json)", fields: { "(body)": ["The request body must be JSON (Content-Type: application/json)"] } });
    expect(await projectNames()).not.toContain("Same-origin text body");
    await raw.dispose();
  });

  test("a personal API token needs no Origin (it is not sent by a browser on its own)", async () => {
    const token = ((await (await engineer.post("/api/tokens", { data: { name: "cross-site check" } })).json()) as { token: { token: string } }).token.token;
    const script = await playwrightRequest.newContext({ baseURL, extraHTTPHeaders: { authorization: `Bearer ${token}` } });
    expect((await script.post("/api/projects", { data: { name: "Made by a script", description: "" } })).status()).toBe(201);
    await script.dispose();
  });

  test("a real browser form on a page of another port of the same host (the cookie goes along) is refused", async ({ browser }) => {
    const name = `Browser form from another port ${Date.now()}`;
    // The attacker's page: a text/plain form whose body reads as JSON, submitted on load.
    const page = `<!doctype html><form id="f" method="POST" action="${baseURL}/api/projects" enctype="text/plain"><input name='{"name":"${name}","description":"' value='"}'></form><script>document.getElementById("f").submit()</script>`;
    const server = http.createServer((_req, res) => res.end(page));
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    const attacker = `http://127.0.0.1:${(server.address() as AddressInfo).port}/`;
    try {
      const ctx = await browser.newContext({ storageState: await engineer.storageState() });
      const tab = await ctx.newPage();
      const answered = tab.waitForResponse((r) => r.url() === `${baseURL}/api/projects` && r.request().method() === "POST");
      await tab.goto(attacker);
      const res = await answered;
      expect(res.request().headers()["origin"]).toBe(attacker.replace(/\/$/, ""));
      expect(res.status()).toBe(403);
      expect(await projectNames()).not.toContain(name);
      await ctx.close();
    } finally {
      server.close();
    }
  });
});

test.describe("sessions that end", () => {
  test("a session cookie copied before sign-out answers 401 afterwards, and its pages go to sign-in", async ({ browser }) => {
    const original = await signedInContext("viewer");
    const copy = await apiContext({ storageState: await original.storageState() });
    expect((await copy.get("/api/me")).status()).toBe(200);

    const { csrfToken } = (await (await original.get("/api/auth/csrf")).json()) as { csrfToken: string };
    const out = await original.post("/api/auth/signout", { form: { csrfToken, callbackUrl: "/signin" }, headers: { "X-Auth-Return-Redirect": "1" } });
    expect(out.status()).toBe(200);

    const after = await copy.get("/api/me");
    expect(after.status()).toBe(401);
    expect(await errorOf(after)).toMatchObject({ code: "unauthorized", message: "Your session has ended; sign in again" });
    const ctx = await browser.newContext({ storageState: await copy.storageState() });
    const page = await ctx.newPage();
    await page.goto("/");
    await expect(page).toHaveURL(/\/signin$/);
    await ctx.close();
    await copy.dispose();
    await original.dispose();
  });

  test("a removed member's session answers 401 at once", async () => {
    const member = await insertMember("engineer");
    const ctx = await apiContext();
    expect((await postCredentials(ctx, member.email, MEMBER_PASSWORD)).status()).toBe(200);
    expect((await ctx.get("/api/me")).status()).toBe(200);
    expect((await admin.delete(`/api/team/members/${member.userId}`)).status()).toBe(204);
    expect((await ctx.get("/api/me")).status()).toBe(401);
    expect((await ctx.post("/api/projects", { data: { name: "After removal", description: "" } })).status()).toBe(401);
    await ctx.dispose();
  });

  test("a demoted member's next write is refused at once (the role is read afresh on every request)", async () => {
    const member = await insertMember("engineer");
    const ctx = await apiContext();
    expect((await postCredentials(ctx, member.email, MEMBER_PASSWORD)).status()).toBe(200);
    expect((await ctx.post("/api/projects", { data: { name: "Before demotion", description: "" } })).status()).toBe(201);
    expect((await admin.patch(`/api/team/members/${member.userId}`, { data: { role: "viewer" } })).status()).toBe(200);
    expect((await ctx.post("/api/projects", { data: { name: "After demotion", description: "" } })).status()).toBe(403);
    expect(((await (await ctx.get("/api/me")).json()) as { team: { role: string } }).team.role).toBe("viewer");
    await ctx.dispose();
  });
});

/** Sends `total` bytes of a JSON-looking body, declared or chunked; resolves with the answer. */
function sendBig(path: string, total: number, declareLength: boolean): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const headers: Record<string, string> = { "content-type": "application/json", origin: baseURL };
    if (declareLength) headers["content-length"] = String(total);
    const req = http.request(`${baseURL}${path}`, { method: "POST", headers }, (res) => {
      let body = "";
      res.on("data", (d: Buffer) => (body += d.toString()));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on("error", reject);
    const chunk = Buffer.alloc(1024 * 1024, 0x20);
    let sent = 0;
    const pump = () => {
      while (sent < total) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once("drain", pump);
      }
      req.end();
    };
    pump();
  });
}

test.describe("request body limits", () => {
  for (const declared of [true, false]) {
    test(`a 50 MB JSON body ${declared ? "with" : "without"} Content-Length gets 413 naming the body, and the server stays up`, async () => {
      const res = await sendBig("/api/invitations/accept", 50 * 1024 * 1024, declared);
      expect(res.status).toBe(413);
      const err = (JSON.parse(res.body) as { error: { code: string; message: string; fields: Record<string, string[]> } }).error;
      expect(err.code).toBe("payload_too_large");
      expect(err.message).toMatch(/request body .*at most 64 KB/);
      expect(err.fields["(body)"]).toEqual(["At most 64 KB"]);
      expect((await engineer.get("/api/health")).status()).toBe(200);
      expect((await engineer.get("/api/me")).status()).toBe(200);
    });
  }
});

test.describe("security headers", () => {
  const FIXED = { "x-frame-options": "DENY", "x-content-type-options": "nosniff", "referrer-policy": "same-origin" };

  test("a page, an API answer, a refusal and a static file all carry them; pages get a fresh script nonce", async () => {
    const anon = await apiContext();
    const page1 = await anon.get("/signin");
    const page2 = await anon.get("/signin");
    for (const [k, v] of Object.entries(FIXED)) expect(page1.headers()[k], k).toBe(v);
    const csp = page1.headers()["content-security-policy"];
    expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{20,}' 'strict-dynamic'/);
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toContain("unsafe-eval");
    const nonce = /'nonce-([^']+)'/.exec(csp)![1];
    expect(/'nonce-([^']+)'/.exec(page2.headers()["content-security-policy"])![1]).not.toBe(nonce);
    const html = await page1.text();
    // Next.js put this request's nonce on its script tags.
    expect(html).toContain(`nonce="${nonce}"`);

    const api = await anon.get("/api/health");
    for (const [k, v] of Object.entries(FIXED)) expect(api.headers()[k], k).toBe(v);
    expect(api.headers()["content-security-policy"]).toBe("default-src 'none'; frame-ancestors 'none'");

    const refused = await anon.post("/api/projects", { headers: { origin: "https://evil.example" }, data: {} });
    expect(refused.status()).toBe(403);
    for (const [k, v] of Object.entries(FIXED)) expect(refused.headers()[k], k).toBe(v);

    const asset = /\/_next\/static\/[^"']+\.js/.exec(html)![0];
    const file = await anon.get(asset);
    expect(file.status()).toBe(200);
    for (const [k, v] of Object.entries(FIXED)) expect(file.headers()[k], k).toBe(v);
    expect(file.headers()["content-security-policy"]).toBe("default-src 'none'; frame-ancestors 'none'");
    await anon.dispose();
  });
});

test.describe("CSV exports", () => {
  test("a project named like a formula reaches the pin's CSV as text: no cell of the file starts like a formula", async () => {
    test.setTimeout(120_000);
    const name = `=HYPERLINK("https://evil.example","open"),@SUM(1);-2+3 ${Date.now()}`;
    const created = await engineer.post("/api/projects", { data: { name, description: "" } });
    expect(created.status(), await created.text()).toBe(201);
    const projectId = ((await created.json()) as { project: { id: string } }).project.id;
    const { version } = await createModel(engineer, projectId, "Formula check kinetics");
    const sweep = await submitSweep(engineer, projectId, version.id, [], 1);
    expect((await waitForSweep(engineer, sweep.id)).status).toBe("succeeded");
    const page = (await (await engineer.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates`)).json()) as CandidatePage;
    const pin = await engineer.post(`/api/candidates/${page.items[0].id}/pin`, { data: { note: "formula check" } });
    expect(pin.status()).toBe(201);
    const pinId = ((await pin.json()) as { pin: { id: string } }).pin.id;

    const res = await engineer.get(`/api/pins/${pinId}/export.csv`);
    expect(res.status()).toBe(200);
    const text = await res.text();
    expect(text).toContain(`'=HYPERLINK("https://evil.example"`);
    // Read the way a spreadsheet would: every line, every cell (comment lines included).
    const cells = Papa.parse<string[]>(text, { skipEmptyLines: true }).data.flat();
    const formulaLike = cells.filter((c) => /^[ \t\r]*[=+\-@]/.test(c) && !/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(c));
    expect(formulaLike).toEqual([]);
    // The numbers are still numbers.
    const rows = Papa.parse<Record<string, unknown>>(text, { header: true, comments: "#", dynamicTyping: true, skipEmptyLines: true }).data;
    expect(rows.length).toBeGreaterThan(0);
    expect(typeof Object.values(rows[0]).find((v) => typeof v === "number")).toBe("number");
  });
});
