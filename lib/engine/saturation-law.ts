import { arrheniusFactor } from "./arrhenius";
import { concentration, type ConcentrationBasis } from "./concentrations";
import type { RateFunction } from "./sizing-basis";

/** Resolved saturation kinetics (SI). ki is Infinity without substrate inhibition. */
export interface SaturationParameters {
  readonly vmax: number;
  readonly km: number;
  readonly ki: number;
  readonly activationEnergy: number;
  readonly referenceTemperature: number;
}

/** -rA = vmax C_A / (km + C_A + C_A^2/ki). */
export function saturationRate(p: SaturationParameters, basis: ConcentrationBasis): RateFunction {
  return (x, t) => {
    const ca = concentration(basis, 0, x, t);
    const v = p.vmax * arrheniusFactor(p.activationEnergy, p.referenceTemperature, t);
    return (v * ca) / (p.km + ca + (ca * ca) / p.ki);
  };
}
