import { expect, test, type APIRequestContext } from "@playwright/test";
import { signedInContext } from "./fixtures";

let admin: APIRequestContext;
let projectId: string;
test.beforeAll(async () => {
  admin = await signedInContext("admin");
  const res = await admin.get("/api/projects");
  projectId = ((await res.json()) as { projects: { id: string }[] }).projects[0].id;
});
test.afterAll(() => admin.dispose());

// Malformed bodies: each answered 400 with the offending fields named, never a 500.
const CASES: { name: string; method: "post" | "patch"; path: () => string; body: string | object; fields: string[] }[] = [
  { name: "project without a name", method: "post", path: () => "/api/projects", body: { description: "x" }, fields: ["name"] },
  { name: "project name of one letter", method: "post", path: () => "/api/projects", body: { name: "A" }, fields: ["name"] },
  { name: "project body that is not JSON", method: "post", path: () => "/api/projects", body: "{name: oops", fields: ["(body)"] },
  { name: "project name of the wrong type", method: "post", path: () => "/api/projects", body: { name: 42 }, fields: ["name"] },
  { name: "project update with nothing to change", method: "patch", path: () => `/api/projects/${projectId}`, body: {}, fields: ["(body)"] },
  { name: "project update with an unknown key", method: "patch", path: () => `/api/projects/${projectId}`, body: { colour: "red" }, fields: ["(body)"] },
  { name: "archived as a string", method: "patch", path: () => `/api/projects/${projectId}`, body: { archived: "yes" }, fields: ["archived"] },
  { name: "invitation with a bad address and role", method: "post", path: () => "/api/team/invitations", body: { email: "nope", role: "owner" }, fields: ["email", "role"] },
  { name: "role change to an unknown role", method: "patch", path: () => "/api/team/members/anyone", body: { role: "boss" }, fields: ["role"] },
  { name: "team switch with a non-uuid", method: "post", path: () => "/api/me/team", body: { teamId: "7" }, fields: ["teamId"] },
  { name: "invitation accept with a short password", method: "post", path: () => "/api/invitations/accept", body: { token: "t".repeat(40), name: "Al Li", password: "short" }, fields: ["password"] },
];

for (const c of CASES) {
  test(`400 for ${c.name}`, async () => {
    const res = await admin[c.method](c.path(), typeof c.body === "string" ? { data: c.body, headers: { "content-type": "application/json" } } : { data: c.body });
    expect(res.status()).toBe(400);
    const body = (await res.json()) as { error: { code: string; fields: Record<string, string[]> } };
    expect(body.error.code).toBe("bad_request");
    for (const f of c.fields) expect(Object.keys(body.error.fields)).toContain(f);
    // the sentence a person reads names fields by label, never by key or dotted path
    expect((body.error as unknown as { message: string }).message).not.toMatch(/\b[a-z]+[A-Z]\w*\b|\w+\.\d+\.\w+/);
  });
}

test("sign-in forms with missing fields get 400 naming them", async () => {
  const anon = await signedInContext("anonymous");
  const { csrfToken } = (await (await anon.get("/api/auth/csrf")).json()) as { csrfToken: string };
  const res = await anon.post("/api/auth/callback/credentials", { form: { csrfToken }, headers: { "X-Auth-Return-Redirect": "1" } });
  expect(res.status()).toBe(400);
  const body = (await res.json()) as { error: { fields: Record<string, string[]> } };
  expect(Object.keys(body.error.fields).sort()).toEqual(["email", "password"]);
  await anon.dispose();
});

test("a refused change writes nothing", async () => {
  const before = await (await admin.get(`/api/projects/${projectId}`)).json();
  const res = await admin.patch(`/api/projects/${projectId}`, { data: { name: "", archived: true } });
  expect(res.status()).toBe(400);
  expect(await (await admin.get(`/api/projects/${projectId}`)).json()).toEqual(before);
});
