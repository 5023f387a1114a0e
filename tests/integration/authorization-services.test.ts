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
import { pinnedDesigns } from "@/db/schema-sweeps";
import { createCandidateRun, createPinRun, getRun, listCandidateRuns, listPinRuns } from "@/lib/services/robustness";
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
let demoPin: { id: string; candidateId: string };
let candidateRunId: string;
const UNCERTAIN = { uncertain: [{ field: "reaction.rate.k" as const, kind: "plusMinus" as const, fraction: 0.2 }], samples: 20, seed: 1 };

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
  managersProject = (await createProject(t.db, actors.manager, { name: "Manager's own study", description: "" })).id;
  const [pin] = await t.db.select().from(pinnedDesigns);
  demoPin = { id: pin.id, candidateId: pin.candidateId! };
  candidateRunId = (await createCandidateRun(t.db, actors.engineer, demoPin.candidateId, UNCERTAIN)).id;
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
  // Robustness runs: a candidate's follow sweep.read; the demo pin is proposed, so hidden from viewers.
  { name: "rate a candidate under uncertainty", run: (a) => createCandidateRun(t.db, a, demoPin.candidateId, UNCERTAIN), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  { name: "list a candidate's robustness runs", run: (a) => listCandidateRuns(t.db, a, demoPin.candidateId), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  { name: "rate a pinned design under uncertainty", run: (a) => createPinRun(t.db, a, demoPin.id, UNCERTAIN), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "not_found", otherTeam: "not_found" } },
  { name: "list a pinned design's robustness runs", run: (a) => listPinRuns(t.db, a, demoPin.id), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "not_found", otherTeam: "not_found" } },
  { name: "read a candidate's robustness run", run: (a) => getRun(t.db, a, candidateRunId), expect: { admin: "ok", manager: "ok", engineer: "ok", viewer: "forbidden", otherTeam: "not_found" } },
  { name: "read the audit trail", run: (a) => listAuditEntries(t.db, a), expect: { admin: "ok", manager: "ok", engineer: "forbidden", viewer: "forbidden", otherTeam: "ok" } },
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
