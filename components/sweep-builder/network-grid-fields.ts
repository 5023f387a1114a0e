/**
 * The numeric inputs of a model of several reactions that a sweep may vary, by their paths in the
 * engine's spec (array indices and species names included), with the field labels and units the rest
 * of the app uses. Pure.
 */
import { labelFor } from "@/lib/schemas/field-labels";
import { isUnit, type UnitKind } from "@/lib/units/display";

/** What the grid needs of a model: its species, its reactions' rate terms and the units it was typed in. */
export interface NetworkGridSource {
  species: string[];
  reactions: { power: boolean; reverse: boolean; arrhenius: boolean }[];
  units?: Partial<Record<UnitKind, string>>;
}

export interface NetworkGridField {
  /** The input's path in the engine's spec (array indices and species names included). */
  field: string;
  label: string;
  kind: UnitKind | null;
  defaultUnit: string;
}

const gridField = (field: string, kind: UnitKind | null, defaultUnit: string, basis?: string): NetworkGridField => ({
  field,
  label: basis ? `${labelFor(field)} (${basis})` : labelFor(field),
  kind,
  defaultUnit,
});

/**
 * The numeric inputs of a network model one may vary: each reaction's rate constants and activation
 * energy, the feed's flow, concentrations and temperature, and the limits. Labels are the field
 * labels the rest of the app uses; units start in the ones the model was typed in.
 */
export function networkGridFields(version: NetworkGridSource): NetworkGridField[] {
  const typed = version.units ?? {};
  const unit = (kind: UnitKind, fallback: string) => (typed[kind] && isUnit(kind, typed[kind]!) ? typed[kind]! : fallback);
  const out: NetworkGridField[] = [];
  version.reactions.forEach((r, j) => {
    if (!r.power) return;
    // A rate constant's unit depends on its reaction's order: the engine keeps it on a m³, mol, s basis.
    out.push(gridField(`reactions.${j}.rate.k`, null, "", "m³, mol, s basis"));
    if (r.reverse) out.push(gridField(`reactions.${j}.rate.reverse.k`, null, "", "m³, mol, s basis"));
    out.push(gridField(`reactions.${j}.rate.activationEnergy`, "energyPerMol", unit("energyPerMol", "kJ/mol")));
  });
  out.push(gridField("feed.volumetricFlow", null, "", "m³/s"));
  for (const s of version.species) out.push(gridField(`feed.concentrations.${s}`, "concentration", unit("concentration", "mol/L")));
  out.push(gridField("feed.temperature", "temperature", unit("temperature", "K")));
  out.push(gridField("constraints.maxTotalVolume", "volume", unit("volume", "m3")));
  out.push(gridField("constraints.minConversion", null, "", "0 to 1"));
  out.push(gridField("constraints.minYield", null, "", "0 to 1"));
  return out;
}

/** The unit kind of a network grid input by its path (null for a plain number), for naming a scenario's values. */
export function networkFieldKind(path: string): UnitKind | null {
  if (path.startsWith("feed.concentrations.")) return "concentration";
  if (path === "feed.temperature") return "temperature";
  if (path === "constraints.maxTotalVolume" || path === "constraints.maxStageVolume") return "volume";
  if (/^reactions\.\d+\.rate(\.reverse)?\.activationEnergy$/.test(path)) return "energyPerMol";
  return null;
}
