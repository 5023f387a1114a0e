import { EngineError, ensure } from "./errors";

/** Species data for concentrations: Theta_i and nu_i by species, A first. */
export interface SpeciesTable {
  readonly names: readonly string[];
  readonly theta: readonly number[];
  readonly nu: readonly number[];
}

/** Concentration basis: C_i = ca0 (theta_i + nu_i X) * factor(X, T). */
export interface ConcentrationBasis {
  readonly species: SpeciesTable;
  /** Multiplier of (theta_i + nu_i X): CA0 for a liquid, CA0/(1 + eps X) T0/T for a gas. */
  readonly factor: (x: number, temperature: number) => number;
  readonly epsilon: number;
}

/** Builds the species table from stoichiometry and feed ratios (A first, Theta_A = 1, nu_A = -1). */
export function buildSpecies(
  stoichiometry: Record<string, number> | undefined,
  ratios: Record<string, number> | undefined,
  extraNames: readonly string[],
): SpeciesTable {
  const stoich = stoichiometry ?? { A: -1 };
  if (stoich.A !== undefined) {
    ensure(stoich.A === -1, "stoichiometry is per mole of A, so A must be -1", "reaction.stoichiometry.A");
  }
  const names = ["A"];
  for (const n of [...Object.keys(stoich), ...Object.keys(ratios ?? {}), ...extraNames]) {
    if (!names.includes(n)) names.push(n);
  }
  for (const [n, v] of Object.entries(stoich)) {
    ensure(Number.isFinite(v), `stoichiometric coefficient of ${n} must be a finite number`, `reaction.stoichiometry.${n}`);
  }
  for (const [n, v] of Object.entries(ratios ?? {})) {
    ensure(Number.isFinite(v) && v >= 0, `feed ratio of ${n} must be a finite number >= 0`, `feed.ratios.${n}`);
  }
  ensure(ratios?.A === undefined || ratios.A === 1, "the feed ratio of A is 1 by definition", "feed.ratios.A");
  return {
    names,
    theta: names.map((n) => (n === "A" ? 1 : (ratios?.[n] ?? 0))),
    nu: names.map((n) => (n === "A" ? -1 : (stoich[n] ?? 0))),
  };
}

/** Largest conversion before some species' concentration would turn negative. */
export function stoichiometricLimit(species: SpeciesTable): number {
  let limit = 1;
  species.nu.forEach((nu, i) => {
    if (nu < 0) limit = Math.min(limit, species.theta[i] / -nu);
  });
  return limit;
}

/** epsilon = (sum nu_i)/(sum Theta_i) with Theta_A = 1 (inerts count in the denominator). */
export function epsilonFromStoichiometry(species: SpeciesTable): number {
  const sumNu = species.nu.reduce((s, v) => s + v, 0);
  const sumTheta = species.theta.reduce((s, v) => s + v, 0);
  return sumNu / sumTheta;
}

/** Builds the concentration basis for a liquid (constant density) or an isobaric ideal gas. */
export function buildBasis(
  species: SpeciesTable,
  phase: "liquid" | "gas",
  ca0: number,
  t0: number,
  epsilonGiven: number | undefined,
): ConcentrationBasis {
  if (phase === "liquid") {
    if (epsilonGiven !== undefined && epsilonGiven !== 0) {
      throw new EngineError("invalid-spec", "epsilon applies to a gas only; a liquid has constant density", "reaction.epsilon");
    }
    return { species, factor: () => ca0, epsilon: 0 };
  }
  const eps = epsilonGiven ?? epsilonFromStoichiometry(species);
  ensure(Number.isFinite(eps) && eps > -1, "epsilon must be a finite number > -1", "reaction.epsilon");
  return { species, factor: (x, t) => ((ca0 / (1 + eps * x)) * t0) / t, epsilon: eps };
}

/** Concentration of species i, mol/m3 (clamped at zero against round-off at a limiting reactant). */
export function concentration(basis: ConcentrationBasis, i: number, x: number, temperature: number): number {
  const c = basis.species.theta[i] + basis.species.nu[i] * x;
  return c <= 0 ? 0 : c * basis.factor(x, temperature);
}
