/**
 * Input and result types of the engine for reaction networks: several reactions, each with its own
 * stoichiometry and rate, among species named by the feed.
 *
 * Every quantity is SI unless a string with a unit is given (a {@link Quantity}, as in ../types.ts).
 */
import type { Quantity, StageType } from "../types";

/** Feed to the first stage. */
export interface NetworkFeedSpec {
  /** Volumetric flow v0 at the feed temperature, m3/s; must be > 0. */
  volumetricFlow: Quantity;
  /** Feed concentration of every species, inerts included, mol/m3 (0 allowed). The keys name the species. */
  concentrations: Record<string, Quantity>;
  /** Feed temperature T0, K. @default 298.15 */
  temperature?: Quantity;
}

/** Reverse term of a power-law rate: k_rev(T) prod C_j^b_j. */
export interface NetworkReverseSpec {
  /** Reverse rate constant at the reference temperature; must be >= 0. */
  k: Quantity;
  /** Orders of the reverse term by species, each >= 0. */
  orders: Record<string, number>;
  /** Activation energy of the reverse term, J/mol. @default 0 (the reverse term does not vary with temperature) */
  activationEnergy?: Quantity;
}

/** Power law: r = k(T) prod C_i^a_i - k_rev(T) prod C_j^b_j, mol/(m3 s). */
export interface NetworkPowerRate {
  law: "power";
  /** Forward rate constant at the reference temperature, (mol/m3)^(1-n)/s for total order n; must be >= 0. */
  k: Quantity;
  /** Forward orders by species, each >= 0. A species left out has order 0. */
  orders: Record<string, number>;
  reverse?: NetworkReverseSpec;
  /** Forward activation energy, J/mol. @default 0 */
  activationEnergy?: Quantity;
  /** Temperature at which both rate constants are given, K. @default the feed temperature */
  referenceTemperature?: Quantity;
}

/** A rate written as an expression of C_<species> (mol/m3), T (K) and the named parameters, mol/(m3 s). */
export interface NetworkExpressionRate {
  law: "expression";
  expression: string;
  /** Named numeric parameters (SI numbers or quantity strings). @default {} */
  parameters?: Record<string, Quantity>;
}

export type NetworkRateSpec = NetworkPowerRate | NetworkExpressionRate;

/** One reaction j: coefficients nu_ij (negative for what it consumes) and its rate r_j. */
export interface NetworkReaction {
  stoichiometry: Record<string, number>;
  rate: NetworkRateSpec;
}

/** Each stage isothermal at the feed temperature, or at its own temperature within bounds. */
export type NetworkThermalSpec = { mode: "isothermal" } | { mode: "stageTemperature"; min: Quantity; max: Quantity };

/** A reaction network, its feed and its phase. */
export interface NetworkSpec {
  feed: NetworkFeedSpec;
  /** Liquid: constant density. Gas: isobaric ideal gas, the volumetric flow follows total molar flow and T. */
  phase: "liquid" | "gas";
  /** 1..10 reactions. */
  reactions: NetworkReaction[];
  /** The species whose conversion is measured; must be fed and consumed by some reaction. */
  keyReactant: string;
  thermal?: NetworkThermalSpec;
}

/** Conversion, yield, selectivity and outlet concentrations of a stream (see measures.ts). */
export interface StreamMeasures {
  /** X = 1 - F_K / F_K0. */
  conversion: number;
  /** Y = (F_P - F_P0) / F_K0; null without a product. */
  yield: number | null;
  /** S = (F_P - F_P0) / (F_K0 - F_K); null without a product or at zero conversion. */
  selectivity: number | null;
  /** Concentration of every species at the stream's temperature, mol/m3. */
  outlet: Record<string, number>;
}

/** One steady state of a stirred tank. */
export interface NetworkSteadyState {
  /** Outlet molar flows, mol/s, in the network's species order. */
  flows: Float64Array;
  /** Conversion of the key reactant relative to the network's feed. */
  conversion: number;
  /**
   * Largest |F_out - F_in - V R(C_out)| over the species, relative to the largest flow in the balances
   * (the total flow in, or V |nu_ij| times a reaction's forward or reverse term when larger).
   */
  residual: number;
}

/** A point of a tube's profile. */
export interface ProfilePoint {
  volume: number;
  /** Residence time V / v0 measured at the feed, s. */
  residenceTime: number;
  flows: Float64Array;
}

/** What a tube gives. */
export interface PfrResult {
  /** Volume reached: the tube's, or less when asked to stop at the largest flow of a product. */
  volume: number;
  flows: Float64Array;
  /** "stopped" when the stop at a product's maximum was reached inside the tube. */
  status: "ok" | "stopped";
  /** Flows at the requested volumes (those before a stopping point). */
  profile: ProfilePoint[];
}

export type { StageType };
