/**
 * Stored chemistry of several reactions with every quantity as an SI number, for the editor to reopen.
 * A version may hold quantities as text with a unit ("1.2 mol/L", "3.6 m^3/h", the command line's form);
 * those are converted with the engine's unit reader, and where the text's unit is one the editor's
 * pickers offer (and the version names none for that field), that unit is kept as the one shown.
 * Pure; server side only (the engine's unit reader is not sent to the browser).
 */
import { DIM, toSI, type Quantity } from "@/lib/engine";
import type { NetworkKineticsSpec } from "@/lib/schemas/network-spec";
import { isUnit, UNITS, type UnitKind } from "./display";

/** "m^3/h" and "m3/h", "L/(mol*s)" and "L/(mol s)" are the same unit written two ways. */
const squeeze = (unit: string) => unit.replace(/[\s*^·]/g, "");

function pickerUnit(kind: UnitKind, text: Quantity): string | null {
  if (typeof text === "number") return null;
  const unit = /^\s*[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?\s*(.*?)\s*$/.exec(text)?.[1];
  if (!unit) return null;
  if (isUnit(kind, unit)) return unit;
  const alias = kind === "temperature" ? ({ degC: "degC", celsius: "degC", degF: "degF", fahrenheit: "degF" } as Record<string, string>)[unit] : undefined;
  if (alias) return alias;
  const found = Object.keys(UNITS[kind]).find((key) => squeeze(key) === squeeze(unit));
  return found ?? null;
}


/** A rate constant's concentration and time basis read from its unit text ("L/(mol*s)" → mol/L, s). */
function rateConstantUnit(text: Quantity): string | null {
  if (typeof text === "number") return null;
  const time = /\/\s*\(?[^)]*?\b(s|min|h)\)?\s*$/.exec(text)?.[1] ?? /\b(s|min|h)\b/.exec(text)?.[1];
  if (!time) return null;
  return `${/m\^?3/.test(text) ? "mol/m3" : "mol/L"}|${time}`;
}

const order = (orders: Record<string, number>) => Object.values(orders).reduce((a, b) => a + b, 0);
/** SI unit text of a rate constant of total order n, (m^3/mol)^(n-1)/s, in the engine's unit syntax. */
const rateConstantDimension = (n: number) => (Math.abs(n - 1) < 1e-12 ? "1/s" : `m^${3 * (n - 1)} / (mol^${n - 1} s)`);

/** The chemistry with SI numbers and the units shown; throws the engine's error for an unreadable quantity. */
export function networkKineticsInSI(spec: NetworkKineticsSpec): NetworkKineticsSpec {
  const shown: Record<string, string> = { ...(spec.shownUnits ?? {}) };
  const read = (value: Quantity, dimension: string, path: string, kind: UnitKind | "rateConstant") => {
    if (shown[path] === undefined) {
      const unit = kind === "rateConstant" ? rateConstantUnit(value) : pickerUnit(kind, value);
      if (unit) shown[path] = unit;
    }
    return toSI(value, dimension, path);
  };
  const readOptional = (value: Quantity | undefined, dimension: string, path: string, kind: UnitKind) => (value === undefined ? undefined : read(value, dimension, path, kind));
  const feed = spec.feed;
  const concentrations = Object.fromEntries(Object.entries(feed.concentrations).map(([name, c]) => [name, read(c, DIM.concentration, `feed.concentrations.${name}`, "concentration")]));
  const reactions = spec.reactions.map((reaction, j) => {
    const at = `reactions.${j}.rate`;
    const r = reaction.rate;
    if (r.law === "expression") return reaction;
    const reverse = r.reverse
      ? {
          ...r.reverse,
          k: read(r.reverse.k, rateConstantDimension(order(r.reverse.orders)), `${at}.reverse.k`, "rateConstant"),
          ...(r.reverse.activationEnergy !== undefined ? { activationEnergy: read(r.reverse.activationEnergy, DIM.energyPerMole, `${at}.reverse.activationEnergy`, "energyPerMol") } : {}),
          ...(r.reverse.referenceTemperature !== undefined ? { referenceTemperature: read(r.reverse.referenceTemperature, DIM.temperature, `${at}.reverse.referenceTemperature`, "temperature") } : {}),
        }
      : undefined;
    const activationEnergy = readOptional(r.activationEnergy, DIM.energyPerMole, `${at}.activationEnergy`, "energyPerMol");
    const referenceTemperature = readOptional(r.referenceTemperature, DIM.temperature, `${at}.referenceTemperature`, "temperature");
    return {
      ...reaction,
      rate: {
        ...r,
        k: read(r.k, rateConstantDimension(order(r.orders)), `${at}.k`, "rateConstant"),
        ...(activationEnergy !== undefined ? { activationEnergy } : {}),
        ...(referenceTemperature !== undefined ? { referenceTemperature } : {}),
        ...(reverse ? { reverse } : {}),
      },
    };
  });
  return {
    ...spec,
    feed: {
      volumetricFlow: read(feed.volumetricFlow, "m^3/s", "feed.volumetricFlow", "volumetricFlow"),
      concentrations,
      temperature: read(feed.temperature, DIM.temperature, "feed.temperature", "temperature"),
    },
    reactions,
    shownUnits: shown,
  };
}
