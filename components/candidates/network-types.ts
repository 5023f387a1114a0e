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
  keyReactant: string;
  product: string | null;
  species: string[];
  chemistry?: { feed?: { volumetricFlow?: number | string; concentrations?: Record<string, number | string>; temperature?: number | string } };
  profiles: NetworkProfiles;
  paths: NetworkPaths;
  scenario: { index: number; overrides: Record<string, number>; reference: NetworkReference | null };
  sweep: { id: string; name: string; projectId: string };
  differences?: { volumeOverBest?: number | null; yieldBelowBest?: number | null };
}

/** True for a candidate answer of the network kind. */
export function isNetworkCandidate(c: unknown): c is NetworkCandidateDetail {
  return typeof c === "object" && c !== null && (c as { kind?: unknown }).kind === "network";
}
