/** -rA in mol/(m3 s) at conversion x and temperature T (K). */
export type RateFunction = (x: number, temperature: number) => number;

/**
 * The resolved, validated problem in SI numbers: everything a stage calculation needs.
 * Internal to the engine; built by resolveSizingBasis from a spec.
 */
export interface SizingBasis {
  /** FA0, mol/s. */
  readonly fa0: number;
  /** CA0, mol/m3. */
  readonly ca0: number;
  /** v0 = FA0/CA0, m3/s. */
  readonly v0: number;
  /** Feed temperature, K. */
  readonly t0: number;
  /** -rA(x, T). */
  readonly rate: RateFunction;
  /** Whether the rate depends on temperature at all (skips derivative work when false). */
  readonly temperatureDependent: boolean;
  /** Whether the rate law has a reverse term. */
  readonly reversible: boolean;
  /** Adiabatic rise, K (0 when isothermal). */
  readonly rise: number;
  /** Inlet temperature of every stage after the first, K, or null to carry the previous outlet. */
  readonly interstage: number | null;
  /** Highest temperature allowed, K (Infinity when none). */
  readonly maxTemperature: number;
  /** Largest conversion the stoichiometry allows (a limiting co-reactant), <= 1. */
  readonly maxConversion: number;
  /** Largest conversion where the rate is defined: maxConversion, or a rate table's last point. */
  readonly upper: number;
  /** Stage inlet temperatures the design chooses within ranges (see TemperatureChoice); absent when all are given. */
  readonly choice?: TemperatureChoice;
  /**
   * Set on a basis made for one stage at one inlet temperature (stage-temperature.ts): its path belongs to that
   * stage alone, so no per-basis table of the feed path is built for it.
   */
  readonly ownPath?: boolean;
}

/** Lowest and highest inlet temperature a stage may be given, K. */
export type TemperatureBounds = readonly [number, number];

/**
 * Inlet temperatures chosen by the design: the first stage's range (null: the feed temperature) and every
 * later stage's (null: the interstage temperature, or the previous outlet).
 */
export interface TemperatureChoice {
  readonly first: TemperatureBounds | null;
  readonly later: TemperatureBounds | null;
}

/** The range a stage's inlet temperature is chosen in, or null when it is given. */
export function chosenRange(basis: SizingBasis, first: boolean): TemperatureBounds | null {
  if (!basis.choice) return null;
  return first ? basis.choice.first : basis.choice.later;
}

/** Inlet temperature of a stage starting at conversion a. */
export function inletTemperature(basis: SizingBasis, first: boolean, a: number): number {
  if (first) return basis.t0;
  if (basis.interstage !== null) return basis.interstage;
  return basis.t0 + basis.rise * a;
}

/** Temperature at conversion x inside a stage that starts at a. */
export function stageTemperature(basis: SizingBasis, first: boolean, a: number, x: number): number {
  return inletTemperature(basis, first, a) + basis.rise * (x - a);
}

/** True when a stage's temperature path does not depend on where it starts (no interstage reset). */
export function sharedPath(basis: SizingBasis): boolean {
  if (basis.choice || basis.ownPath) return false;
  return basis.interstage === null || basis.rise === 0 && basis.interstage === basis.t0;
}
