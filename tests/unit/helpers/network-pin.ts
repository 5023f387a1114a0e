import type { PinnedDesign } from "@/db/schema";
import { designNetwork, type NetworkDesignResult, type NetworkDesignSpec } from "@/lib/engine";
import { DEMO_NETWORK } from "@/lib/demo/network-demo";
import type { PinnedNetworkCandidate } from "@/lib/sweeps/stored-json";

/** The demo's chemistry with its sweep's heat mode, trains, objective and limits, as a sweep stores it (the model's product stripped). */
export function demoNetworkSpec(): NetworkDesignSpec {
  const { product: _product, ...chemistry } = DEMO_NETWORK.model.spec;
  const s = DEMO_NETWORK.sweep;
  return { ...chemistry, thermal: s.thermal, train: s.train, objective: s.objective, constraints: s.constraints } as unknown as NetworkDesignSpec;
}

/**
 * One ranked train of the engine's result frozen by hand into the shape a pinned design keeps
 * (PinnedNetworkCandidate), under the scenario and sweep given: the one builder the unit, integration
 * and browser tests share, so a change to the frozen shape is made once.
 */
export function frozenNetworkCandidate(
  best: NetworkDesignResult["candidates"][number],
  scenario: PinnedNetworkCandidate["scenario"],
  sweep: PinnedNetworkCandidate["sweep"],
): PinnedNetworkCandidate {
  return {
    kind: "network",
    rank: best.rank,
    sequence: best.sequence,
    feasible: best.feasible,
    totalVolume: best.totalVolume,
    totalResidenceTime: best.totalResidenceTime,
    conversion: best.conversion,
    yield: best.yield,
    selectivity: best.selectivity,
    objective: best.objective,
    outlet: best.outlet,
    onBound: best.onBound ?? [],
    stages: best.stages,
    scenario,
    sweep,
  };
}

/**
 * The best train of a network spec frozen by hand into the shape a pinned design keeps
 * (PinnedNetworkCandidate), and a pin row holding it: what pinning a network candidate stores.
 */
export function frozenNetworkPin(spec: NetworkDesignSpec = demoNetworkSpec(), feedVolumetricFlow = 1e-3): { pin: PinnedDesign; candidate: PinnedNetworkCandidate; spec: NetworkDesignSpec } {
  const result = designNetwork(spec);
  const reference = { kind: "network" as const, singleCSTR: result.reference.singleCSTR, singlePFR: result.reference.singlePFR, objective: spec.objective, feedVolumetricFlow };
  const candidate = frozenNetworkCandidate(result.candidates[0], { index: 0, overrides: {}, reference }, { id: "00000000-0000-4000-8000-000000000001", name: "Demo: yield of B" });
  const pin: PinnedDesign = {
    id: "00000000-0000-4000-8000-0000000000aa",
    teamId: "00000000-0000-4000-8000-0000000000bb",
    projectId: "00000000-0000-4000-8000-0000000000cc",
    sweepId: null,
    candidateId: null,
    kineticsVersionId: "00000000-0000-4000-8000-0000000000dd",
    candidate: candidate as unknown as Record<string, unknown>,
    spec: spec as unknown as Record<string, unknown>,
    note: "Tank first to keep the dimerisation down",
    state: "proposed",
    pinnedBy: "u1",
    pinnedAt: new Date("2026-12-01T10:00:00Z"),
    reviewerId: null,
    reviewComment: null,
    reviewedAt: null,
  };
  return { pin, candidate, spec };
}
