import { and, eq } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { inventoryVessels, projectCostSettings, projects, teams, users } from "@/db/schema";
import type { CostBasis } from "@/lib/schemas/costs";

/** Idle vessels of Brightwater's plant (invented demo data; volumes in m3). */
export const DEMO_INVENTORY = [
  { tag: "R-301", type: "CSTR", volume: 0.025, available: true, reuseCost: 3000, location: "Building 3, bay 2", note: "Jacketed glass-lined kettle, idle since the line 2 rebuild." },
  { tag: "R-302", type: "CSTR", volume: 0.01, available: true, reuseCost: 1500, location: "Building 3, bay 4", note: "" },
  { tag: "R-118", type: "CSTR", volume: 0.1, available: false, reuseCost: 6000, location: "Pilot hall", note: "On loan to the lactone pilot until spring." },
  { tag: "T-310", type: "PFR", volume: 0.004, available: true, reuseCost: 2500, location: "Building 3 store", note: "Coiled jacketed tube, 25 mm bore." },
  { tag: "T-311", type: "PFR", volume: 0.0016, available: true, reuseCost: 1200, location: "Building 3 store", note: "" },
] as const;

/** The cost basis of "Ester line 3 revamp": bench-to-kilo-lab sizes, invented demo figures. */
export const DEMO_COST_BASIS: CostBasis = {
  vessels: {
    CSTR: { a: 9000, b: 210000, n: 0.6, source: "invented demo figures (Brightwater's 2025 purchasing records, fictional)" },
    PFR: { a: 2500, b: 160000, n: 0.6, source: "invented demo figures; n ≈ 0.6 is common practice" },
  },
  currency: "EUR",
  basisYear: 2025,
  sizes: { mode: "r10", min: 0.001, max: 1 },
  maxVesselVolume: 0.4,
  installationFactor: { value: 3.5, source: "from memory: installation factors of 3–5 for process vessels" },
};

/** Brightwater's idle vessels and the Ester line 3 cost basis; a second run changes nothing. */
export async function seedDemoInventory(tx: Executor): Promise<void> {
  const [team] = await tx.select().from(teams).where(eq(teams.slug, "brightwater"));
  const [owner] = await tx.select().from(users).where(eq(users.email, "eli.engineer@brightwater.example"));
  if (!team || !owner) return;
  await tx
    .insert(inventoryVessels)
    .values(DEMO_INVENTORY.map((v) => ({ ...v, teamId: team.id, createdBy: owner.id })))
    .onConflictDoNothing({ target: [inventoryVessels.teamId, inventoryVessels.tag] });
  const [project] = await tx.select().from(projects).where(and(eq(projects.teamId, team.id), eq(projects.name, "Ester line 3 revamp")));
  if (!project) return;
  await tx
    .insert(projectCostSettings)
    .values({ projectId: project.id, teamId: team.id, settings: DEMO_COST_BASIS as unknown as Record<string, unknown>, updatedBy: owner.id })
    .onConflictDoNothing({ target: projectCostSettings.projectId });
}
