import { eq } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { candidates, kineticsModels, kineticsVersions, pinnedDesigns, projects, scenarios, sweeps, users } from "../../db/schema";
import { designNetwork, type NetworkDesignSpec } from "../../lib/engine";
import { DEMO_NETWORK } from "../../lib/demo/network-demo";
import type { PinnedNetworkCandidate } from "../../lib/sweeps/stored-json";

/**
 * Writes a finished sweep of the demo's chemistry of several reactions (a minimum yield of 45 % added, close below the best train's 47 %),
 * its ranked candidates and a pin of its best train straight to the e2e database, in the shapes the web
 * app stores them (sweeping and pinning are other screens' jobs), pinned by `email` in `projectId`.
 */
export async function insertNetworkPin(opts: { email: string; projectId: string; note: string }) {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set; run e2e tests through `npm test -- e2e`");
  const pool = new pg.Pool({ connectionString: url, max: 1 });
  try {
    const db = drizzle(pool);
    const [user] = await db.select().from(users).where(eq(users.email, opts.email));
    const [project] = await db.select().from(projects).where(eq(projects.id, opts.projectId));
    const [model] = await db.insert(kineticsModels).values({ teamId: project.teamId, projectId: project.id, name: `${DEMO_NETWORK.model.name} (report check)`, createdBy: user.id }).returning();
    const [version] = await db.insert(kineticsVersions).values({ modelId: model.id, version: 1, spec: DEMO_NETWORK.model.spec as unknown as Record<string, unknown>, note: "", createdBy: user.id }).returning();
    const { product: _product, ...chemistry } = DEMO_NETWORK.model.spec;
    const s = DEMO_NETWORK.sweep;
    const spec = { ...chemistry, thermal: s.thermal, train: s.train, objective: s.objective, constraints: { ...s.constraints, minYield: 0.45 } } as unknown as NetworkDesignSpec;
    const result = designNetwork(spec);
    const [sweep] = await db
      .insert(sweeps)
      .values({ teamId: project.teamId, projectId: project.id, kineticsVersionId: version.id, name: "Yield of B (report check)", baseSpec: spec as unknown as Record<string, unknown>, total: 1, done: 1, status: "succeeded", submittedBy: user.id, finishedAt: new Date() })
      .returning();
    const reference = { kind: "network" as const, singleCSTR: result.reference.singleCSTR, singlePFR: result.reference.singlePFR, objective: spec.objective, feedVolumetricFlow: 1e-3 };
    const [scenario] = await db
      .insert(scenarios)
      .values({ sweepId: sweep.id, index: 0, overrides: {}, status: "succeeded", reference, bestObjective: result.candidates[0].objective, candidateCount: result.candidates.length, computedAt: new Date() })
      .returning();
    const rows = await db
      .insert(candidates)
      .values(
        result.candidates.map((c) => ({
          sweepId: sweep.id,
          scenarioId: scenario.id,
          sequenceKey: c.sequence.join("-"),
          rank: c.rank,
          stageCount: c.sequence.length,
          feasible: c.feasible,
          totalVolume: c.totalVolume,
          conversion: c.conversion,
          yield: c.yield,
          selectivity: c.selectivity,
          objectiveValue: c.objective,
          onBound: c.onBound ?? null,
          reason: c.reason ?? null,
          stages: c.stages as unknown as Record<string, unknown>[],
          levenspiel: [],
        })),
      )
      .returning();
    const best = result.candidates[0];
    const frozen: PinnedNetworkCandidate = {
      kind: "network",
      rank: 1,
      sequence: best.sequence,
      feasible: true,
      totalVolume: best.totalVolume,
      totalResidenceTime: best.totalResidenceTime,
      conversion: best.conversion,
      yield: best.yield,
      selectivity: best.selectivity,
      objective: best.objective,
      outlet: best.outlet,
      onBound: best.onBound ?? [],
      stages: best.stages,
      scenario: { index: 0, overrides: {}, reference },
      sweep: { id: sweep.id, name: sweep.name },
    };
    const candidateId = rows.find((r) => r.rank === 1)!.id;
    const [pin] = await db
      .insert(pinnedDesigns)
      .values({ teamId: project.teamId, projectId: project.id, sweepId: sweep.id, candidateId, kineticsVersionId: version.id, candidate: frozen as unknown as Record<string, unknown>, spec: spec as unknown as Record<string, unknown>, note: opts.note, pinnedBy: user.id })
      .returning();
    return { pinId: pin.id, candidateId, sweepId: sweep.id, frozen };
  } finally {
    await pool.end();
  }
}
