/**
 * What the screens and the report draw of a reaction network besides the designer's ranking: the
 * concentration paths of a single tube and of single stirred tanks from the feed, the profile along a
 * train, and the rating of a train whose volumes are given. Quantities in SI: s, mol/m3, m3, K.
 */
import type { StageType } from "../../types";

/** One composition on a path: a point along a single tube, or the outlet of one single stirred tank. */
export interface PathPoint {
  /** s: along the tube (V / v0), or the tank's own residence time. */
  residenceTime: number;
  /** Of the key reactant, relative to the feed. */
  conversion: number;
  /** C_key, mol/m3. */
  key: number;
  /** C_product, mol/m3; null without a product. */
  product: number | null;
  /** Instantaneous selectivity R_product / (-R_key) at this composition; null where -R_key <= 0 or without a product. */
  selectivity: number | null;
  /** Every species, mol/m3 (a gas's at the stage temperature and its own total molar flow). */
  concentrations: Record<string, number>;
  /**
   * Tanks only: which steady state this is at this size, 0 = lowest conversion, then 1, 2 … when several
   * exist. Always present on tank points (0 when the tank has one state); absent on tube points.
   */
  steadyState?: number;
}

export interface NetworkPaths {
  key: string;
  product: string | null;
  /** The feed (residence time 0), then the single tube at every time of the grid, one integration. */
  tube: PathPoint[];
  /** Single stirred tanks from the feed at every time of the grid, every steady state found (sizes whose balances could not be solved are left out). */
  tanks: PathPoint[];
  /** The grid's first and last residence time, s (log-spaced between them). */
  residenceTimes: { from: number; to: number };
}

export interface NetworkPathsOptions {
  /** Residence times of the grid. @default 80 */
  points?: number;
  /** Longest residence time looked at, s. @default 1e4 times the chemistry's time scale */
  maxResidenceTime?: number;
}

/** A stage of a given train: its volume (m3) and, when not the feed's, its temperature (K). */
export interface ViewStage {
  type: StageType;
  volume: number;
  temperature?: number;
}

export interface TrainProfilePoint {
  /** Cumulative residence time from the train's inlet, s (volumes over the feed's v0). */
  residenceTime: number;
  concentrations: Record<string, number>;
}

export interface TrainProfileStage {
  type: StageType;
  /** Cumulative residence times at the stage's inlet and outlet, s (measured with the feed's v0). */
  startResidenceTime: number;
  endResidenceTime: number;
  /**
   * Tube: inlet .. outlet along it, evenly spaced in volume. Tank: [inlet at start, outlet at start,
   * outlet at end] (its contents are uniform and equal to the outlet). A stage of zero volume: two
   * points at the same time.
   */
  points: TrainProfilePoint[];
}

export interface NetworkTrainProfiles {
  species: string[];
  stages: TrainProfileStage[];
}

export interface NetworkTrainProfilesOptions {
  /** Points inside each tube besides its inlet and outlet. @default 30 */
  pointsPerStage?: number;
}

export interface FixedTrainStageRating {
  /** mol/m3 at the stage's temperature. */
  outlet: Record<string, number>;
  /** Present when a stirred tank has several steady states, lowest conversion first; the train continues from the first. */
  steadyStates?: { conversion: number; outlet: Record<string, number> }[];
}

export interface FixedTrainRating {
  conversion: number;
  yield: number | null;
  selectivity: number | null;
  /** mol/m3 at the last stage's temperature. */
  outlet: Record<string, number>;
  stages: FixedTrainStageRating[];
}

/** The chemistry every view takes: feed, phase, reactions, key reactant (thermal optional; quantities as numbers or strings with units). */
export type { NetworkSpec } from "../types";
