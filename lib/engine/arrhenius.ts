/** Gas constant, J/(mol K) (CODATA 2018 exact value). */
export const GAS_CONSTANT = 8.314462618;

/** Arrhenius factor k(T)/k(Tref) = exp(-Ea/R (1/T - 1/Tref)). */
export function arrheniusFactor(activationEnergy: number, referenceTemperature: number, temperature: number): number {
  if (activationEnergy === 0) return 1;
  return Math.exp((-activationEnergy / GAS_CONSTANT) * (1 / temperature - 1 / referenceTemperature));
}
