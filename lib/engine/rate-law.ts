import { buildBasis, buildSpecies, type ConcentrationBasis } from "./concentrations";
import { EngineError, ensure } from "./errors";
import { expressionRate } from "./expression-law";
import type { RateFunction } from "./sizing-basis";
import { buildPchip, evaluatePchip } from "./pchip";
import { powerLawRate, resolveOrders, type PowerTerm } from "./power-law";
import { saturationRate } from "./saturation-law";
import type { FeedSpec, PowerLawSpec, ReactionSpec, TableLawSpec } from "./types";
import { anyToSI, DIM, rateConstantDimension, toSI } from "./units";

const P = "reaction.rate";

/** The rate law resolved for one feed: the function and what the checks need to know about it. */
export interface ResolvedRate {
  readonly rate: RateFunction;
  readonly basis: ConcentrationBasis;
  readonly temperatureDependent: boolean;
  readonly reversible: boolean;
  /** Conversion range of a rate table, else [0, 1]. */
  readonly range: readonly [number, number];
}

function positive(value: number, message: string, path: string): number {
  ensure(value > 0, message, path);
  return value;
}

function nonNegative(value: number, message: string, path: string): number {
  ensure(value >= 0, message, path);
  return value;
}

function powerTerm(
  k: PowerLawSpec["k"],
  orders: Record<string, number>,
  ea: PowerLawSpec["activationEnergy"],
  basis: ConcentrationBasis,
  path: string,
  strict: boolean,
): PowerTerm {
  const { index, order } = resolveOrders(orders, basis, `${path}.orders`);
  const total = order.reduce((s, v) => s + v, 0);
  const kValue = toSI(k, rateConstantDimension(total), `${path}.k`);
  if (strict) positive(kValue, "rate constant k must be > 0", `${path}.k`);
  else nonNegative(kValue, "rate constant k must be >= 0", `${path}.k`);
  const activationEnergy = nonNegative(
    toSI(ea ?? 0, DIM.energyPerMole, `${path}.activationEnergy`),
    "activation energy must be >= 0",
    `${path}.activationEnergy`,
  );
  return { k: kValue, index, order, activationEnergy };
}

function referenceTemperature(value: PowerLawSpec["referenceTemperature"], t0: number): number {
  if (value === undefined) return t0;
  const t = toSI(value, DIM.temperature, `${P}.referenceTemperature`);
  return positive(t, "reference temperature must be > 0 K", `${P}.referenceTemperature`);
}

function tableRate(law: TableLawSpec): { rate: RateFunction; range: [number, number] } {
  const { conversion: xs, rate: rs } = law;
  ensure(xs.length >= 2, "a rate table needs at least two points", `${P}.conversion`);
  ensure(rs.length === xs.length, "rate and conversion lists must have the same length", `${P}.rate`);
  xs.forEach((x, i) => {
    ensure(Number.isFinite(x) && x >= 0 && x < 1, "table conversions must be within [0, 1)", `${P}.conversion.${i}`);
    ensure(i === 0 || x > xs[i - 1], "table conversions must be strictly increasing", `${P}.conversion.${i}`);
  });
  rs.forEach((r, i) => ensure(Number.isFinite(r) && r > 0, "table rates must be finite and > 0", `${P}.rate.${i}`));
  ensure(xs[0] === 0, `the rate table starts at X = ${xs[0]}; it must start at the feed, X = 0`, `${P}.conversion.0`);
  const p = buildPchip(xs, rs);
  return { rate: (x) => evaluatePchip(p, x), range: [xs[0], xs[xs.length - 1]] };
}

/** Resolves and checks the rate law of a reaction for a given feed. */
export function resolveRate(reaction: ReactionSpec, feed: FeedSpec, ca0: number, t0: number): ResolvedRate {
  const law = reaction.rate;
  const species = buildSpecies(reaction.stoichiometry, feed.ratios, []);
  const basis = buildBasis(species, reaction.phase ?? "liquid", ca0, t0, reaction.epsilon);
  const gas = basis.epsilon !== 0 || (reaction.phase ?? "liquid") === "gas";
  const full: [number, number] = [0, 1];
  switch (law.law) {
    case "power": {
      const tref = referenceTemperature(law.referenceTemperature, t0);
      const fwd = powerTerm(law.k, law.orders, law.activationEnergy, basis, P, true);
      const rev = law.reverse ? powerTerm(law.reverse.k, law.reverse.orders, law.reverse.activationEnergy, basis, `${P}.reverse`, false) : null;
      return {
        rate: powerLawRate(fwd, rev, basis, tref),
        basis,
        temperatureDependent: gas || fwd.activationEnergy > 0 || (rev?.activationEnergy ?? 0) > 0,
        reversible: rev !== null && rev.k > 0,
        range: full,
      };
    }
    case "saturation": {
      const vmax = positive(toSI(law.vmax, DIM.rate, `${P}.vmax`), "vmax must be > 0", `${P}.vmax`);
      const km = nonNegative(toSI(law.km, DIM.concentration, `${P}.km`), "km must be >= 0", `${P}.km`);
      const ki = law.ki === undefined ? Infinity : positive(toSI(law.ki, DIM.concentration, `${P}.ki`), "ki must be > 0", `${P}.ki`);
      const ea = nonNegative(toSI(law.activationEnergy ?? 0, DIM.energyPerMole, `${P}.activationEnergy`), "activation energy must be >= 0", `${P}.activationEnergy`);
      const tref = referenceTemperature(law.referenceTemperature, t0);
      return {
        rate: saturationRate({ vmax, km, ki, activationEnergy: ea, referenceTemperature: tref }, basis),
        basis,
        temperatureDependent: gas || ea > 0,
        reversible: false,
        range: full,
      };
    }
    case "expression": {
      const params: Record<string, number> = {};
      for (const [name, v] of Object.entries(law.parameters ?? {})) {
        ensure(/^[A-Za-z][A-Za-z0-9_]*$/.test(name), `parameter name "${name}" is not a plain identifier`, `${P}.parameters.${name}`);
        params[name] = anyToSI(v, `${P}.parameters.${name}`);
      }
      ensure(law.expression.trim().length > 0, "the rate expression is empty", `${P}.expression`);
      return { rate: expressionRate(law.expression, params, basis), basis, temperatureDependent: true, reversible: false, range: full };
    }
    case "table": {
      const t = tableRate(law);
      return { rate: t.rate, basis, temperatureDependent: false, reversible: false, range: t.range };
    }
    default:
      throw new EngineError("invalid-spec", "unknown rate law", `${P}.law`);
  }
}

