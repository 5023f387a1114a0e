import { and, eq } from "drizzle-orm";
import { fileURLToPath } from "node:url";
import type { Database, Executor } from "@/db/client";
import { candidates, kineticsModels, kineticsVersions, memberships, projects, robustnessRuns, scenarios, sweeps, teams, users, type Role } from "@/db/schema";
import { seedDemoDatasets } from "./datasets";
import { designTrains, type DesignSpec } from "@/lib/engine";
import { rateRobustness, trainSpec } from "@/lib/robustness/train";
import { applyOverrides, expandGrid, type GridAxis } from "@/lib/sweeps/grid";
import { bestObjective, candidateRows } from "@/lib/sweeps/candidate-rows";
import type { KineticsSpec } from "@/lib/schemas/sweeps";
import { hashPassword } from "@/lib/auth/password";
import { seedDemoInventory } from "./inventory";
import { seedDemoNetwork } from "./network-seed";
import { pinDemoCandidate } from "./pin-demo-candidate";

/** The demo scenario: an invented fine-chemicals company and a second, unrelated team. */
export const DEMO_PASSWORD = "seriatim-demo-2026";

export const DEMO_USERS: { email: string; name: string; team: string; role: Role }[] = [
  { email: "ada.admin@brightwater.example", name: "Ada Okafor", team: "brightwater", role: "admin" },
  { email: "marta.manager@brightwater.example", name: "Marta Lindqvist", team: "brightwater", role: "manager" },
  { email: "eli.engineer@brightwater.example", name: "Eli Nakamura", team: "brightwater", role: "engineer" },
  { email: "vic.viewer@brightwater.example", name: "Vic Moreau", team: "brightwater", role: "viewer" },
  { email: "kai.admin@kestrel.example", name: "Kai Brennan", team: "kestrel", role: "admin" },
];

const DEMO_TEAMS = [
  { slug: "brightwater", name: "Brightwater Fine Chemicals" },
  { slug: "kestrel", name: "Kestrel Resins" },
];

const DEMO_PROJECTS = [
  {
    team: "brightwater",
    name: "Ester line 3 revamp",
    // Bench scale, to match the demo kinetics' feed (0.02 mol/s of acid, a reactor of about a litre):
    // a plant rate beside litre-sized vessels would make the right numbers look wrong.
    description: "Liquid-phase esterification, bench-scale study (acid fed at 72 mol/h): choose the train that replaces the single stirred tank before scale-up.",
    owner: "eli.engineer@brightwater.example",
  },
  {
    team: "brightwater",
    name: "Lactone pilot unit",
    description: "Ring-opening step for the pilot plant; autocatalytic kinetics from the bench.",
    owner: "eli.engineer@brightwater.example",
  },
  {
    team: "kestrel",
    name: "Resin dryer feed",
    description: "Kestrel's own project; never visible to Brightwater.",
    owner: "kai.admin@kestrel.example",
  },
];

/** Demo kinetics, invented for the scenario: one normal (second-order) case, one autocatalytic. */
export const DEMO_KINETICS: { project: string; name: string; note: string; spec: KineticsSpec }[] = [
  {
    project: "Ester line 3 revamp",
    name: "Esterification, second order",
    note: "Rate constant from the October bench runs at 67 °C (invented demo data).",
    spec: {
      feed: { flowA: 0.02, concA: "1 mol/L", temperature: 340, ratios: { B: 1.2, R: 0, S: 0 } },
      reaction: {
        stoichiometry: { A: -1, B: -1, R: 1, S: 1 },
        phase: "liquid",
        rate: { law: "power", k: 1e-4, orders: { A: 1, B: 1 }, activationEnergy: 55000 },
        thermal: { mode: "isothermal" },
      },
    },
  },
  {
    project: "Lactone pilot unit",
    name: "Ring opening, autocatalytic",
    note: "Product catalyses its own formation; 5 % product recycled in the feed (invented demo data).",
    spec: {
      feed: { flowA: 0.005, concA: 800, temperature: 320, ratios: { R: 0.05 } },
      reaction: { stoichiometry: { A: -1, R: 1 }, phase: "liquid", rate: { law: "power", k: 2e-6, orders: { A: 1, R: 1 } } },
    },
  },
];

/** Inserts the demo teams, users, memberships and projects; a second run changes nothing. */
export async function seedDemoData(db: Database): Promise<void> {
  await db.transaction(async (tx) => {
    for (const t of DEMO_TEAMS) {
      await tx.insert(teams).values(t).onConflictDoNothing({ target: teams.slug });
    }
    const teamRows = await tx.select().from(teams);
    const teamId = (slug: string) => teamRows.find((t) => t.slug === slug)!.id;

    const passwordHash = await hashPassword(DEMO_PASSWORD);
    for (const u of DEMO_USERS) {
      await tx
        .insert(users)
        .values({ email: u.email, name: u.name, passwordHash, emailVerified: new Date("2026-01-05T09:00:00Z") })
        .onConflictDoNothing({ target: users.email });
    }
    const userRows = await tx.select().from(users);
    const userId = (email: string) => userRows.find((u) => u.email === email)!.id;

    for (const u of DEMO_USERS) {
      await tx
        .insert(memberships)
        .values({ teamId: teamId(u.team), userId: userId(u.email), role: u.role })
        .onConflictDoNothing();
    }
    for (const p of DEMO_PROJECTS) {
      const existing = await tx
        .select({ id: projects.id })
        .from(projects)
        .where(and(eq(projects.teamId, teamId(p.team)), eq(projects.name, p.name)));
      if (existing.length === 0) {
        await tx.insert(projects).values({
          teamId: teamId(p.team),
          name: p.name,
          description: p.description,
          createdBy: userId(p.owner),
        });
      }
    }
    const projectRows = await tx.select().from(projects);
    for (const k of DEMO_KINETICS) {
      const project = projectRows.find((p) => p.name === k.project)!;
      const existing = await tx
        .select({ id: kineticsModels.id })
        .from(kineticsModels)
        .where(and(eq(kineticsModels.projectId, project.id), eq(kineticsModels.name, k.name)));
      if (existing.length) continue;
      const [model] = await tx.insert(kineticsModels).values({ teamId: project.teamId, projectId: project.id, name: k.name, createdBy: project.createdBy }).returning();
      await tx.insert(kineticsVersions).values({ modelId: model.id, version: 1, spec: k.spec, note: k.note, createdBy: project.createdBy });
    }
    await seedDemoSweep(tx, projectRows.find((p) => p.name === DEMO_KINETICS[0].project)!);
    const brightwater = teamRows.find((t) => t.slug === "brightwater")!;
    await seedDemoNetwork(tx, brightwater, userId("eli.engineer@brightwater.example"));
    await seedDemoInventory(tx);
    await seedDemoDatasets(tx, projectRows);
  });
}

const DEMO_SWEEP_NAME = "Demo: feed rate × target conversion";

/**
 * A finished sweep on the first demo model, computed here by the engine (no worker needed),
 * and its best train at the design point pinned for review: so a manager signing in for the
 * first time has a ranking to read and a design to approve.
 */
async function seedDemoSweep(tx: Executor, project: typeof projects.$inferSelect): Promise<void> {
  const existing = await tx.select({ id: sweeps.id }).from(sweeps).where(and(eq(sweeps.projectId, project.id), eq(sweeps.name, DEMO_SWEEP_NAME)));
  if (existing.length) return;
  const [model] = await tx.select().from(kineticsModels).where(and(eq(kineticsModels.projectId, project.id), eq(kineticsModels.name, DEMO_KINETICS[0].name)));
  const [version] = await tx.select().from(kineticsVersions).where(eq(kineticsVersions.modelId, model.id));
  const grid: GridAxis[] = [
    { field: "feed.flowA", values: [0.01, 0.02, 0.04] },
    { field: "target.conversion", values: [0.85, 0.9, 0.95] },
  ];
  const baseSpec = { ...version.spec, target: { conversion: 0.9 }, train: { maxStages: 3, types: ["CSTR", "PFR"] }, objective: { minimise: "volume" } };
  const all = expandGrid(grid);
  const at = new Date();
  const [sweep] = await tx
    .insert(sweeps)
    .values({ teamId: project.teamId, projectId: project.id, kineticsVersionId: version.id, name: DEMO_SWEEP_NAME, baseSpec, grid, status: "succeeded", total: all.length, done: all.length, submittedBy: project.createdBy, startedAt: at, finishedAt: at })
    .returning();
  let pinSource: { candidateId: string; scenarioIndex: number } | null = null;
  for (const [index, overrides] of all.entries()) {
    const result = designTrains(applyOverrides(baseSpec, overrides) as unknown as DesignSpec);
    const [scenario] = await tx
      .insert(scenarios)
      .values({
        sweepId: sweep.id,
        index,
        overrides,
        status: "succeeded",
        bestObjective: bestObjective(result),
        reference: { ...result.reference, equilibriumConversion: result.equilibriumConversion ?? null, feedVolumetricFlow: result.feedVolumetricFlow, objective: result.objective },
        candidateCount: result.candidates.length,
        computedAt: at,
      })
      .returning();
    const rows = await tx.insert(candidates).values(candidateRows(sweep.id, scenario.id, result)).returning({ id: candidates.id, rank: candidates.rank });
    if (overrides["feed.flowA"] === 0.02 && overrides["target.conversion"] === 0.9) pinSource = { candidateId: rows.find((r) => r.rank === 1)!.id, scenarioIndex: index };
  }
  if (!pinSource) return;
  const { pin, candidate: c, scenario: sc } = await pinDemoCandidate(tx, {
    teamId: project.teamId,
    projectId: project.id,
    sweep,
    kineticsVersionId: version.id,
    candidateId: pinSource.candidateId,
    baseSpec,
    note: "Least volume at the design feed of 0.02 mol/s and X = 0.9 (demo).",
    pinnedBy: project.createdBy,
    at,
  });
  // The manager's first question, answered before review: what if k is 20 % off? (demo run)
  const spec = applyOverrides(baseSpec, sc.overrides);
  const train = trainSpec(spec, c.stages);
  const request = { uncertain: [{ field: "reaction.rate.k" as const, kind: "plusMinus" as const, fraction: 0.2 }], target: 0.9, samples: 2000, seed: 2026 };
  await tx.insert(robustnessRuns).values({
    teamId: project.teamId,
    projectId: project.id,
    candidateId: c.id,
    pinId: pin.id,
    request: { ...request, train },
    status: "succeeded",
    result: rateRobustness(train, request) as unknown as Record<string, unknown>,
    createdBy: project.createdBy,
    createdAt: at,
    finishedAt: at,
  });
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const { getDb, closeDb } = await import("@/db/client");
  await seedDemoData(getDb());
  await closeDb();
  console.log("demo data seeded");
}
