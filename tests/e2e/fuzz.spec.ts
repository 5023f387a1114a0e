import { expect, test, type APIRequestContext } from "@playwright/test";
import type pg from "pg";
import { baseURL, signedInContext, USERS, type Who } from "./fixtures";
import { e2ePool, rowCounts, tablesGrown, teamIds, waitQuiet } from "./fuzz-db";
import { buildRequest, type FuzzRequest } from "./fuzz-requests";
import { discoverRoutes, type FuzzRoute } from "./fuzz-routes";
import { Fuzzer } from "./fuzz-values";

// Seeded: the same FUZZ_SEED sends the same requests. FUZZ_REQUESTS sets how many per user.
const SEED = Number(process.env.FUZZ_SEED ?? 20261202);
const PER_USER = Number(process.env.FUZZ_REQUESTS ?? 1200);
// Requests in flight at once, and how many share one before/after row count.
const PARALLEL = 6;
const GROUP = 36;
// A safety limit for one answer on a loaded machine, not a speed target.
const ANSWER_WITHIN_MS = 60_000;

interface Sent {
  req: FuzzRequest;
  status: number | null;
  error?: string;
  body?: string;
}

const contexts = {} as Record<Who, APIRequestContext>;
const cookies = {} as Record<Who, string>;
let pool: pg.Pool;
let routes: FuzzRoute[];
let ids: Record<string, string>;

test.describe.configure({ mode: "serial" });

test.beforeAll(async () => {
  test.setTimeout(180_000);
  pool = e2ePool();
  for (const who of ["admin", "engineer"] as const) {
    contexts[who] = await signedInContext(who);
    cookies[who] = (await contexts[who].storageState()).cookies.map((c) => `${c.name}=${c.value}`).join("; ");
  }
  routes = discoverRoutes(await (await contexts.admin.get("/api/openapi.json")).json());
  const me = (await (await contexts.admin.get("/api/me")).json()) as { team: { id: string } };
  // Its own project, so a PATCH or PUT the fuzz got through could not change another test's data.
  const created = await contexts.admin.post("/api/projects", { data: { name: `Fuzz target ${Date.now()}`, description: "" }, headers: { Origin: baseURL } });
  expect(created.status()).toBe(201);
  ids = { ...(await teamIds(pool, me.team.id, USERS.admin)), projectId: ((await created.json()) as { project: { id: string } }).project.id };
});

test.afterAll(async () => {
  for (const c of Object.values(contexts)) await c.dispose();
  await pool?.end();
});

async function send(who: Who, req: FuzzRequest): Promise<Sent> {
  try {
    const res = await fetch(baseURL + req.path, {
      method: req.method,
      headers: { Origin: baseURL, Cookie: cookies[who], ...req.headers },
      body: req.body,
      redirect: "manual",
      signal: AbortSignal.timeout(ANSWER_WITHIN_MS),
    });
    const body = await res.text();
    return { req, status: res.status, body: body.slice(0, 300) };
  } catch (err) {
    return { req, status: null, error: String((err as Error).cause ?? err) };
  }
}

async function fuzzAs(who: Who, seed: number) {
  const f = new Fuzzer(seed, (name) => ids[name]);
  const requests = Array.from({ length: PER_USER }, (_, i) => buildRequest(f, routes[i % routes.length], ids));
  const sent: Sent[] = [];
  const wroteWhenRefused: string[] = [];
  let settle = true;
  for (let g = 0; g < requests.length; g += GROUP) {
    // Counts are compared only around groups that were all refused; after anything else
    // (a sign-in the fuzz got to Auth.js, say) wait until writes have settled.
    if (settle) await waitQuiet(pool);
    const before = await rowCounts(pool);
    const group: Sent[] = [];
    const slice = requests.slice(g, g + GROUP);
    for (let b = 0; b < slice.length; b += PARALLEL) group.push(...(await Promise.all(slice.slice(b, b + PARALLEL).map((r) => send(who, r)))));
    sent.push(...group);
    const refused = (s: Sent) => s.status !== null && s.status >= 400 && s.status < 500;
    // A GET writes nothing, whatever it answers; a write that was not refused may have.
    const allRefused = group.every((s) => s.req.method === "GET" || refused(s));
    settle = !allRefused;
    if (allRefused) {
      const grown = tablesGrown(before, await rowCounts(pool));
      if (grown.length) wroteWhenRefused.push(`${grown.join(", ")} after: ${group.map((s) => `${s.status} ${s.req.label}`).join(" | ")}`);
    }
  }
  return { sent, wroteWhenRefused };
}

const describe = (s: Sent) => `${s.status ?? s.error} ${s.req.label.slice(0, 300)} → ${s.body?.slice(0, 200) ?? ""}`;

function report(who: Who, seed: number, sent: Sent[]) {
  const byClass = new Map<string, number>();
  for (const s of sent) {
    const k = s.status === null ? "no answer" : `${Math.floor(s.status / 100)}xx`;
    byClass.set(k, (byClass.get(k) ?? 0) + 1);
  }
  const covered = new Set(sent.map((s) => s.req.label.split(" [")[0]));
  const writesAccepted = sent.filter((s) => s.req.method !== "GET" && s.status !== null && s.status < 400);
  console.log(`fuzz as ${who}: seed ${seed} (FUZZ_SEED=${SEED}), ${sent.length} requests over ${covered.size} routes: ${[...byClass].map(([k, n]) => `${k} ${n}`).join(", ")}; writes not refused: ${writesAccepted.length}`);
  for (const s of writesAccepted.slice(0, 20)) console.log(`  not refused: ${describe(s)}`);
}


for (const [i, who] of (["admin", "engineer"] as const).entries()) {
  test(`fuzzed requests as ${who}: every one answered, none 5xx, refused ones write nothing`, async () => {
    test.setTimeout(600_000);
    const seed = SEED + i;
    const { sent, wroteWhenRefused } = await fuzzAs(who, seed);
    report(who, seed, sent);
    expect(sent).toHaveLength(PER_USER);
    // Every route on disk was tried at least once.
    expect(new Set(sent.map((s) => `${s.req.method} ${s.req.label.split(" ")[1]}`)).size).toBe(new Set(routes.map((r) => `${r.method} ${r.template}`)).size);
    expect(sent.filter((s) => s.status === null).map(describe), "requests never answered").toEqual([]);
    expect(sent.filter((s) => s.status !== null && s.status >= 500).map(describe), "5xx answers").toEqual([]);
    expect(wroteWhenRefused, "rows written by refused requests").toEqual([]);
  });
}

// The cases testers reported, each with the answer it must get.
test("malformed path ids, query values and sign-in bodies get a 4xx in our error shape", async () => {
  const call = (who: Who, method: string, path: string, headers: Record<string, string> = {}, body?: string) => send(who, { label: `${method} ${path}`, method, path, headers, body });
  for (const path of ["/api/projects/%FF%FE", "/api/projects/%ED%A0%80", "/api/pins/%C0%AF/report.pdf", "/api/sweeps/%/scenarios/0/candidates"]) {
    const res = await call("admin", "GET", path);
    expect(res.status, path).toBe(404);
    expect(JSON.parse(res.body!).error.code, path).toBe("not_found");
  }
  const member = await call("admin", "PATCH", "/api/team/members/%00", { "Content-Type": "application/json" }, JSON.stringify({ role: "viewer" }));
  expect(member.status).toBe(404);

  const audit = await call("admin", "GET", "/api/audit?entityId=%00");
  expect(audit.status).toBe(400);
  expect(Object.keys(JSON.parse(audit.body!).error.fields)).toEqual(["entityId"]);
  const long = await call("admin", "GET", `/api/audit?entityType=${"a".repeat(10_000)}`);
  expect(long.status).toBe(400);

  for (const [type, body] of [["application/json", '{"email":"a@b.example"}'], ["text/plain", "hello"], ["multipart/form-data", "--x--"], [null, undefined]] as const) {
    // A body of another type is refused by the proxy (415 naming the body) before Auth.js reads
    // it; a request without a body reaches the sign-in check as an empty form (400 naming both fields).
    const [status, fields] = type ? [415, ["(body)"]] : [400, ["email", "password"]];
    const res = await call("admin", "POST", "/api/auth/callback/credentials", { ...(type ? { "Content-Type": type } : {}), "X-Auth-Return-Redirect": "1" }, body);
    expect(res.status, String(type)).toBe(status);
    expect(Object.keys(JSON.parse(res.body!).error.fields).sort(), String(type)).toEqual(fields);
    const link = await call("admin", "POST", "/api/auth/signin/nodemailer", { ...(type ? { "Content-Type": type } : {}), "X-Auth-Return-Redirect": "1" }, body);
    expect(link.status, String(type)).toBe(status);
  }
});

test("a NUL or a lone surrogate in stored text is refused naming the field, and nothing is written", async () => {
  const json = { "Content-Type": "application/json" };
  const before = await rowCounts(pool);
  const project = await send("admin", { label: "", method: "POST", path: "/api/projects", headers: json, body: JSON.stringify({ name: "Pilot\u0000plant", description: "" }) });
  expect(project.status).toBe(400);
  expect(JSON.parse(project.body!).error.fields.name[0]).toMatch(/control characters/);
  const token = await send("engineer", { label: "", method: "POST", path: "/api/tokens", headers: json, body: JSON.stringify({ name: "laptop \uD83D" }) });
  expect(token.status).toBe(400);
  expect(JSON.parse(token.body!).error.fields.name[0]).toMatch(/broken character/);
  const note = await send("admin", { label: "", method: "POST", path: "/api/inventory", headers: json, body: JSON.stringify({ tag: "R-900", type: "CSTR", volume: 2, note: "spare\u0000" }) });
  expect(Object.keys(JSON.parse(note.body!).error.fields)).toEqual(["note"]);
  expect(tablesGrown(before, await rowCounts(pool))).toEqual([]);
});
