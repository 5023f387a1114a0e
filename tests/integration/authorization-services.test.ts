import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inventoryVessels, kineticsModels, kineticsVersions, pinnedDesigns, rateDatasets, rateDatasetVersions } from "@/db/schema";
import { POLICY, type Actor } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import { listAuditEntries } from "@/lib/services/audit";
import { addDatasetVersion, createDataset, createTableKinetics, getDataset as getDatasetService, getDatasetVersion, listDatasets as listDatasetsService, previewDataset } from "@/lib/services/datasets";
import { createInvitation, listMembers, listOpenInvitations, revokeInvitation, updateMemberRole } from "@/lib/services/members";
import { createProject, getProjectById, listProjects, updateProject } from "@/lib/services/projects";
import { fitDatasetVersion, saveFitAsKinetics } from "@/lib/services/fits";
import { getDesignReport } from "@/lib/services/design-reports";
import { exportCandidates } from "@/lib/services/candidate-export";
import { DEMO_COST_BASIS } from "@/lib/demo/inventory";
import { getCostBasis, saveCostBasis } from "@/lib/services/costs";
import { createVessel, deleteVessel, getVessel, importInventory, listInventory, updateVessel } from "@/lib/services/inventory";
import { rateFixedTrain } from "@/lib/services/rating";
import { createCandidateRun, createPinRun, getRun, listCandidateRuns, listPinRuns } from "@/lib/services/robustness";
import { listReviewInbox } from "@/lib/services/reviews";
import type { TestDatabase } from "../helpers/test-db";
import { DEMO_USERS, type DemoPerson } from "../helpers/demo-people";
import { accessOutcome, demoActors, ESTER_PROJECT, projectIdNamed, seededTestDatabase } from "./helpers/demo-team";

type Who = DemoPerson;
type Outcome = "ok" | "forbidden" | "not_found";

let t: TestDatabase;
let actors: Record<Who, Actor>;
let engineersProject: string;
let managersProject: string;
let viewerId: string;
let datasetVersionId: string;
let demoPin: { id: string; sweepId: string; candidateId: string };
let vesselId: string;
let kineticsVersionId: string;
let candidateRunId: string;
const UNCERTAIN = { uncertain: [{ field: "reaction.rate.k" as const, kind: "plusMinus" as const, fraction: 0.2 }], samples: 20, seed: 1 };

beforeAll(async () => {
  t = await seededTestDatabase();
  actors = await demoActors(t.db);
  viewerId = actors.viewer.userId;
  engineersProject = await projectIdNamed(t.db, ESTER_PROJECT);
  [{ id: vesselId }] = await t.db.select({ id: inventoryVessels.id }).from(inventoryVessels).where(eq(inventoryVessels.tag, "R-302"));
  [{ id: kineticsVersionId }] = await t.db
    .select({ id: kineticsVersions.id })
    .from(kineticsVersions)
    .innerJoin(kineticsModels, eq(kineticsModels.id, kineticsVersions.modelId))
    .where(eq(kineticsModels.projectId, engineersProject));
  managersProject = (await createProject(t.db, actors.manager, { name: "Manager's own study", description: "" })).id;
  // A dataset version written straight to the tables (the upload is another feature's route).
  const [ds] = await t.db.insert(rateDatasets).values({ teamId: actors.engineer.teamId, projectId: engineersProject, name: "Matrix rates", createdBy: actors.engineer.userId }).returning();
  const rows = [100, 200, 300, 400, 500].map((c) => ({ concA: c, rate: 1e-3 * c }));
  const [dv] = await t.db.insert(rateDatasetVersions).values({ datasetId: ds.id, version: 1, fileName: "m.csv", format: "csv", mapping: {}, rows, rowCount: rows.length, createdBy: actors.engineer.userId }).returning();
  datasetVersionId = dv.id;
  const [pin] = await t.db.select().from(pinnedDesigns).where(eq(pinnedDesigns.projectId, engineersProject));
  demoPin = { id: pin.id, sweepId: pin.sweepId!, candidateId: pin.candidateId! };
  candidateRunId = (await createCandidateRun(t.db, actors.engineer, demoPin.candidateId, UNCERTAIN)).id;
});
afterAll(() => t.drop());


// Every service operation behind a route handler, with the outcome each actor must get.
// "otherTeam" is an admin of another team acting on this team's records.
const MATRIX: { name: string; run: (a: Actor) => Promise<unknown>; expect: Record<Who, Outcome> }[] = [
  { name: "list projects", run: (a) => listProjects(t.db, a), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "ok", otherTeam: "ok" } },
  { name: "read a project", run: (a) => getProjectById(t.db, a, engineersProject), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "ok", otherTeam: "not_found" } },
  { name: "create a project", run: (a) => createProject(t.db, a, { name: `By ${a.role} ${Math.random()}`, description: "" }), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "ok" } },
  { name: "rename the engineer's project", run: (a) => updateProject(t.db, a, engineersProject, { name: "Ester line 3 revamp" }), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  { name: "rename the manager's project", run: (a) => updateProject(t.db, a, managersProject, { name: "Manager's own study" }), expect: { admin: "ok", manager: "ok", engineer: "forbidden", viewer: "forbidden", otherTeam: "not_found" } },
  {
    name: "archive and restore the engineer's project",
    run: async (a) => {
      await updateProject(t.db, a, engineersProject, { archived: true });
      await updateProject(t.db, a, engineersProject, { archived: false });
    },
    expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" },
  },
  { name: "list members", run: (a) => listMembers(t.db, a), expect: { admin: "ok", manager: "forbidden", engineer: "forbidden", viewer: "forbidden", otherTeam: "ok" } },
  { name: "change a member's role", run: (a) => updateMemberRole(t.db, a, viewerId, "viewer"), expect: { admin: "ok", manager: "forbidden", engineer: "forbidden", viewer: "forbidden", otherTeam: "not_found" } },
  { name: "list invitations", run: (a) => listOpenInvitations(t.db, a), expect: { admin: "ok", manager: "forbidden", engineer: "forbidden", viewer: "forbidden", otherTeam: "ok" } },
  { name: "fit rate laws to a dataset version", run: (a) => fitDatasetVersion(t.db, a, datasetVersionId, { laws: ["power"] }), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  {
    name: "save a fit as kinetics",
    run: (a) => saveFitAsKinetics(t.db, a, datasetVersionId, { law: "power", modelName: `Fit by ${a.role} ${Math.random()}`, feed: { flowA: 0.1, concA: 1000 }, note: "" }),
    expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" },
  },
  { name: "list the designs waiting for review", run: (a) => listReviewInbox(t.db, a), expect: { admin: "ok", manager: "ok", engineer: "forbidden", viewer: "forbidden", otherTeam: "ok" } },
  { name: "read the design report of a proposed pin", run: (a) => getDesignReport(t.db, a, demoPin.id), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "not_found", otherTeam: "not_found" } },
  { name: "export a scenario's candidates", run: (a) => exportCandidates(t.db, a, demoPin.sweepId, 0, { sort: "rank", dir: "asc" }), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  // Robustness runs: a candidate's follow sweep.read; the demo pin is proposed, so hidden from viewers.
  { name: "rate a candidate under uncertainty", run: (a) => createCandidateRun(t.db, a, demoPin.candidateId, UNCERTAIN), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  { name: "list a candidate's robustness runs", run: (a) => listCandidateRuns(t.db, a, demoPin.candidateId), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  { name: "rate a pinned design under uncertainty", run: (a) => createPinRun(t.db, a, demoPin.id, UNCERTAIN), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "not_found", otherTeam: "not_found" } },
  { name: "list a pinned design's robustness runs", run: (a) => listPinRuns(t.db, a, demoPin.id), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "not_found", otherTeam: "not_found" } },
  { name: "read a candidate's robustness run", run: (a) => getRun(t.db, a, candidateRunId), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  { name: "read the audit trail", run: (a) => listAuditEntries(t.db, a), expect: { admin: "ok", manager: "ok", engineer: "forbidden", viewer: "forbidden", otherTeam: "ok" } },
  // Cost basis, inventory and rating (GET/PUT /api/projects/:id/costs, /api/inventory…, POST /api/projects/:id/rate).
  { name: "read a project's cost basis", run: (a) => getCostBasis(t.db, a, engineersProject), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "ok", otherTeam: "not_found" } },
  { name: "save a project's cost basis", run: (a) => saveCostBasis(t.db, a, engineersProject, DEMO_COST_BASIS), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  { name: "list the inventory", run: (a) => listInventory(t.db, a), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "ok", otherTeam: "ok" } },
  { name: "read an inventory vessel", run: (a) => getVessel(t.db, a, vesselId), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "ok", otherTeam: "not_found" } },
  {
    name: "add an inventory vessel",
    run: (a) => createVessel(t.db, a, { tag: `X-${a.role}-${Math.random()}`, type: "CSTR", volume: 1, available: true, reuseCost: 0, location: "", note: "" }),
    expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "ok" },
  },
  { name: "change an inventory vessel", run: (a) => updateVessel(t.db, a, vesselId, { available: true }), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  {
    name: "remove an inventory vessel",
    run: async (a) => {
      const v = await createVessel(t.db, actors.admin, { tag: `D-${a.role}-${Math.random()}`, type: "PFR", volume: 1, available: true, reuseCost: 0, location: "", note: "" });
      await deleteVessel(t.db, a, v.id);
    },
    expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" },
  },
  {
    name: "preview an inventory file",
    run: (a) => importInventory(t.db, a, { name: "v.csv", data: new TextEncoder().encode("tag,type,volume\nP-1,CSTR,1\n").buffer as ArrayBuffer }, false),
    expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "ok" },
  },
  {
    name: "rate a fixed train",
    run: (a) => rateFixedTrain(t.db, a, engineersProject, { kineticsVersionId, stages: [{ type: "CSTR", volume: 0.01 }], target: 0.5 }),
    expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" },
  },
];

describe("authorisation matrix over the services", () => {
  for (const row of MATRIX) {
    for (const who of Object.keys(DEMO_USERS) as Who[]) {
      it(`${row.name} as ${who} → ${row.expect[who]}`, async () => {
        expect(await accessOutcome(() => row.run(actors[who]))).toBe(row.expect[who]);
      });
    }
  }

  it("archiving a project of someone else needs more than the engineer role", async () => {
    expect(await accessOutcome(() => updateProject(t.db, actors.engineer, managersProject, { archived: true }))).toBe("forbidden");
    expect(await accessOutcome(() => updateProject(t.db, actors.viewer, engineersProject, { archived: true }))).toBe("forbidden");
  });

  it("another team's listings never include this team's records", async () => {
    const theirs = await listProjects(t.db, actors.otherTeam, { includeArchived: true });
    expect(theirs.map((p) => p.id)).not.toContain(engineersProject);
    const members = await listMembers(t.db, actors.otherTeam);
    expect(members.map((m) => m.email)).toEqual([DEMO_USERS.otherTeam]);
    const audit = await listAuditEntries(t.db, actors.otherTeam);
    expect(audit.every((e) => e.entityId !== engineersProject)).toBe(true);
  });

  it("the review inbox holds the team's waiting pins, oldest first, and never another team's", async () => {
    // The seeded demo pin is proposed by the engineer: it waits for the manager, not for its author.
    const mine = await listReviewInbox(t.db, actors.manager);
    expect(mine.map((r) => r.pinId)).toContain(demoPin.id);
    const times = mine.map((r) => r.pinnedAt.getTime());
    expect(times).toEqual([...times].sort((a, b) => a - b));
    const theirs = await listReviewInbox(t.db, actors.otherTeam);
    expect(theirs.map((r) => r.pinId)).not.toContain(demoPin.id);
    expect(theirs.every((r) => r.projectId !== engineersProject)).toBe(true);
  });

  it("a second project of the same name, in any case or spacing, is refused naming Project name", async () => {
    const first = await createProject(t.db, actors.engineer, { name: "Glycol  Dehydration Study", description: "" });
    const err = await createProject(t.db, actors.engineer, { name: " glycol dehydration study ", description: "" }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).code).toBe("conflict");
    expect((err as AppError).message).toContain("Project name");
    expect((err as AppError).fields?.name?.[0]).toBe(`A project named ${first.name} already exists`);
    const renamed = await updateProject(t.db, actors.engineer, engineersProject, { name: "GLYCOL DEHYDRATION STUDY" }).catch((e: unknown) => e);
    expect(renamed).toBeInstanceOf(AppError);
    expect((renamed as AppError).code).toBe("conflict");
    // Another team may use the name.
    expect(await accessOutcome(() => createProject(t.db, actors.otherTeam, { name: "Glycol Dehydration Study", description: "" }))).toBe("ok");
  });

  it("invitations: only admins create and revoke, only in their own team", async () => {
    for (const who of ["manager", "engineer", "viewer"] as const) {
      expect(await accessOutcome(() => createInvitation(t.db, actors[who], { email: `x-${who}@new.example`, role: "viewer" }))).toBe("forbidden");
    }
    const inv = await createInvitation(t.db, actors.admin, { email: "new.colleague@brightwater.example", role: "engineer" });
    expect(await accessOutcome(() => revokeInvitation(t.db, actors.otherTeam, inv.id))).toBe("not_found");
    expect(await accessOutcome(() => revokeInvitation(t.db, actors.manager, inv.id))).toBe("forbidden");
    expect(await accessOutcome(() => revokeInvitation(t.db, actors.admin, inv.id))).toBe("ok");
  });

  it("the policy table covers every action with at least one role", () => {
    for (const [action, roles] of Object.entries(POLICY)) expect(roles.length, action).toBeGreaterThan(0);
  });
});

describe("authorisation matrix over the rate-data services", () => {
  const file = (name: string) => ({ fileName: name, format: "csv" as const, bytes: new TextEncoder().encode("X,rate\n0,2\n0.5,1\n"), mapping: { columns: { X: "conversion" as const, rate: "rate" as const }, units: {} } });
  const demo = async () => {
    const [d] = await listDatasetsService(t.db, actors.engineer, engineersProject);
    const dataset = await getDatasetService(t.db, actors.engineer, d.id);
    return { datasetId: d.id, versionId: dataset.versions[0].id };
  };
  const DATASET_MATRIX: { name: string; run: (a: Actor) => Promise<unknown> }[] = [
    { name: "list rate datasets", run: (a) => listDatasetsService(t.db, a, engineersProject) },
    { name: "read a rate dataset", run: async (a) => getDatasetService(t.db, a, (await demo()).datasetId) },
    { name: "read a dataset version", run: async (a) => getDatasetVersion(t.db, a, (await demo()).versionId) },
    { name: "preview an upload", run: (a) => previewDataset(t.db, a, engineersProject, file("p.csv")) },
    { name: "create a rate dataset", run: (a) => createDataset(t.db, a, engineersProject, { name: `By ${a.role} ${Math.random()}`, upload: file("c.csv"), note: "" }) },
    { name: "add a dataset version", run: async (a) => addDatasetVersion(t.db, a, (await demo()).datasetId, { upload: file("v.csv"), note: "" }) },
    {
      name: "use a dataset version as a measured rate table",
      run: async (a) => createTableKinetics(t.db, a, (await demo()).versionId, { modelName: `Table by ${a.role} ${Math.random()}`, feed: { flowA: 0.02, concA: 1000, temperature: 340.15 } }),
    },
  ];
  const expected: Record<Who, Outcome> = { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" };
  for (const row of DATASET_MATRIX) {
    for (const who of Object.keys(DEMO_USERS) as Who[]) {
      it(`${row.name} as ${who} → ${expected[who]}`, async () => {
        expect(await accessOutcome(() => row.run(actors[who]))).toBe(expected[who]);
      });
    }
  }
});
