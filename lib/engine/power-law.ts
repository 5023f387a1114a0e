import { GAS_CONSTANT } from "./arrhenius";
import { concentration, type ConcentrationBasis } from "./concentrations";
import { ensure } from "./errors";
import type { RateFunction } from "./sizing-basis";

/** A resolved power-law term: k(Tref), orders by species index, activation energy. */
export interface PowerTerm {
  readonly k: number;
  readonly index: readonly number[];
  readonly order: readonly number[];
  readonly activationEnergy: number;
}

/** Checks a map of orders and turns it into species indices; orders must be finite and within +-10. */
export function resolveOrders(
  orders: Record<string, number>,
  basis: ConcentrationBasis,
  path: string,
): { index: number[]; order: number[] } {
  const index: number[] = [];
  const order: number[] = [];
  for (const [name, value] of Object.entries(orders)) {
    const i = basis.species.names.indexOf(name);
    ensure(i >= 0, `unknown species "${name}": name it in reaction.stoichiometry or feed.ratios`, `${path}.${name}`);
    ensure(Number.isFinite(value) && Math.abs(value) <= 10, `order of ${name} must be a finite number within -10..10`, `${path}.${name}`);
    if (value === 0) continue;
    // A negative order is an inhibition term; it needs the species present from the feed on.
    ensure(
      value > 0 || basis.species.theta[i] > 0,
      `order of ${name} is negative but ${name} is absent from the feed, so the rate would be infinite`,
      `${path}.${name}`,
    );
    index.push(i);
    order.push(value);
  }
  return { index, order };
}

/** k(T) prod C_i^a_i for one term; `inverseT` is 1/T - 1/Tref (shared by the forward and reverse terms). */
function termValue(term: PowerTerm, eOverR: number, basis: ConcentrationBasis, inverseT: number, x: number, t: number): number {
  let v = eOverR === 0 ? term.k : term.k * Math.exp(-eOverR * inverseT);
  for (let j = 0; j < term.index.length; j++) {
    v *= Math.pow(concentration(basis, term.index[j], x, t), term.order[j]);
  }
  return v;
}

/** -rA = k(T) prod C_i^a_i - k_rev(T) prod C_j^b_j, with Arrhenius factors exp(-Ea/R (1/T - 1/Tref)). */
export function powerLawRate(
  forward: PowerTerm,
  reverse: PowerTerm | null,
  basis: ConcentrationBasis,
  referenceTemperature: number,
): RateFunction {
  const tinv = 1 / referenceTemperature;
  const ef = forward.activationEnergy / GAS_CONSTANT;
  if (reverse === null) return (x, t) => termValue(forward, ef, basis, 1 / t - tinv, x, t);
  const er = reverse.activationEnergy / GAS_CONSTANT;
  return (x, t) => {
    const u = 1 / t - tinv;
    return termValue(forward, ef, basis, u, x, t) - termValue(reverse, er, basis, u, x, t);
  };
}
