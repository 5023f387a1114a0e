import { and, eq } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { candidates, kineticsModels, kineticsVersions, projects, scenarios, sweeps } from "@/db/schema";
import { designNetwork, type NetworkDesignSpec } from "@/lib/engine";
import { applyOverrides, expandGrid, type GridAxis } from "@/lib/sweeps/grid";
import { bestNetworkObjective, networkCandidateRows, networkScenarioReference } from "@/lib/sweeps/network-candidate-rows";
import { DEMO_NETWORK } from "./network-demo";
import { pinDemoCandidate } from "./pin-demo-candidate";

/**
 * The demo's model of several reactions in its own project, a finished sweep on it computed here by
 * the engine (no worker needed) and its best train at the fitted rate constants pinned for review:
 * so the first sign-in shows a yield-ranked result beside the volume-ranked one. A second run changes nothing.
 */
export async function seedDemoNetwork(tx: Executor, team: { id: string }, ownerId: string): Promise<void> {
  const d = DEMO_NETWORK;
  let [project] = await tx.select().from(projects).where(and(eq(projects.teamId, team.id), eq(projects.name, d.project.name)));
  if (!project) [project] = await tx.insert(projects).values({ teamId: team.id, name: d.project.name, description: d.project.description, createdBy: ownerId }).returning();
  const [existing] = await tx.select({ id: kineticsModels.id }).from(kineticsModels).where(and(eq(kineticsModels.projectId, project.id), eq(kineticsModels.name, d.model.name)));
  if (existing) return;

  const [model] = await tx.insert(kineticsModels).values({ teamId: team.id, projectId: project.id, name: d.model.name, createdBy: ownerId }).returning();
  const [version] = await tx.insert(kineticsVersions).values({ modelId: model.id, version: 1, spec: d.model.spec, note: d.model.note, createdBy: ownerId }).returning();

  // The sweep's spec as the sweep service builds it: the chemistry without its wanted product, plus heat mode, trains, objective and limits.
  const { product: _product, ...chemistry } = d.model.spec;
  const baseSpec = { ...chemistry, thermal: d.sweep.thermal, train: d.sweep.train, objective: d.sweep.objective, constraints: d.sweep.constraints };
  const grid: GridAxis[] = d.sweep.grid;
  const all = expandGrid(grid);
  const at = new Date();
  const [sweep] = await tx
    .insert(sweeps)
    .values({ teamId: team.id, projectId: project.id, kineticsVersionId: version.id, name: d.sweep.name, baseSpec, grid, status: "succeeded", total: all.length, done: all.length, submittedBy: ownerId, startedAt: at, finishedAt: at })
    .returning();
  let pinSource: string | null = null;
  for (const [index, overrides] of all.entries()) {
    const spec = applyOverrides(baseSpec, overrides) as unknown as NetworkDesignSpec;
    const result = designNetwork(spec);
    const [scenario] = await tx
      .insert(scenarios)
      .values({ sweepId: sweep.id, index, overrides, status: "succeeded", bestObjective: bestNetworkObjective(result), reference: { ...networkScenarioReference(spec, result) }, candidateCount: result.candidates.length, computedAt: at })
      .returning();
    const rows = await tx.insert(candidates).values(networkCandidateRows(sweep.id, scenario.id, result)).returning({ id: candidates.id, rank: candidates.rank });
    if (overrides["reactions.1.rate.k"] === d.sweep.pinAt) pinSource = rows.find((r) => r.rank === 1)!.id;
  }
  if (!pinSource) return;
  await pinDemoCandidate(tx, {
    teamId: team.id,
    projectId: project.id,
    sweep,
    kineticsVersionId: version.id,
    candidateId: pinSource,
    baseSpec,
    note: "Highest yield of B at the fitted over-reaction rate: a stirred tank keeps A dilute against the dimer, the tube after it stops before B over-reacts (demo).",
    pinnedBy: ownerId,
    at,
  });
}
