import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemoData } from "@/db/seed";
import { projects, users } from "@/db/schema";
import { loadActor } from "@/lib/authz/actor";
import { POLICY, type Actor } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import { listAuditEntries } from "@/lib/services/audit";
import { createInvitation, listMembers, listOpenInvitations, revokeInvitation, updateMemberRole } from "@/lib/services/members";
import { createProject, getProjectById, listProjects, updateProject } from "@/lib/services/projects";
import { DEMO_COST_BASIS } from "@/db/seed-inventory";
import { inventoryVessels } from "@/db/schema-design-basis";
import { kineticsModels, kineticsVersions } from "@/db/schema-sweeps";
import { getCostBasis, saveCostBasis } from "@/lib/services/costs";
import { createVessel, deleteVessel, getVessel, importInventory, listInventory, updateVessel } from "@/lib/services/inventory";
import { rateFixedTrain } from "@/lib/services/rating";
import { createTestDatabase, type TestDatabase } from "../helpers/test-db";

type Who = "admin" | "manager" | "engineer" | "viewer" | "otherTeam";
type Outcome = "ok" | "forbidden" | "not_found";

const EMAILS: Record<Who, string> = {
  admin: "ada.admin@brightwater.example",
  manager: "marta.manager@brightwater.example",
  engineer: "eli.engineer@brightwater.example",
  viewer: "vic.viewer@brightwater.example",
  otherTeam: "kai.admin@kestrel.example",
};

let t: TestDatabase;
const actors = {} as Record<Who, Actor>;
let engineersProject: string;
let managersProject: string;
let viewerId: string;
let vesselId: string;
let kineticsVersionId: string;

beforeAll(async () => {
  t = await createTestDatabase();
  await seedDemoData(t.db);
  for (const who of Object.keys(EMAILS) as Who[]) {
    const [u] = await t.db.select().from(users).where(eq(users.email, EMAILS[who]));
    actors[who] = (await loadActor(t.db, u.id))!;
  }
  viewerId = actors.viewer.userId;
  const [p] = await t.db.select().from(projects).where(eq(projects.name, "Ester line 3 revamp"));
  engineersProject = p.id;
  [{ id: vesselId }] = await t.db.select({ id: inventoryVessels.id }).from(inventoryVessels).where(eq(inventoryVessels.tag, "R-302"));
  [{ id: kineticsVersionId }] = await t.db
    .select({ id: kineticsVersions.id })
    .from(kineticsVersions)
    .innerJoin(kineticsModels, eq(kineticsModels.id, kineticsVersions.modelId))
    .where(eq(kineticsModels.projectId, p.id));
  managersProject = (await createProject(t.db, actors.manager, { name: "Manager's own study", description: "" })).id;
});
afterAll(() => t.drop());

async function outcomeOf(fn: () => Promise<unknown>): Promise<Outcome> {
  try {
    await fn();
    return "ok";
  } catch (err) {
    if (err instanceof AppError && (err.code === "forbidden" || err.code === "not_found")) return err.code;
    throw err;
  }
}

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
    for (const who of Object.keys(EMAILS) as Who[]) {
      it(`${row.name} as ${who} → ${row.expect[who]}`, async () => {
        expect(await outcomeOf(() => row.run(actors[who]))).toBe(row.expect[who]);
      });
    }
  }

  it("archiving a project of someone else needs more than the engineer role", async () => {
    expect(await outcomeOf(() => updateProject(t.db, actors.engineer, managersProject, { archived: true }))).toBe("forbidden");
    expect(await outcomeOf(() => updateProject(t.db, actors.viewer, engineersProject, { archived: true }))).toBe("forbidden");
  });

  it("another team's listings never include this team's records", async () => {
    const theirs = await listProjects(t.db, actors.otherTeam, { includeArchived: true });
    expect(theirs.map((p) => p.id)).not.toContain(engineersProject);
    const members = await listMembers(t.db, actors.otherTeam);
    expect(members.map((m) => m.email)).toEqual([EMAILS.otherTeam]);
    const audit = await listAuditEntries(t.db, actors.otherTeam);
    expect(audit.every((e) => e.entityId !== engineersProject)).toBe(true);
  });

  it("invitations: only admins create and revoke, only in their own team", async () => {
    for (const who of ["manager", "engineer", "viewer"] as const) {
      expect(await outcomeOf(() => createInvitation(t.db, actors[who], { email: `x-${who}@new.example`, role: "viewer" }))).toBe("forbidden");
    }
    const inv = await createInvitation(t.db, actors.admin, { email: "new.colleague@brightwater.example", role: "engineer" });
    expect(await outcomeOf(() => revokeInvitation(t.db, actors.otherTeam, inv.id))).toBe("not_found");
    expect(await outcomeOf(() => revokeInvitation(t.db, actors.manager, inv.id))).toBe("forbidden");
    expect(await outcomeOf(() => revokeInvitation(t.db, actors.admin, inv.id))).toBe("ok");
  });

  it("the policy table covers every action with at least one role", () => {
    for (const [action, roles] of Object.entries(POLICY)) expect(roles.length, action).toBeGreaterThan(0);
  });
});
