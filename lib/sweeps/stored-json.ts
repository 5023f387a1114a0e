/**
 * The shapes of the JSON the sweep tables hold. db/schema types these jsonb columns loosely
 * because it imports nothing above it; services read rows through these shapes so that what they
 * return, and the screens' views derived from it (lib/services/views.ts), say what is really there.
 * Types only.
 */
import type { DesignSpec, NetworkDesignSpec, NetworkObjective, NetworkReferenceDesign, NetworkStageResult, ReferenceResult, StageResult, StageType, TrainStageType } from "@/lib/engine";
import type { TrainPlan } from "@/lib/costs/train-plan";
import type { SweepCosting } from "@/lib/schemas/costs";

/** A stage as stored with a candidate (its plot data is kept apart, in `levenspiel`); a tube with recycle keeps its recycleRatio. */
export type StoredStage = Omit<StageResult, "levenspiel">;

/** A scenario's single-stage references as the worker stores them (run-chunk.ts); older rows lack the last two. */
export interface ScenarioReference extends ReferenceResult {
  equilibriumConversion: number | null;
  feedVolumetricFlow?: number;
  objective?: "volume" | "cost";
}

/** The spec every scenario of a sweep starts from: the engine's, with the costing recorded beside it. */
export type StoredSweepSpec = DesignSpec & { costing?: SweepCosting };

/**
 * The frozen copy of a candidate a pinned design keeps (freeze-candidate.ts): its stages with their
 * plot data, its scenario and sweep. Pins made before costing and uncertainty were kept lack those three.
 */
// A type, not an interface: drizzle stores it in a Record<string, unknown> column.
export type PinnedCandidate = {
  rank: number;
  sequence: TrainStageType[];
  feasible: boolean;
  totalVolume: number | null;
  totalCost: number | null;
  ratioToPfr: number | null;
  installedCost?: number | null;
  inventoryPlan?: TrainPlan | null;
  probabilityMeet?: number | null;
  stages: StageResult[];
  scenario: { index: number; overrides: Record<string, number>; reference: ScenarioReference | null };
  sweep: { id: string; name: string };
};

/* Several reactions (a kinetics model of the network kind). */

/** A stage of a network candidate as stored: type, volume, residence time, temperature, outlet composition, steady states. */
export type StoredNetworkStage = NetworkStageResult;

/** A network scenario's single-stage references and what it ranked by, as the worker stores them. */
export interface NetworkScenarioReference {
  kind: "network";
  singleCSTR: NetworkReferenceDesign | null;
  singlePFR: NetworkReferenceDesign | null;
  objective: NetworkObjective;
  feedVolumetricFlow: number;
}

/** The spec every scenario of a network sweep starts from: the model's chemistry with heat mode, trains, objective and limits. */
export type StoredNetworkSweepSpec = NetworkDesignSpec;

/** The frozen copy of a network candidate a pinned design keeps (its profiles are recomputed from the stages). */
export type PinnedNetworkCandidate = {
  kind: "network";
  rank: number;
  sequence: StageType[];
  feasible: boolean;
  totalVolume: number | null;
  totalResidenceTime: number | null;
  conversion: number | null;
  yield: number | null;
  selectivity: number | null;
  objective: number | null;
  outlet: Record<string, number> | null;
  onBound: string[];
  probabilityMeet?: number | null;
  stages: StoredNetworkStage[];
  scenario: { index: number; overrides: Record<string, number>; reference: NetworkScenarioReference | null };
  sweep: { id: string; name: string };
};

/** A row type with some of its loosely typed JSON fields given their real shapes. */
export type WithShapes<T, S> = Omit<T, keyof S> & S;
