import type { Database } from "@/db/client";
import { teamCandidateWithScenario } from "@/db/queries/team-candidates";
import { CAUTIONS, EngineError, networkPaths, networkTrainProfiles, type NetworkPaths, type NetworkSpec, type NetworkTrainProfiles } from "@/lib/engine";
import type { Actor } from "@/lib/authz/policy";
import { notFound } from "@/lib/errors";
import { applyOverrides } from "@/lib/sweeps/grid";
import type { StoredNetworkSweepSpec } from "@/lib/sweeps/stored-json";
import { compareCandidates } from "./candidates";

/** The chemistry of a network sweep's scenario: its spec after the grid's values, without trains, objective or limits. */
export function scenarioChemistry(baseSpec: Record<string, unknown>, overrides: Record<string, number>): NetworkSpec {
  const spec = applyOverrides(baseSpec, overrides) as unknown as StoredNetworkSweepSpec;
  return { feed: spec.feed, phase: spec.phase, reactions: spec.reactions, keyReactant: spec.keyReactant, ...(spec.thermal ? { thermal: spec.thermal } : {}) };
}

/**
 * One candidate for its page (GET /api/candidates/{id}). A network candidate also carries the scenario's
 * chemistry, its key reactant and wanted product, the species, the concentration profiles along the train
 * (cumulative residence time) and the single tube's and single stirred tanks' paths from the same feed
 * (the path chart's background): computed on request from the stored stages, never stored.
 */
export async function getCandidate(db: Database, actor: Actor, candidateId: string) {
  const [candidate] = await compareCandidates(db, actor, [candidateId]);
  if (candidate!.kind === "single") return candidate!;
  const c = candidate!;
  const row = await teamCandidateWithScenario(db, actor.teamId, candidateId);
  if (!row) throw notFound("candidate");
  const chemistry = scenarioChemistry(row.sweep.baseSpec, row.scenario.overrides);
  const objective = (row.sweep.baseSpec as unknown as StoredNetworkSweepSpec).objective;
  const product = objective.product ?? null;
  const species = Object.keys(chemistry.feed.concentrations);
  return {
    ...c,
    chemistry,
    keyReactant: chemistry.keyReactant,
    product,
    species,
    profiles: views(() => networkTrainProfiles(chemistry, c.stages.map((s) => ({ type: s.type, volume: s.volume, temperature: s.temperature })))),
    paths: views(() => networkPaths(chemistry, product ?? undefined)),
    cautions: CAUTIONS,
  };
}

/**
 * A view the engine cannot draw (a tube it cannot follow past a point) leaves that chart out rather
 * than failing the page: the stored design stands on its own.
 */
function views<T extends NetworkPaths | NetworkTrainProfiles>(compute: () => T): T | null {
  try {
    return compute();
  } catch (err) {
    if (err instanceof EngineError) return null;
    throw err;
  }
}
