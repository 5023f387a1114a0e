import { expect, test, type APIRequestContext, type APIResponse } from "@playwright/test";
import { signedInContext, USERS, type Who } from "./fixtures";
import { createModel, submitSweep, waitForSweep, type CandidatePage } from "./sweep-fixtures";
import { insertDatasetVersion } from "./dataset-fixtures";

type Caller = Who | "anonymous";
const CALLERS: Caller[] = ["admin", "manager", "engineer", "viewer", "otherTeam", "anonymous"];

const ctx = {} as Record<Caller, APIRequestContext>;
const ids = { project: "", managerProject: "", viewer: "", kestrelTeam: "", brightwaterTeam: "", model: "", version: "", sweep: "", candidates: [] as string[], pin: "", datasetVersion: "" };

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

  const { model, version } = await createModel(ctx.engineer, ids.project, "Matrix kinetics");
  ids.model = model.id;
  ids.version = version.id;
  const sweep = await submitSweep(ctx.engineer, ids.project, version.id, [], 2);
  ids.sweep = sweep.id;
  expect((await waitForSweep(ctx.engineer, sweep.id)).status).toBe("succeeded");
  const page = (await (await ctx.engineer.get(`/api/sweeps/${sweep.id}/scenarios/0/candidates`)).json()) as CandidatePage;
  ids.candidates = page.items.map((c) => c.id);
  ids.pin = await newPinId();
  const rows = [100, 200, 300, 400, 500].map((c) => ({ concA: c, rate: 1e-3 * c }));
  ids.datasetVersion = (await insertDatasetVersion({ email: USERS.engineer, projectName: "Ester line 3 revamp", name: "Matrix rates", rows })).versionId;
});

async function newPinId(): Promise<string> {
  const res = await ctx.engineer.post(`/api/candidates/${ids.candidates[0]}/pin`, { data: { note: "matrix" } });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { pin: { id: string } }).pin.id;
}

const ROBUSTNESS = { uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction: 0.2 }], samples: 50, seed: 1 };

async function newRunId(): Promise<string> {
  const res = await ctx.engineer.post(`/api/candidates/${ids.candidates[0]}/robustness`, { data: ROBUSTNESS });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { run: { id: string } }).run.id;
}

async function newEngineerTokenId(): Promise<string> {
  const res = await ctx.engineer.post("/api/tokens", { data: { name: "matrix" } });
  return ((await res.json()) as { token: { id: string } }).token.id;
}

const SPEC = { feed: { flowA: 0.02, concA: 1000 }, reaction: { rate: { law: "power", k: 0.001, orders: { A: 1 } } } };
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
  { route: "GET /api/me/display-units", call: (c) => c.get("/api/me/display-units"), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 200, anonymous: 401 } },
  {
    // Each user sets only their own choice; "as-typed" is the default, so other specs see no change.
    route: "PUT /api/me/display-units",
    call: (c) => c.put("/api/me/display-units", { data: { displayUnits: "as-typed" } }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 200, anonymous: 401 },
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
  { route: "GET /api/projects/:id/kinetics", call: (c) => c.get(`/api/projects/${ids.project}/kinetics`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 } },
  {
    route: "POST /api/projects/:id/kinetics",
    call: (c) => c.post(`/api/projects/${ids.project}/kinetics`, { data: { name: `Matrix ${Math.random()}`, spec: SPEC } }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/kinetics/:id", call: (c) => c.get(`/api/kinetics/${ids.model}`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 } },
  {
    route: "POST /api/kinetics/:id/versions",
    call: (c) => c.post(`/api/kinetics/${ids.model}/versions`, { data: { spec: SPEC, note: "matrix" } }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/kinetics/preview",
    call: (c) => c.post("/api/kinetics/preview", { data: { spec: SPEC } }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 200, anonymous: 401 },
  },
  {
    route: "POST /api/dataset-versions/:id/fits",
    call: (c) => c.post(`/api/dataset-versions/${ids.datasetVersion}/fits`, { data: { laws: ["power"] } }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/dataset-versions/:id/kinetics",
    call: (c) => c.post(`/api/dataset-versions/${ids.datasetVersion}/kinetics`, { data: { law: "power", modelName: `Fit ${Math.random()}`, feed: { flowA: 0.1, concA: 1000 } } }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/projects/:id/sweeps", call: (c) => c.get(`/api/projects/${ids.project}/sweeps`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 } },
  {
    route: "POST /api/projects/:id/sweeps",
    call: (c) => c.post(`/api/projects/${ids.project}/sweeps`, { data: { kineticsVersionId: ids.version, target: { conversion: 0.8 }, train: { maxStages: 1 } } }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/sweeps/:id", call: (c) => c.get(`/api/sweeps/${ids.sweep}`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 } },
  {
    route: "POST /api/sweeps/:id/cancel (a finished sweep: allowed callers hear it is too late)",
    call: (c) => c.post(`/api/sweeps/${ids.sweep}/cancel`),
    expect: { admin: 409, manager: 409, engineer: 409, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "POST /api/sweeps/:id/rerun", call: (c) => c.post(`/api/sweeps/${ids.sweep}/rerun`), expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 } },
  { route: "GET /api/sweeps/:id/scenarios", call: (c) => c.get(`/api/sweeps/${ids.sweep}/scenarios`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 } },
  {
    route: "GET /api/sweeps/:id/scenarios/:index/candidates",
    call: (c) => c.get(`/api/sweeps/${ids.sweep}/scenarios/0/candidates?sort=totalVolume`),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "GET /api/candidates/compare",
    call: (c) => c.get(`/api/candidates/compare?ids=${ids.candidates.slice(0, 2).join(",")}`),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "GET /api/candidates/:id",
    call: (c) => c.get(`/api/candidates/${ids.candidates[0]}`),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/candidates/:id/pin",
    call: (c) => c.post(`/api/candidates/${ids.candidates[1]}/pin`, { data: { note: "matrix" } }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/reviews", call: (c) => c.get("/api/reviews"), expect: { admin: 200, manager: 200, engineer: 403, viewer: 403, otherTeam: 200, anonymous: 401 } },
  { route: "GET /api/projects/:id/pins", call: (c) => c.get(`/api/projects/${ids.project}/pins`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 404, anonymous: 401 } },
  {
    route: "GET /api/pins/:id (a proposed pin: hidden from viewers)",
    call: (c) => c.get(`/api/pins/${ids.pin}`),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 404, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/pins/:id/review (a fresh pin each time)",
    call: async (c) => c.post(`/api/pins/${await newPinId()}/review`, { data: { decision: "approve", comment: "within the envelope" } }),
    expect: { admin: 200, manager: 200, engineer: 403, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  ...["report.pdf", "export.json", "export.csv"].map((file) => ({
    route: `GET /api/pins/:id/${file} (a proposed pin: hidden from viewers)`,
    call: (c: APIRequestContext) => c.get(`/api/pins/${ids.pin}/${file}`),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 404, otherTeam: 404, anonymous: 401 },
  })),
  {
    route: "GET /api/sweeps/:id/scenarios/:index/candidates/export",
    call: (c) => c.get(`/api/sweeps/${ids.sweep}/scenarios/0/candidates/export?format=csv`),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/candidates/:id/robustness",
    call: (c) => c.post(`/api/candidates/${ids.candidates[0]}/robustness`, { data: ROBUSTNESS }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "GET /api/candidates/:id/robustness",
    call: (c) => c.get(`/api/candidates/${ids.candidates[0]}/robustness`),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/pins/:id/robustness (a proposed pin: hidden from viewers)",
    call: (c) => c.post(`/api/pins/${ids.pin}/robustness`, { data: ROBUSTNESS }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 404, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "GET /api/pins/:id/robustness",
    call: (c) => c.get(`/api/pins/${ids.pin}/robustness`),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 404, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "GET /api/robustness/:id (a candidate's run)",
    call: async (c) => c.get(`/api/robustness/${await newRunId()}`),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/tokens", call: (c) => c.get("/api/tokens"), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 200, anonymous: 401 } },
  { route: "POST /api/tokens", call: (c) => c.post("/api/tokens", { data: { name: "matrix" } }), expect: { admin: 201, manager: 201, engineer: 201, viewer: 201, otherTeam: 201, anonymous: 401 } },
  {
    route: "DELETE /api/tokens/:id (the engineer's token)",
    call: async (c) => c.delete(`/api/tokens/${await newEngineerTokenId()}`),
    expect: { admin: 404, manager: 404, engineer: 204, viewer: 404, otherTeam: 404, anonymous: 401 },
  },
  // Cost basis, inventory and rating.
  { route: "GET /api/projects/:id/costs", call: (c) => c.get(`/api/projects/${ids.project}/costs`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 404, anonymous: 401 } },
  {
    route: "PUT /api/projects/:id/costs (the basis as it is)",
    call: async (c) => c.put(`/api/projects/${ids.project}/costs`, { data: await currentCostBasis() }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/projects/:id/rate",
    call: (c) => c.post(`/api/projects/${ids.project}/rate`, { data: { kineticsVersionId: ids.version, stages: [{ type: "CSTR", volume: "10 L" }], target: 0.5 } }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/inventory", call: (c) => c.get("/api/inventory"), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 200, anonymous: 401 } },
  {
    route: "POST /api/inventory",
    call: (c) => c.post("/api/inventory", { data: { tag: `M-${Math.random().toString(36).slice(2)}`, type: "CSTR", volume: 1, available: false } }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 201, anonymous: 401 },
  },
  { route: "GET /api/inventory/:id", call: async (c) => c.get(`/api/inventory/${await demoVesselId()}`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 200, otherTeam: 404, anonymous: 401 } },
  {
    route: "PATCH /api/inventory/:id",
    call: async (c) => c.patch(`/api/inventory/${await demoVesselId()}`, { data: { available: true } }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "DELETE /api/inventory/:id (a fresh vessel each time)",
    call: async (c) => c.delete(`/api/inventory/${await newVesselId()}`),
    expect: { admin: 204, manager: 204, engineer: 204, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/inventory/import (preview)",
    call: (c) => c.post("/api/inventory/import", { multipart: { file: { name: "v.csv", mimeType: "text/csv", buffer: Buffer.from("tag,type,volume\nP-1,CSTR,1\n") }, accept: "false" } }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 200, anonymous: 401 },
  },
  { route: "GET /api/projects/:id/datasets", call: (c) => c.get(`/api/projects/${ids.project}/datasets`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 } },
  {
    route: "POST /api/projects/:id/datasets/preview",
    call: (c) => c.post(`/api/projects/${ids.project}/datasets/preview`, { multipart: uploadForm() }),
    expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  {
    route: "POST /api/projects/:id/datasets",
    call: (c) => c.post(`/api/projects/${ids.project}/datasets`, { multipart: { ...uploadForm(), name: `Matrix ${Math.random()}` } }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/datasets/:id", call: async (c) => c.get(`/api/datasets/${(await demoDataset()).datasetId}`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 } },
  {
    route: "POST /api/datasets/:id/versions",
    call: async (c) => c.post(`/api/datasets/${(await demoDataset()).datasetId}/versions`, { multipart: uploadForm() }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
  { route: "GET /api/dataset-versions/:id", call: async (c) => c.get(`/api/dataset-versions/${(await demoDataset()).versionId}`), expect: { admin: 200, manager: 200, engineer: 200, viewer: 403, otherTeam: 404, anonymous: 401 } },
  {
    route: "POST /api/dataset-versions/:id/table-kinetics",
    call: async (c) => c.post(`/api/dataset-versions/${(await demoDataset()).versionId}/table-kinetics`, { data: { modelName: `Matrix table ${Math.random()}`, feed: { flowA: 0.02, concA: 1000, temperature: 340.15 } } }),
    expect: { admin: 201, manager: 201, engineer: 201, viewer: 403, otherTeam: 404, anonymous: 401 },
  },
];

/** A small clean CSV upload with its mapping, as the upload screen sends it. */
function uploadForm() {
  return {
    file: { name: "matrix.csv", mimeType: "text/csv", buffer: Buffer.from("X,rate\n0,2\n0.5,1\n") },
    mapping: JSON.stringify({ columns: { X: "conversion", rate: "rate" }, units: { rate: "mol/(m3 s)" } }),
  };
}

let demoIds: { datasetId: string; versionId: string } | null = null;
/** The seeded single-temperature demo dataset (its latest version starts at X = 0). */
async function demoDataset() {
  if (demoIds) return demoIds;
  const list = (await (await ctx.engineer.get(`/api/projects/${ids.project}/datasets`)).json()) as { datasets: { id: string; name: string }[] };
  const d = list.datasets.find((x) => x.name.startsWith("Bench runs at 67"))!;
  const dataset = (await (await ctx.engineer.get(`/api/datasets/${d.id}`)).json()) as { dataset: { versions: { id: string; version: number }[] } };
  demoIds = { datasetId: d.id, versionId: dataset.dataset.versions.find((v) => v.version === 1)!.id };
  return demoIds;
}

async function currentCostBasis(): Promise<unknown> {
  return ((await (await ctx.engineer.get(`/api/projects/${ids.project}/costs`)).json()) as { costs: { basis: unknown } }).costs.basis;
}

async function demoVesselId(): Promise<string> {
  const list = (await (await ctx.engineer.get("/api/inventory")).json()) as { vessels: { id: string; tag: string }[] };
  return list.vessels.find((v) => v.tag === "R-302")!.id;
}

// Matrix vessels are marked unavailable, so the ones a refused delete leaves behind never
// enter another spec's sweep with reuse.
async function newVesselId(): Promise<string> {
  const res = await ctx.engineer.post("/api/inventory", { data: { tag: `DEL-${Math.random().toString(36).slice(2)}`, type: "PFR", volume: 0.5, available: false } });
  return ((await res.json()) as { vessel: { id: string } }).vessel.id;
}

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
