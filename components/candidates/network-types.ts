/**
 * The shapes the API answers with for a sweep of several reactions (issue 13's contract), as the
 * screens read them. Written here rather than derived in lib/services/views.ts because the server
 * side lands in its own branch; the fields and their units are the contract's, so the derived types
 * fit these once merged. Types only.
 */
import type { NetworkObjective, NetworkReferenceDesign, NetworkStageResult, StageType } from "@/lib/engine";

/** A point of a single tube's or a single stirred tank's path from the feed. */
export interface PathPoint {
  /** s (tube: along it; tank: the tank's own). */
  residenceTime: number;
  conversion: number;
  /** C_key, mol/m3. */
  key: number;
  /** C_product, mol/m3 (null without a product). */
  product: number | null;
  selectivity: number | null;
  concentrations: Record<string, number>;
  /** Tanks only: 0 = lowest-conversion state, 1, 2 … when several exist at this size. */
  steadyState?: number;
}

export interface NetworkPaths {
  key: string;
  product: string | null;
  tube: PathPoint[];
  tanks: PathPoint[];
  residenceTimes: { from: number; to: number };
}

export interface TrainProfileStage {
  type: StageType;
  /** Cumulative, s, with the feed's volumetric flow. */
  startResidenceTime: number;
  endResidenceTime: number;
  /** Tube: inlet .. outlet; tank: [inlet at start, outlet at start, outlet at end]. */
  points: { residenceTime: number; concentrations: Record<string, number> }[];
}

export interface NetworkProfiles {
  species: string[];
  stages: TrainProfileStage[];
}

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
  sequence: StageType[];
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
  sequence: StageType[];
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

/** True for a candidate answer of the network kind. */
export function isNetworkCandidate(c: unknown): c is NetworkCandidateDetail {
  return typeof c === "object" && c !== null && (c as { kind?: unknown }).kind === "network";
}
