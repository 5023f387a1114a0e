/**
 * The units the engineer typed a kinetics model in, by kind of quantity. The stored kinetics spec
 * keeps SI numbers and, beside them, `shownUnits`: the unit picked per field ("feed.flowA" →
 * "kmol/h", "reaction.rate.k" → "mol/L|h" for a rate constant's concentration and time basis).
 * Displays that offer "as typed in the kinetics" read the engineer's units from here. Pure.
 */
import { isUnit, type UnitKind } from "./display";

/** The part of a kinetics spec this reads; older stored models have no `shownUnits`. */
export interface WithShownUnits {
  shownUnits?: Record<string, string>;
}

/** Separates a rate constant's concentration basis from its time basis in `shownUnits`. */
export const RATE_CONSTANT_UNIT_SEPARATOR = "|";

/** The concentration and time basis of a rate constant's stored unit, e.g. "mol/L|h". */
export function splitRateConstantUnit(stored: string | undefined): { conc: string; time: string } | null {
  if (!stored) return null;
  const [conc, time] = stored.split(RATE_CONSTANT_UNIT_SEPARATOR);
  return conc && time && isUnit("concentration", conc) && isUnit("time", time) ? { conc, time } : null;
}

/** The engineer's units by kind; a kind the model does not tell is left out. */
export function typedUnits(spec: WithShownUnits | null | undefined): Partial<Record<UnitKind, string>> {
  const shown = spec?.shownUnits ?? {};
  const out: Partial<Record<UnitKind, string>> = {};
  const take = (kind: UnitKind, field: string) => {
    const unit = shown[field];
    if (unit && isUnit(kind, unit)) out[kind] = unit;
  };
  take("molarFlow", "feed.flowA");
  take("concentration", "feed.concA");
  take("temperature", "feed.temperature");
  take("energyPerMol", "reaction.rate.activationEnergy");
  const k = splitRateConstantUnit(shown["reaction.rate.k"]);
  if (k) out.time = k.time;
  // A model of several reactions keeps a unit per species and per reaction: the first of each tells.
  const keys = Object.keys(shown);
  const conc = keys.find((f) => f.startsWith("feed.concentrations."));
  if (!out.concentration && conc) take("concentration", conc);
  const rateK = keys.find((f) => /^reactions\.\d+\.rate\.k$/.test(f));
  const kn = rateK ? splitRateConstantUnit(shown[rateK]) : null;
  if (!out.time && kn) out.time = kn.time;
  if (!out.energyPerMol) {
    const ea = keys.find((f) => /^reactions\.\d+\.rate\.activationEnergy$/.test(f));
    if (ea) take("energyPerMol", ea);
  }
  // A concentration per litre says the engineer thinks in litres; otherwise cubic metres.
  if (out.concentration) out.volume = /\/L$/.test(out.concentration) ? "L" : "m3";
  return out;
}
