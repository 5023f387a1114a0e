/**
 * Input and output of the network designer (design.ts): which trains to try, what to rank them by and
 * the limits they must meet, and the ranked candidates it returns.
 */
import type { Quantity, StageType } from "../types";
import type { NetworkSpec } from "./types";

export type NetworkTrainSpec = { maxStages: number; types?: StageType[] } | { candidates: StageType[][] };

export type NetworkObjective = { maximise: "yield" | "selectivity"; product: string } | { minimise: "volume"; product?: string };

export interface NetworkConstraints {
  minConversion?: number;
  minYield?: number;
  /** m3 (or a quantity string). */
  maxTotalVolume?: Quantity;
  maxStageVolume?: Quantity;
}

export interface NetworkDesignSpec extends NetworkSpec {
  train: NetworkTrainSpec;
  objective: NetworkObjective;
  constraints?: NetworkConstraints;
}

export interface NetworkStageSteadyState {
  conversion: number;
  outlet: Record<string, number>;
}

export interface NetworkStageResult {
  type: StageType;
  /** m3. */
  volume: number;
  /** V / v0 with v0 the feed's volumetric flow, s. */
  residenceTime: number;
  /** K. */
  temperature: number;
  /** mol/m3 at the stage's temperature. */
  outlet: Record<string, number>;
  /** Present when a stirred tank has several steady states; the train continues from the first (lowest conversion). */
  steadyStates?: NetworkStageSteadyState[];
}

export interface NetworkCandidate {
  rank: number;
  sequence: StageType[];
  feasible: boolean;
  /** Yield or selectivity (maximised), or total volume in m3 (minimised); null when infeasible. */
  objective: number | null;
  totalVolume: number | null;
  totalResidenceTime: number | null;
  conversion: number | null;
  yield: number | null;
  selectivity: number | null;
  outlet: Record<string, number> | null;
  stages: NetworkStageResult[];
  /** Why an infeasible train cannot meet the limits. */
  reason?: string;
  /** Stages whose residence time sits on a bound at the optimum (zero, the stage or the total volume limit). */
  onBound?: string[];
}

export interface NetworkReferenceDesign {
  objective: number;
  volume: number;
  /** The stage's temperature, K, when the optimiser chooses it. */
  temperature?: number;
}

export interface NetworkDesignResult {
  candidates: NetworkCandidate[];
  reference: { singleCSTR: NetworkReferenceDesign | null; singlePFR: NetworkReferenceDesign | null };
}
