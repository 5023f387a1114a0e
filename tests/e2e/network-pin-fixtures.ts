import { eq } from "drizzle-orm";
import { candidates, kineticsModels, kineticsVersions, pinnedDesigns, projects, scenarios, sweeps, users } from "../../db/schema";
import { designNetwork, type NetworkDesignSpec } from "../../lib/engine";
import { DEMO_NETWORK } from "../../lib/demo/network-demo";
import { networkCandidateRows, networkScenarioReference } from "../../lib/sweeps/network-candidate-rows";
import { demoNetworkSpec, frozenNetworkCandidate } from "../unit/helpers/network-pin";
import { withE2eDatabase } from "./helpers/e2e-database";

/**
 * Writes a finished sweep of the demo's chemistry of several reactions (a minimum yield of 45 % added, close below the best train's 47 %),
 * its ranked candidates and a pin of its best train straight to the e2e database, in the shapes the web
 * app stores them (sweeping and pinning are other screens' jobs), pinned by `email` in `projectId`.
 */
export async function insertNetworkPin(opts: { email: string; projectId: string; note: string }) {
  return withE2eDatabase(async (db) => {
    const [user] = await db.select().from(users).where(eq(users.email, opts.email));
    const [project] = await db.select().from(projects).where(eq(projects.id, opts.projectId));
    const [model] = await db.insert(kineticsModels).values({ teamId: project.teamId, projectId: project.id, name: `${DEMO_NETWORK.model.name} (report check)`, createdBy: user.id }).returning();
    const [version] = await db.insert(kineticsVersions).values({ modelId: model.id, version: 1, spec: DEMO_NETWORK.model.spec as unknown as Record<string, unknown>, note: "", createdBy: user.id }).returning();
    // The demo sweep's spec with a minimum yield of 45 %.
    const base = demoNetworkSpec();
    const spec = { ...base, constraints: { ...base.constraints, minYield: 0.45 } } as NetworkDesignSpec;
    const result = designNetwork(spec);
    const [sweep] = await db
      .insert(sweeps)
      .values({ teamId: project.teamId, projectId: project.id, kineticsVersionId: version.id, name: "Yield of B (report check)", baseSpec: spec as unknown as Record<string, unknown>, total: 1, done: 1, status: "succeeded", submittedBy: user.id, finishedAt: new Date() })
      .returning();
    // Scenario reference and candidate rows built by the same code the sweep worker and the demo seed use.
    const reference = networkScenarioReference(spec, result);
    const [scenario] = await db
      .insert(scenarios)
      .values({ sweepId: sweep.id, index: 0, overrides: {}, status: "succeeded", reference: { ...reference }, bestObjective: result.candidates[0].objective, candidateCount: result.candidates.length, computedAt: new Date() })
      .returning();
    const rows = await db.insert(candidates).values(networkCandidateRows(sweep.id, scenario.id, result)).returning();
    const frozen = frozenNetworkCandidate(result.candidates[0], { index: 0, overrides: {}, reference }, { id: sweep.id, name: sweep.name });
    const candidateId = rows.find((r) => r.rank === 1)!.id;
    const [pin] = await db
      .insert(pinnedDesigns)
      .values({ teamId: project.teamId, projectId: project.id, sweepId: sweep.id, candidateId, kineticsVersionId: version.id, candidate: frozen as unknown as Record<string, unknown>, spec: spec as unknown as Record<string, unknown>, note: opts.note, pinnedBy: user.id })
      .returning();
    return { pinId: pin.id, candidateId, sweepId: sweep.id, frozen };
  });
}
