import { and, asc, desc, eq, inArray, like, sql, type AnyColumn, type SQL } from "drizzle-orm";
import { EMPTY_STAGE_STEP } from "@/lib/engine";
import type { Database } from "@/db/client";
import { candidates, scenarios, sweeps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { notFound } from "@/lib/errors";
import type { StagePlot } from "@/lib/engine";
import { keyOfWrittenSequence, sequenceFromKey } from "@/lib/stage-types";
import type { TrainPlan } from "@/lib/costs/train-plan";
import type { CandidateQuery } from "@/lib/schemas/sweeps";
import type { NetworkScenarioReference, ScenarioReference, StoredNetworkStage, StoredStage, WithShapes } from "@/lib/sweeps/stored-json";
import type { SortKey } from "@/lib/sweeps/sort-keys";
import { candidatePlots, scenarioPlotter } from "@/lib/sweeps/stage-plots";
import { thumbnailPlot } from "@/lib/charts/thumbnail-plots";

/** Vessels a candidate reuses from the inventory (0 without a plan). */
const reusedCount = sql<number>`coalesce((${candidates.inventoryPlan}->>'reusedCount')::int, 0)`;

/** Installed cost had every vessel been bought new (null without a reuse plan). */
const allNewCost = sql<number | null>`(${candidates.inventoryPlan}->>'allNewCost')::float8`;

const asFraction = (column: AnyColumn) => sql`round(${column}::numeric, 9)`;

const SORT_COLUMNS = {
  rank: [candidates.rank],
  totalVolume: [candidates.totalVolume],
  totalCost: [candidates.totalCost],
  stageCount: [candidates.stageCount, candidates.rank],
  ratioToPfr: [candidates.ratioToPfr],
  sequence: [candidates.stageCount, candidates.sequenceKey],
  installedCost: [candidates.installedCost],
  reused: [reusedCount],
  probabilityMeet: [candidates.probabilityMeet],
  // Fractions compared to 9 decimals, the designer's own tie tolerance: trains whose yields differ by
  // round-off (a tube, and a tank of zero volume before the same tube) then keep their rank order.
  conversion: [asFraction(candidates.conversion)],
  yield: [asFraction(candidates.yield)],
  selectivity: [asFraction(candidates.selectivity)],
  objectiveValue: [candidates.objectiveValue],
} as const satisfies Record<SortKey, readonly unknown[]>;

const summaryColumns = {
  id: candidates.id,
  rank: candidates.rank,
  sequenceKey: candidates.sequenceKey,
  stageCount: candidates.stageCount,
  feasible: candidates.feasible,
  totalVolume: candidates.totalVolume,
  totalCost: candidates.totalCost,
  ratioToPfr: candidates.ratioToPfr,
  probabilityMeet: candidates.probabilityMeet,
  reason: candidates.reason,
  // Several reactions only (null for one-reaction sweeps).
  conversion: candidates.conversion,
  yield: candidates.yield,
  selectivity: candidates.selectivity,
  objectiveValue: candidates.objectiveValue,
  onBound: candidates.onBound,
  stages: candidates.stages,
  installedCost: candidates.installedCost,
  reused: reusedCount.mapWith(Number),
  allNewCost,
};

/** One scenario's ranked candidates, sorted, filtered and paged in the database. */
export async function listCandidates(db: Database, actor: Actor, sweepId: string, scenarioIndex: number, q: CandidateQuery) {
  assertCan(actor, "sweep.read");
  // The scenario (with the team check) and the page are read concurrently; the page is only
  // returned when the scenario query found the sweep in the actor's team.
  const scenarioQuery = db
    .select({
      id: scenarios.id,
      index: scenarios.index,
      overrides: scenarios.overrides,
      status: scenarios.status,
      error: scenarios.error,
      reference: scenarios.reference,
      network: sql<boolean>`${sweeps.baseSpec} ? 'reactions'`,
      // Only when plot points are asked for: they are recomputed from the stages and the scenario's chemistry.
      baseSpec: q.include ? sweeps.baseSpec : sql<null>`null`,
    })
    .from(scenarios)
    .innerJoin(sweeps, eq(sweeps.id, scenarios.sweepId))
    .where(and(eq(scenarios.sweepId, sweepId), eq(scenarios.index, scenarioIndex), eq(sweeps.teamId, actor.teamId)));
  const scenarioIdSql = sql`(select ${scenarios.id} from ${scenarios} where ${scenarios.sweepId} = ${sweepId} and ${scenarios.index} = ${scenarioIndex})`;

  const filters: SQL[] = [eq(candidates.sweepId, sweepId), sql`${candidates.scenarioId} = ${scenarioIdSql}`];
  if (q.feasible) filters.push(eq(candidates.feasible, q.feasible === "true"));
  if (q.stages) filters.push(eq(candidates.stageCount, q.stages));
  // Whole stage names only: "PFR" must not match inside another name, so compare on "-"-bounded keys.
  if (q.contains) filters.push(like(sql`'-' || ${candidates.sequenceKey} || '-'`, `%-${keyOfWrittenSequence(q.contains)}-%`));
  const where = and(...filters);

  const direction = q.dir === "desc" ? desc : asc;
  // Infeasible candidates (null totals) stay after the feasible ones whichever way one sorts.
  const order = [sql`${candidates.feasible} desc`, ...SORT_COLUMNS[q.sort].map((c) => sql`${direction(c)} nulls last`), asc(candidates.rank)];
  const columns = {
    ...summaryColumns,
    ...(q.include ? { levenspiel: candidates.levenspiel } : {}),
    // The filtered total rides along with the page instead of a second query.
    filteredTotal: sql<number>`count(*) over ()`.mapWith(Number),
  };
  const [[scenario], rows] = await Promise.all([
    scenarioQuery,
    db.select(columns).from(candidates).where(where).orderBy(...order).limit(q.pageSize).offset((q.page - 1) * q.pageSize),
  ]);
  if (!scenario) throw notFound("scenario");
  const total = rows[0]?.filteredTotal ?? (q.page > 1 ? await countWhere(db, where) : 0);
  const plotsOf = q.include && !scenario.network && scenario.baseSpec ? scenarioPlotter(scenario.baseSpec, scenario.overrides) : null;
  const items = rows.map(({ filteredTotal: _t, ...c }) => {
    const typed = c as WithShapes<typeof c, { stages: StoredStage[]; levenspiel?: StagePlot[] }>;
    if (!plotsOf) return typed;
    const plots = plotsOf(typed.levenspiel, typed.stages);
    return { ...typed, levenspiel: q.include === "thumbnails" ? plots.map(thumbnailPlot) : plots };
  });
  return {
    kind: scenario.network ? ("network" as const) : ("single" as const),
    scenario: { index: scenario.index, overrides: scenario.overrides, status: scenario.status, error: scenario.error, reference: scenario.reference as ScenarioReference | NetworkScenarioReference | null },
    page: q.page,
    pageSize: q.pageSize,
    total,
    // The key codec reads a tube with recycle ("PFRrecycle" in a key) back whole.
    items: items.map((c) => ({ ...c, sequence: sequenceFromKey(c.sequenceKey), emptyStages: emptyStageCount(c.stages) })),
  };
}

async function countWhere(db: Database, where: SQL | undefined): Promise<number> {
  const [{ n }] = await db.select({ n: sql<number>`count(*)::int` }).from(candidates).where(where);
  return n;
}

/** Two to four candidates of the actor's team, from one sweep or several, with their plot data. */
export async function compareCandidates(db: Database, actor: Actor, ids: string[]) {
  assertCan(actor, "sweep.read");
  const rows = await db
    .select({
      candidate: candidates,
      scenario: { index: scenarios.index, overrides: scenarios.overrides, reference: scenarios.reference },
      sweep: { id: sweeps.id, name: sweeps.name, projectId: sweeps.projectId, teamId: sweeps.teamId },
      network: sql<boolean>`${sweeps.baseSpec} ? 'reactions'`,
      baseSpec: sweeps.baseSpec,
    })
    .from(candidates)
    .innerJoin(scenarios, eq(scenarios.id, candidates.scenarioId))
    .innerJoin(sweeps, eq(sweeps.id, candidates.sweepId))
    .where(and(inArray(candidates.id, ids), eq(sweeps.teamId, actor.teamId)));
  if (rows.length !== new Set(ids).size) throw notFound("candidate");
  const byId = new Map(rows.map((r) => [r.candidate.id, r]));
  const list = ids.map((id) => byId.get(id)!);
  const best = Math.min(...list.map((r) => r.candidate.totalVolume ?? Infinity));
  const bestCost = Math.min(...list.map((r) => r.candidate.totalCost ?? Infinity));
  const bestYield = Math.max(...list.map((r) => r.candidate.yield ?? -Infinity));
  return list.map(({ candidate: c, scenario, sweep, network, baseSpec }) => {
    const common = {
      id: c.id,
      sweep: { id: sweep.id, name: sweep.name, projectId: sweep.projectId },
      rank: c.rank,
      sequence: sequenceFromKey(c.sequenceKey),
      feasible: c.feasible,
      totalVolume: c.totalVolume,
      totalCost: c.totalCost,
      installedCost: c.installedCost,
      inventoryPlan: c.inventoryPlan as TrainPlan | null,
      stageCount: c.stageCount,
      ratioToPfr: c.ratioToPfr,
      // Several reactions only (null for one-reaction candidates).
      conversion: c.conversion,
      yield: c.yield,
      selectivity: c.selectivity,
      objectiveValue: c.objectiveValue,
      onBound: c.onBound,
      differences: {
        volumeOverBest: c.totalVolume !== null && Number.isFinite(best) ? c.totalVolume - best : null,
        costOverBest: c.totalCost !== null && Number.isFinite(bestCost) ? c.totalCost - bestCost : null,
        /** How far this train's yield falls short of the best yield compared (0 for the best); null without yields. */
        yieldBelowBest: c.yield !== null && Number.isFinite(bestYield) ? bestYield - c.yield : null,
      },
    };
    // The kind decides the stages' shape: screens narrow on it.
    return network
      ? { ...common, kind: "network" as const, scenario: scenario as WithShapes<typeof scenario, { reference: NetworkScenarioReference | null }>, stages: c.stages as unknown as StoredNetworkStage[], levenspiel: [] as StagePlot[] }
      : { ...common, kind: "single" as const, scenario: scenario as WithShapes<typeof scenario, { reference: ScenarioReference | null }>, stages: c.stages as StoredStage[], levenspiel: candidatePlots(c.levenspiel, c.stages as StoredStage[], baseSpec, scenario.overrides) };
  });
}

/** Stages that do no work (conversion step below the engine's threshold): the train reduces to a shorter one. */
function emptyStageCount(stages: unknown): number {
  if (!Array.isArray(stages)) return 0;
  return stages.filter((st: { conversionIn?: number; conversionOut?: number }) => typeof st?.conversionIn === "number" && typeof st.conversionOut === "number" && st.conversionOut - st.conversionIn < EMPTY_STAGE_STEP).length;
}
