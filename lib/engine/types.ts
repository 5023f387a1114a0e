/**
 * Input and output types of the Seriatim engine.
 *
 * Every quantity is SI unless a string with a unit is given (see {@link Quantity}).
 * The zod schema in lib/schemas/sweep-spec.ts is checked against these types at compile time.
 */

/**
 * A number in SI units, or a string holding a number and a unit, such as "2 mol/L",
 * "150 L", "1.2 m^3/h" or "80 degC". "M" (mol/L) and "mM" (mmol/L) are understood.
 */
export type Quantity = number | string;

/** The two ideal stage types. */
export type StageType = "CSTR" | "PFR";

/**
 * A stage of a one-reaction train: one of the two ideal stages, or a tube with part of its outlet
 * recycled to its inlet ("PFR-recycle", the trade's "tube with recycle"). Reaction networks use the two
 * ideal types only.
 */
export type TrainStageType = StageType | "PFR-recycle";

/** Feed to the first stage. */
export interface FeedSpec {
  /** Molar feed rate of the key reactant A, FA0, in mol/s. */
  flowA: Quantity;
  /** Feed concentration of A, CA0, in mol/m3. */
  concA: Quantity;
  /** Feed temperature T0 in K. @default 298.15 */
  temperature?: Quantity;
  /** Theta_i = C_i0 / C_A0 for every other species, inerts included (dimensionless). @default {} */
  ratios?: Record<string, number>;
}

/** Reverse term of a power-law rate. */
export interface ReverseTermSpec {
  /** Reverse rate constant at the reference temperature (SI units consistent with its orders); must be >= 0. */
  k: Quantity;
  /** Reaction orders of the reverse term, by species. */
  orders: Record<string, number>;
  /** Activation energy of the reverse term in J/mol; when absent the reverse term does not vary with temperature. */
  activationEnergy?: Quantity;
}

/** Power law: -rA = k(T) prod C_i^a_i - k_rev(T) prod C_j^b_j, in mol/(m3 s). */
export interface PowerLawSpec {
  law: "power";
  /** Forward rate constant at the reference temperature, (mol/m3)^(1-n)/s for total order n; must be > 0. */
  k: Quantity;
  /** Forward orders by species (dimensionless). */
  orders: Record<string, number>;
  /** Optional reverse term. */
  reverse?: ReverseTermSpec;
  /** Forward activation energy in J/mol (Arrhenius). @default 0 */
  activationEnergy?: Quantity;
  /** Temperature at which k (and the reverse k) are given, in K. @default the feed temperature */
  referenceTemperature?: Quantity;
}

/** Saturation kinetics: -rA = vmax C_A / (km + C_A + C_A^2/ki), in mol/(m3 s). */
export interface SaturationLawSpec {
  law: "saturation";
  /** Maximum rate in mol/(m3 s); must be > 0. */
  vmax: Quantity;
  /** Saturation constant in mol/m3; must be >= 0. */
  km: Quantity;
  /** Substrate inhibition constant in mol/m3; must be > 0. @default no inhibition */
  ki?: Quantity;
  /** Activation energy of vmax in J/mol. @default 0 */
  activationEnergy?: Quantity;
  /** Temperature at which vmax is given, in K. @default the feed temperature */
  referenceTemperature?: Quantity;
}

/**
 * A user expression for -rA in mol/(m3 s). Variables: C_<species> (mol/m3), T (K), X (conversion of A)
 * and the named parameters. Parsed and evaluated by mathjs, never by eval.
 */
export interface ExpressionLawSpec {
  law: "expression";
  /** The expression, for example "k*C_A*C_B/(1 + K*C_A)". */
  expression: string;
  /** Named numeric parameters (SI numbers or quantity strings). @default {} */
  parameters?: Record<string, Quantity>;
}

/** A table of measured -rA (mol/(m3 s)) against conversion, interpolated by PCHIP, never extrapolated. */
export interface TableLawSpec {
  law: "table";
  /** Conversions, strictly increasing, within [0, 1). */
  conversion: number[];
  /** Rates at those conversions, mol/(m3 s), > 0. */
  rate: number[];
}

/** One of the rate laws. */
export type RateLawSpec = PowerLawSpec | SaturationLawSpec | ExpressionLawSpec | TableLawSpec;

/** Isothermal operation at the feed temperature. */
export interface IsothermalSpec {
  mode: "isothermal";
}

/** A range of temperatures, K (min <= max; min = max fixes the temperature). */
export interface TemperatureRange {
  min: Quantity;
  max: Quantity;
}

/** Adiabatic operation: T = T_in + adiabaticRise (X - X_in) within a stage. */
export interface AdiabaticSpec {
  mode: "adiabatic";
  /** Adiabatic temperature rise for complete conversion of A, K (negative when endothermic). */
  adiabaticRise: Quantity;
  /** Highest temperature a stage may reach, K; a stage that exceeds it is infeasible. @default no limit */
  maxTemperature?: Quantity;
  /**
   * Inlet temperature of every stage after the first (interstage cooling or heating), K; a range lets the
   * design choose each later stage's inlet temperature within it. @default previous outlet
   */
  interstageTemperature?: Quantity | TemperatureRange;
  /**
   * First stage's inlet temperature chosen within this range (the feed heated or cooled before the first
   * stage); needs interstageTemperature. feed.temperature stays the temperature the feed is supplied at.
   * @default the feed temperature
   */
  feedTemperature?: TemperatureRange;
}

/**
 * Every stage held at its own temperature, chosen by the design within [min, max] (heat exchanged inside
 * the stage so its temperature does not change); min = max runs every stage at one temperature.
 */
export interface StageTemperatureSpec {
  mode: "stageTemperature";
  /** Lowest stage temperature, K. */
  min: Quantity;
  /** Highest stage temperature, K (the maximum temperature). */
  max: Quantity;
}

/** Thermal mode. */
export type ThermalSpec = IsothermalSpec | AdiabaticSpec | StageTemperatureSpec;

/** The reaction, its phase, rate law and thermal mode. */
export interface ReactionSpec {
  /** Stoichiometric coefficients per mole of A (A is -1, an inert 0). @default { A: -1 } */
  stoichiometry?: Record<string, number>;
  /** Phase: liquid (constant density) or isobaric ideal gas. @default "liquid" */
  phase?: "liquid" | "gas";
  /** Expansion factor epsilon (gas only); overrides (sum nu_i)/(sum Theta_i). @default from stoichiometry */
  epsilon?: number;
  /** The rate law for -rA. */
  rate: RateLawSpec;
  /** Thermal mode. @default isothermal */
  thermal?: ThermalSpec;
}

/** What the train must achieve. */
export interface TargetSpec {
  /** Outlet conversion of A, in (0, 1). */
  conversion: number;
}

/** Every sequence of 1..maxStages stages of the given types. */
export interface TrainRangeSpec {
  /** Longest sequence, 1..8. */
  maxStages: number;
  /** Stage types allowed. @default ["CSTR", "PFR"] */
  types?: TrainStageType[];
  /** All stages of a sequence have the same volume. @default false */
  equalVolume?: boolean;
  /**
   * Recycle ratio R (recycled flow over the flow leaving the stage, >= 0) of every tube with recycle.
   * @default chosen per stage with the conversions, for the least objective
   */
  recycleRatio?: number;
}

/** Exactly the listed sequences. */
export interface TrainCandidatesSpec {
  /** Sequences of stage types, each 1..8 long. */
  candidates: TrainStageType[][];
  /** All stages of a sequence have the same volume. @default false */
  equalVolume?: boolean;
  /**
   * Recycle ratio R (recycled flow over the flow leaving the stage, >= 0) of every tube with recycle.
   * @default chosen per stage with the conversions, for the least objective
   */
  recycleRatio?: number;
}

/** Every distinct ordering of a multiset of stages, e.g. { CSTR: 2, PFR: 1 }. */
export interface TrainMultisetSpec {
  /** How many stages of each type (1..8 in all). */
  multiset: Partial<Record<StageType, number>>;
  /** All stages of a sequence have the same volume. @default false */
  equalVolume?: boolean;
}

/** The space of trains to search. */
export type TrainSpec = TrainRangeSpec | TrainCandidatesSpec | TrainMultisetSpec;

/** Installed cost of one vessel: a + b * S^n, S its volume in m3 (currency of the user's choice). */
export interface VesselCostSpec {
  /** Fixed part, >= 0. */
  a: number;
  /** Size factor, >= 0. */
  b: number;
  /** Size exponent, > 0 (often near 0.6). */
  n: number;
}

/** Minimise total volume. */
export interface VolumeObjectiveSpec {
  minimise: "volume";
}

/** Minimise total vessel cost. */
export interface CostObjectiveSpec {
  minimise: "cost";
  /** Cost correlation per stage type; each type used needs one. */
  vessels: Partial<Record<StageType, VesselCostSpec>>;
  /** Volumes one can buy, m3; a vessel is rounded up to the next size. @default any size */
  standardSizes?: Quantity[];
  /** Largest single vessel, m3; a larger stage is split into the fewest identical parallel vessels. @default no limit */
  maxVesselVolume?: Quantity;
}

/** The objective. @default minimise volume */
export type ObjectiveSpec = VolumeObjectiveSpec | CostObjectiveSpec;

/** A design request: the CLI's input and the engine's. */
export interface DesignSpec {
  feed: FeedSpec;
  reaction: ReactionSpec;
  target: TargetSpec;
  train: TrainSpec;
  objective?: ObjectiveSpec;
}

/** Vessels that make up one stage. */
export interface VesselSet {
  /** Number of identical vessels in parallel. */
  count: number;
  /** Volume of each vessel as bought, m3 (a standard size when sizes are given). */
  sizeEach: number;
}

/** A point of a Levenspiel plot: [X, FA0/(-rA) in m3]. */
export type PlotPoint = [number, number];

/** Levenspiel plot of one stage. */
export interface StagePlot {
  /** FA0/(-rA) against X along the stage's own temperature path (at most 33 points). */
  curve: PlotPoint[];
  /**
   * Closed outline of the stage's volume: the rectangle of a CSTR, the area under the curve of a PFR; for
   * a tube with recycle the rectangle over [X_in, X_out] whose height is the mean of FA0/(-rA) over the
   * tube, [X_1, X_out] (its area is the volume).
   */
  area: PlotPoint[];
  /** A tube with recycle only: where its tube starts and the area under the curve it integrates. */
  recycle?: RecyclePlot;
}

/**
 * The other half of a tube with recycle's Levenspiel geometry: the area under the curve from the tube's
 * inlet conversion X_1 to X_out. Stretched by (R + 1) it equals the stage's rectangle.
 */
export interface RecyclePlot {
  /** Recycle ratio R. */
  recycleRatio: number;
  /** Conversion at the tube's inlet, after the recycle is mixed in: X_1 = (X_in + R X_out)/(R + 1). */
  inletConversion: number;
  /** Closed outline of the area under the curve from X_1 to X_out. */
  underCurve: PlotPoint[];
}

/** One designed stage. */
export interface StageResult {
  type: TrainStageType;
  /** Conversion of A at the inlet. */
  conversionIn: number;
  /** Conversion of A at the outlet. */
  conversionOut: number;
  /** Inlet temperature, K. */
  temperatureIn: number;
  /** Outlet temperature, K. */
  temperatureOut: number;
  /** Reaction volume, m3. */
  volume: number;
  /** Residence time (space time) tau = volume / v0, with v0 = FA0/CA0 the feed volumetric flow; s. */
  residenceTime: number;
  /** Vessels bought for this stage. */
  vessels: VesselSet;
  /** Cost of this stage's vessels (cost objective), else null. */
  cost: number | null;
  /** Levenspiel plot data. */
  levenspiel: StagePlot;
  /** Recycle ratio R of a tube with recycle (recycled flow over the flow leaving the stage); absent for other types. */
  recycleRatio?: number;
  /** True when the design chose this stage's inlet temperature (temperatureIn) within a given range. */
  temperatureChosen?: boolean;
}

/** One ranked sequence. */
export interface CandidateResult {
  /** 1 = best. */
  rank: number;
  sequence: TrainStageType[];
  /** Whether the sequence reaches the target within the limits. */
  feasible: boolean;
  /** Total reaction volume, m3; null when infeasible. */
  totalVolume: number | null;
  /** Total vessel cost (cost objective); null otherwise or when infeasible. */
  totalCost: number | null;
  /**
   * Conversion the train reaches: the target, or more with standard sizes (every vessel used full);
   * null when infeasible.
   */
  conversionReached?: number | null;
  /** Why the sequence is infeasible; null when feasible. */
  reason: string | null;
  /**
   * Stages whose conversion step is negligible (below 1e-6): the train is a shorter one padded with
   * vessels that do nothing, ranked after every train without such a stage. Absent in older results.
   */
  emptyStages?: number;
  /** Stages; empty when infeasible. */
  stages: StageResult[];
  /**
   * Total volume over the best temperature path's volume (>= 1), when the result has that reference;
   * null when infeasible or without one.
   */
  volumeOverBestPath?: number | null;
}

/** One point of the best temperature path. */
export interface BestPathPoint {
  /** Conversion of A. */
  conversion: number;
  /** Temperature of the highest rate at this conversion within the allowed range, K. */
  temperature: number;
  /** Equilibrium temperature at this conversion (net rate zero), K; absent where there is none. */
  equilibriumTemperature?: number;
}

/**
 * The best temperature path: a tube whose temperature at every conversion is the one of the highest rate
 * (within the lowest and highest temperatures allowed). Its volume is the least any train can have.
 */
export interface BestTemperaturePath {
  /** FA0 * integral from 0 to the target of dX/(-rA(X, T_best(X))), m3. */
  volume: number;
  /** Lowest and highest temperatures the path may take, K. */
  lowestTemperature: number;
  highestTemperature: number;
  /** Points from X = 0 to the target, for a conversion–temperature chart with the equilibrium line. */
  points: BestPathPoint[];
}

/** Single-stage references from feed to target, m3 (null when a single stage cannot do it). */
export interface ReferenceResult {
  singleCSTR: number | null;
  singlePFR: number | null;
  /**
   * The best temperature path, for a reversible exothermic power law with Arrhenius terms and a highest
   * temperature (maxTemperature or the top of a stage temperature range); null otherwise. Absent in older results.
   */
  bestTemperaturePath?: BestTemperaturePath | null;
}

/** The engine's answer to a design request. */
export interface DesignResult {
  candidates: CandidateResult[];
  reference: ReferenceResult;
  /** Equilibrium conversion along the first stage's temperature path, when the rate has a reverse term. */
  equilibriumConversion?: number;
  /** Feed volumetric flow v0 = FA0/CA0, m3/s. */
  feedVolumetricFlow: number;
  /** Objective used. */
  objective: "volume" | "cost";
  /** Limits of the models; always shown with results. */
  cautions: string[];
}

/** A stage given by volume, for rating. */
export interface RatingStageSpec {
  type: TrainStageType;
  /** Reaction volume, m3. */
  volume: Quantity;
  /** Recycle ratio R (>= 0) of a tube with recycle; required for that type, not allowed for others. */
  recycleRatio?: number;
}

/** A rating request: given volumes, find outlet conversions. */
export interface RatingSpec {
  feed: FeedSpec;
  reaction: ReactionSpec;
  /** The stages in order. */
  stages: RatingStageSpec[];
}

/** One steady state of a rated stage. */
export interface SteadyState {
  conversionOut: number;
  temperatureOut: number;
}

/** One rated stage. */
export interface RatedStage {
  type: TrainStageType;
  volume: number;
  /** Recycle ratio R of a tube with recycle; absent for other types. */
  recycleRatio?: number;
  conversionIn: number;
  temperatureIn: number;
  /** Every steady state found (a PFR has one; an adiabatic CSTR may have up to three or more). */
  steadyStates: SteadyState[];
  /** True when the stage has more than one steady state. */
  multiple: boolean;
  /** The steady state passed on to the next stage: the one of lowest conversion (reached from a cold start). */
  conversionOut: number;
  temperatureOut: number;
}

/** The engine's answer to a rating request. */
export interface RatingResult {
  stages: RatedStage[];
  conversionOut: number;
  cautions: string[];
}
