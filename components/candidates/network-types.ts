/**
 * The shapes of the API's answers for a sweep of several reactions, as the screens read them: the
 * server's derived types (lib/services/views.ts) are assigned to these where the screens take them, so
 * a change on either side fails to compile there. The compare items lack the candidate's own extras
 * (product, species, profiles, paths), which is why those are optional here. Types only.
 */
import type { NetworkObjective, NetworkPaths, NetworkReferenceDesign, NetworkStageResult, NetworkTrainProfiles, TrainStageType } from "@/lib/engine";

/** The engine's views as the candidate answer carries them (computed on request, never stored). */
export type { NetworkPaths, PathPoint, TrainProfileStage } from "@/lib/engine";
export type NetworkProfiles = NetworkTrainProfiles;

/** A network scenario's single-stage references and what it ranked by. */
export interface NetworkReference {
  kind: "network";
  singleCSTR: NetworkReferenceDesign | null;
  singlePFR: NetworkReferenceDesign | null;
  objective: NetworkObjective;
  feedVolumetricFlow: number;
}

/** The measures a candidate row of a network sweep carries (null on a one-reaction row). */
export interface NetworkRowFields {
  conversion?: number | null;
  yield?: number | null;
  selectivity?: number | null;
  objectiveValue?: number | null;
  onBound?: string[] | null;
}

/** A candidate of a network sweep as the ranked table reads it. */
export interface NetworkRow extends NetworkRowFields {
  id: string;
  rank: number;
  sequence: TrainStageType[];
  feasible: boolean;
  totalVolume: number | null;
  reason: string | null;
  stages: NetworkStageResult[];
}

/** `GET /api/candidates/{id}` (and each item of compare) for a network candidate. */
export interface NetworkCandidateDetail extends NetworkRowFields {
  kind: "network";
  id: string;
  rank: number;
  sequence: TrainStageType[];
  feasible: boolean;
  totalVolume: number | null;
  stageCount: number;
  reason?: string | null;
  stages: NetworkStageResult[];
  /** The next five come with the candidate's own answer, not with compare's. */
  keyReactant?: string;
  product?: string | null;
  species?: string[];
  /** Null when the engine could not draw them for this train (the stored design stands on its own). */
  profiles?: NetworkProfiles | null;
  paths?: NetworkPaths | null;
  scenario: { index: number; overrides: Record<string, number>; reference: NetworkReference | null };
  sweep: { id: string; name: string; projectId: string };
  differences?: { volumeOverBest?: number | null; yieldBelowBest?: number | null };
}

/** The wanted product of a candidate: its own answer's, else the objective its scenario ranked by. */
export function productOf(c: Pick<NetworkCandidateDetail, "product" | "scenario">): string | null {
  if (c.product !== undefined) return c.product;
  const o = c.scenario.reference?.objective;
  return o && "product" in o && o.product ? o.product : null;
}

/** The species of a candidate: its answer's list, else those of its first stage's outlet. */
export function speciesOf(c: Pick<NetworkCandidateDetail, "species" | "stages">): string[] {
  return c.species ?? Object.keys(c.stages[0]?.outlet ?? {});
}
