import { anyToSI, DIM, rateConstantDimension, toSI, toTemperatureDifference } from "@/lib/engine/units";
import type { KineticsSpec } from "@/lib/schemas/sweeps";

type Q = number | string;
const sum = (r: Record<string, number>) => Object.values(r).reduce((a, b) => a + b, 0);
const opt = (v: Q | undefined, f: (v: Q) => number) => (v === undefined ? undefined : f(v));

/**
 * A stored kinetics spec with every quantity as an SI number (specs written through the API
 * may hold strings such as "1 mol/L" or "66.85 degC"), for the editor's unit pickers.
 * Import it from server components only: the unit parser stays out of the browser bundle.
 */
export function normaliseKineticsSpec(spec: KineticsSpec): KineticsSpec {
  const f = spec.feed;
  const r = spec.reaction.rate;
  const t = spec.reaction.thermal;
  const T = (v: Q) => toSI(v, DIM.temperature, "T");
  const E = (v: Q) => toSI(v, DIM.energyPerMole, "E");
  let rate: KineticsSpec["reaction"]["rate"] = r;
  if (r.law === "power") {
    rate = {
      ...r,
      k: toSI(r.k, rateConstantDimension(sum(r.orders)), "k"),
      ...(r.reverse
        ? { reverse: { ...r.reverse, k: toSI(r.reverse.k, rateConstantDimension(sum(r.reverse.orders)), "k"), activationEnergy: opt(r.reverse.activationEnergy, E) } }
        : {}),
      activationEnergy: opt(r.activationEnergy, E),
      referenceTemperature: opt(r.referenceTemperature, T),
    };
  } else if (r.law === "saturation") {
    rate = {
      ...r,
      vmax: toSI(r.vmax, DIM.rate, "vmax"),
      km: toSI(r.km, DIM.concentration, "km"),
      ki: opt(r.ki, (v) => toSI(v, DIM.concentration, "ki")),
      activationEnergy: opt(r.activationEnergy, E),
      referenceTemperature: opt(r.referenceTemperature, T),
    };
  } else if (r.law === "expression" && r.parameters) {
    rate = { ...r, parameters: Object.fromEntries(Object.entries(r.parameters).map(([k, v]) => [k, anyToSI(v, k)])) };
  }
  return {
    ...(spec.shownUnits ? { shownUnits: spec.shownUnits } : {}),
    feed: {
      ...f,
      flowA: toSI(f.flowA, DIM.molarFlow, "flowA"),
      concA: toSI(f.concA, DIM.concentration, "concA"),
      temperature: opt(f.temperature, T),
    },
    reaction: {
      ...spec.reaction,
      rate,
      thermal:
        t?.mode === "adiabatic"
          ? {
              mode: "adiabatic",
              adiabaticRise: toTemperatureDifference(t.adiabaticRise, "rise"),
              maxTemperature: opt(t.maxTemperature, T),
              interstageTemperature: opt(t.interstageTemperature, T),
            }
          : t,
    },
  };
}
