import { EngineError, ensure } from "../errors";
import { DIM, toSI } from "../units";
import { compileExpressionRate, compilePowerRate, type CompiledRate } from "./rate-laws";
import type { NetworkSpec } from "./types";

/** Largest network the engine takes. */
export const MAX_REACTIONS = 10;
export const MAX_SPECIES = 12;
const DEFAULT_TEMPERATURE = 298.15;

/** A network with every quantity in SI, in arrays indexed by species (i) and reaction (j). */
export interface ResolvedNetwork {
  species: readonly string[];
  index: ReadonlyMap<string, number>;
  nSpecies: number;
  nReactions: number;
  /** nu[i * nReactions + j]: coefficient of species i in reaction j. */
  nu: Float64Array;
  phase: "liquid" | "gas";
  /** Volumetric flow at the feed temperature, m3/s. */
  v0: number;
  /** Feed temperature, K. */
  T0: number;
  /** Feed concentrations, mol/m3, and molar flows, mol/s. */
  C0: Float64Array;
  F0: Float64Array;
  /** Total molar flow of the feed, mol/s. */
  FT0: number;
  /** Index of the key reactant. */
  key: number;
  rates: readonly CompiledRate[];
  /**
   * For each species, the reactions that consume it with a rate that does not vanish as it runs out
   * (a zero order in it, or an expression law): when it runs out those reactions stop.
   */
  depleting: readonly (readonly number[])[];
  /** Stage temperature bounds, K, in stageTemperature mode; null when isothermal. */
  temperatureBounds: { min: number; max: number } | null;
}

function nonNegative(value: number, what: string, path: string): number {
  ensure(value >= 0, `${what} must be zero or more`, path);
  return value;
}

/**
 * Reads and checks a network spec.
 * @throws EngineError naming the field at fault: a species not in the feed, a key reactant not fed or
 * never consumed, a negative constant, flow or concentration, a negative order, a bad unit, an expression
 * that does not parse.
 */
export function resolveNetwork(spec: NetworkSpec): ResolvedNetwork {
  ensure(spec.phase === "liquid" || spec.phase === "gas", 'the phase is "liquid" or "gas"', "phase");
  const feed = spec.feed;
  const v0 = toSI(feed.volumetricFlow, "m^3/s", "feed.volumetricFlow");
  ensure(v0 > 0, "the feed flow must be above zero", "feed.volumetricFlow");
  const T0 = feed.temperature === undefined ? DEFAULT_TEMPERATURE : toSI(feed.temperature, DIM.temperature, "feed.temperature");
  ensure(T0 > 0, "the feed temperature must be above absolute zero", "feed.temperature");
  const species = Object.keys(feed.concentrations ?? {});
  ensure(species.length >= 1, "list the feed concentration of every species (0 allowed)", "feed.concentrations");
  ensure(species.length <= MAX_SPECIES, `a network may have at most ${MAX_SPECIES} species`, "feed.concentrations");
  const index = new Map(species.map((s, i) => [s, i]));
  const n = species.length;
  const C0 = new Float64Array(n);
  species.forEach((s, i) => {
    const path = `feed.concentrations.${s}`;
    C0[i] = nonNegative(toSI(feed.concentrations[s], DIM.concentration, path), "a feed concentration", path);
  });
  const F0 = C0.map((c) => c * v0);
  const FT0 = F0.reduce((a, b) => a + b, 0);
  const key = index.get(spec.keyReactant);
  if (key === undefined) throw new EngineError("invalid-spec", `the key reactant "${spec.keyReactant}" is not in the feed`, "keyReactant");
  ensure(C0[key] > 0, `the key reactant "${spec.keyReactant}" must be fed (its feed concentration is zero)`, `feed.concentrations.${spec.keyReactant}`);
  const scale = Math.max(...C0);

  const reactions = spec.reactions ?? [];
  ensure(reactions.length >= 1, "give at least one reaction", "reactions");
  ensure(reactions.length <= MAX_REACTIONS, `a network may have at most ${MAX_REACTIONS} reactions`, "reactions");
  const m = reactions.length;
  const nu = new Float64Array(n * m);
  const rates: CompiledRate[] = reactions.map((r, j) => {
    const sp = `reactions.${j}.stoichiometry`;
    ensure(r.stoichiometry !== null && typeof r.stoichiometry === "object", "give the stoichiometry as a table of species and coefficients", sp);
    let changes = false;
    for (const [name, coefficient] of Object.entries(r.stoichiometry)) {
      const i = index.get(name);
      if (i === undefined) throw new EngineError("invalid-spec", `species "${name}" is not in the feed; list it there (0 allowed)`, `${sp}.${name}`);
      ensure(typeof coefficient === "number" && Number.isFinite(coefficient), "a stoichiometric coefficient must be a number", `${sp}.${name}`);
      nu[i * m + j] = coefficient;
      if (coefficient !== 0) changes = true;
    }
    ensure(changes, "a reaction must consume or form at least one species", sp);
    const ctx = { species, index, feedTemperature: T0, scale, path: `reactions.${j}.rate` };
    if (r.rate?.law === "power") return compilePowerRate(r.rate, ctx);
    if (r.rate?.law === "expression") return compileExpressionRate(r.rate, ctx);
    throw new EngineError("invalid-spec", 'the rate law is "power" or "expression"', `reactions.${j}.rate.law`);
  });

  let consumed = false;
  for (let j = 0; j < m; j++) if (nu[key * m + j] < 0) consumed = true;
  ensure(consumed, `no reaction consumes the key reactant "${spec.keyReactant}"`, "keyReactant");

  const depleting = species.map((_, i) => {
    const list: number[] = [];
    for (let j = 0; j < m; j++) {
      const c = nu[i * m + j];
      const law = rates[j];
      // A forward term with order 0 in what it consumes, or a reverse term with order 0 in what the
      // reverse direction consumes, keeps going at zero concentration; so may any expression.
      const forwardKeeps = c < 0 && law.forwardOrders[i] === 0;
      const reverseKeeps = c > 0 && law.reverseOrders !== null && law.reverseOrders[i] === 0;
      if ((c !== 0 && law.opaque) || (!law.opaque && (forwardKeeps || reverseKeeps))) list.push(j);
    }
    return list;
  });

  let temperatureBounds: ResolvedNetwork["temperatureBounds"] = null;
  if (spec.thermal?.mode === "stageTemperature") {
    const min = toSI(spec.thermal.min, DIM.temperature, "thermal.min");
    const max = toSI(spec.thermal.max, DIM.temperature, "thermal.max");
    ensure(min > 0, "the lowest stage temperature must be above absolute zero", "thermal.min");
    ensure(max >= min, "the highest stage temperature must be at least the lowest", "thermal.max");
    temperatureBounds = { min, max };
  } else ensure(spec.thermal === undefined || spec.thermal.mode === "isothermal", 'the thermal mode is "isothermal" or "stageTemperature"', "thermal.mode");

  return { species, index, nSpecies: n, nReactions: m, nu, phase: spec.phase, v0, T0, C0, F0, FT0, key, rates, depleting, temperatureBounds };
}
