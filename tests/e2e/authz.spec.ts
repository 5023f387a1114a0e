import { expect, test, type APIRequestContext, type APIResponse } from "@playwright/test";
import { signedInContext, USERS, type Who } from "./fixtures";

type Caller = Who | "anonymous";
const CALLERS: Caller[] = ["admin", "manager", "engineer", "viewer", "otherTeam", "anonymous"];

const ctx = {} as Record<Caller, APIRequestContext>;
const ids = { project: "", managerProject: "", viewer: "", kestrelTeam: "", brightwaterTeam: "" };

test.beforeAll(async () => {
  for (const c of CALLERS) ctx[c] = await signedInContext(c);
  const projects = (await (await ctx.engineer.get("/api/projects")).json()) as { projects: { id: string; name: string }[] };
  ids.project = projects.projects.find((p) => p.name === "Ester line 3 revamp")!.id;
  const created = await ctx.manager.post("/api/projects", { data: { name: "Matrix check (manager's)", description: "" } });
  ids.managerProject = ((await created.json()) as { project: { id: string } }).project.id;
  const members = (await (await ctx.admin.get("/api/team/members")).json()) as { members: { userId: string; email: string }[] };
  ids.viewer = members.members.find((m) => m.email === USERS.viewer)!.userId;
  ids.brightwaterTeam = ((await (await ctx.admin.get("/api/me")).json()) as { team: { id: string } }).team.id;
  ids.kestrelTeam = ((await (await ctx.otherTeam.get("/api/me")).json()) as { team: { id: string } }).team.id;
});
test.afterAll(async () => {
  for (const c of CALLERS) await ctx[c].dispose();
});

async function newInvitationId(): Promise<string> {
  const res = await ctx.admin.post("/api/team/invitations", { data: { email: `matrix-${Date.now()}-${Math.random().toString(36).slice(2)}@brightwater.example`, role: "viewer" } });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { invitation: { id: string } }).invitation.id;
}

interface Row {
  route: string;
  call: (c: APIRequestContext) => Promise<APIResponse>;
  expect: Record<Caller, number>;
}

// Every route handler of the app, as every kind of caller. "otherTeam" is an admin of
// another team using this team's ids: always 404, never the data.
const ROWS: Row[] = [
  { route: "GET /api/health", call: (c) => c.get("/api/health"), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 200, anonymous: 200 } },
  { route: "GET /api/me", call: (c) => c.get("/api/me"), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 200, anonymous: 401 } },
  {
    route: "POST /api/me/team (a team of Brightwater)",
    call: (c) => c.post("/api/me/team", { data: { teamId: ids.brightwaterTeam } }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/projects", call: (c) => c.get("/api/projects"), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 200, anonymous: 401 } },
  {
    route: "POST /api/projects",
    call: (c) => c.post("/api/projects", { data: { name: `Matrix ${Math.random()}`, description: "" } }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 201, anonymous: 401 },
  },
  { route: "GET /api/projects/:id", call: (c) => c.get(`/api/projects/${ids.project}`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 404, anonymous: 401 } },
  {
    route: "PATCH /api/projects/:id (engineer's project)",
    call: (c) => c.patch(`/api/projects/${ids.project}`, { data: { name: "Ester line 3 revamp" } }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "PATCH /api/projects/:id (manager's project)",
    call: (c) => c.patch(`/api/projects/${ids.managerProject}`, { data: { description: "checked" } }),
    expect: { admin: 200, manager: 200, engineer: 403, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/team/members", call: (c) => c.get("/api/team/members"), expect: { admin: 200, manager: 403, engineer: 403, viewer: 403, otherTeam: 200, anonymous: 401 } },
  {
    route: "PATCH /api/team/members/:userId",
    call: (c) => c.patch(`/api/team/members/${ids.viewer}`, { data: { role: "viewer" } }),
    expect: { admin: 200, manager: 403, engineer: 403, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "DELETE /api/team/members/:userId (refusals only; removal is tested with an invited member)",
    call: (c) => c.delete(`/api/team/members/${ids.viewer}`),
    expect: { admin: 0, manager: 403, engineer: 403, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/team/invitations", call: (c) => c.get("/api/team/invitations"), expect: { admin: 200, manager: 403, engineer: 403, viewer: 403, otherTeam: 200, anonymous: 401 } },
  {
    route: "POST /api/team/invitations",
    call: (c) => c.post("/api/team/invitations", { data: { email: `m-${Math.random().toString(36).slice(2)}@brightwater.example`, role: "viewer" } }),
    expect: { admin: 201, manager: 403, engineer: 403, viewer: 403, otherTeam: 201, anonymous: 401 },
  },
  {
    route: "DELETE /api/team/invitations/:id",
    call: async (c) => c.delete(`/api/team/invitations/${await newInvitationId()}`),
    expect: { admin: 204, manager: 403, engineer: 403, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/invitations/accept (unknown token)",
    call: (c) => c.post("/api/invitations/accept", { data: { token: "x".repeat(43), name: "Nobody", password: "long-enough-pw" } }),
    expect: { admin: 404, manager: 404, engineer: 404, viewer: 404, otherTeam: 404, anonymous: 404 },
  },
  { route: "GET /api/audit", call: (c) => c.get("/api/audit"), expect: { admin: 200, manager: 200, engineer: 403, viewer: 403, otherTeam: 200, anonymous: 401 } },
];

for (const row of ROWS) {
  for (const caller of CALLERS) {
    const status = row.expect[caller];
    if (status === 0) continue;
    test(`${row.route} as ${caller} → ${status}`, async () => {
      const res = await row.call(ctx[caller]);
      expect(res.status()).toBe(status);
      if (status >= 400) {
        const body = (await res.json()) as Record<string, unknown>;
        // A refusal carries an error and nothing else: no data leaks beside it.
        expect(Object.keys(body)).toEqual(["error"]);
      }
    });
  }
}

test("another team's listings hold none of this team's records", async () => {
  const body = JSON.stringify(await (await ctx.otherTeam.get("/api/projects?archived=include")).json());
  expect(body).not.toContain(ids.project);
  expect(body).not.toContain("Ester line");
  const audit = JSON.stringify(await (await ctx.otherTeam.get("/api/audit")).json());
  expect(audit).not.toContain(ids.project);
  const members = JSON.stringify(await (await ctx.otherTeam.get("/api/team/members")).json());
  expect(members).not.toContain("brightwater");
});

test("pages refuse signed-out visitors and hide other teams' projects", async ({ page }) => {
  for (const path of ["/", "/team", `/projects/${ids.project}`]) {
    await page.goto(path);
    await expect(page, path).toHaveURL(/\/signin/);
  }
  const other = ctx.otherTeam;
  const res = await other.get(`/projects/${ids.project}`);
  expect(res.status()).toBe(404);
  expect(await res.text()).not.toContain("Ester line");
});
