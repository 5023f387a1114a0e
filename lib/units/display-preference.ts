/**
 * Which units a user's results are shown in. The engine and the database keep SI; this file only
 * decides the unit each kind of quantity is *shown* in, from the user's preference and (for "as
 * typed") the units the engineer typed in the kinetics. Pure, no I/O: used by the screens, the
 * report, its PDF and the exports alike, so one choice speaks everywhere.
 */
import { isUnit, SI_UNIT, type UnitKind, type UnitOf } from "./display";

export const DISPLAY_PREFERENCES = ["as-typed", "si", "si-litres-hours", "us-customary"] as const;
export type DisplayPreference = (typeof DISPLAY_PREFERENCES)[number];
export const DEFAULT_DISPLAY_PREFERENCE: DisplayPreference = "as-typed";

/** The words the settings control shows for each choice. */
export const DISPLAY_PREFERENCE_LABEL: Record<DisplayPreference, string> = {
  "as-typed": "As typed in the kinetics",
  si: "SI (m³, mol/s, K)",
  "si-litres-hours": "SI with litres and hours (L, kmol/h, °C)",
  "us-customary": "US customary (US gal or ft³, lbmol/h, °F)",
};

export function isDisplayPreference(v: unknown): v is DisplayPreference {
  return typeof v === "string" && (DISPLAY_PREFERENCES as readonly string[]).includes(v);
}

export type DisplayUnits = { [K in UnitKind]: UnitOf<K> };

/**
 * Below this largest volume (m³) the metric sets show litres and US customary shows US gallons;
 * at or above it, m³ and ft³. 1 m³ = 1,000 L ≈ 264 US gal, so a laboratory or pilot vessel reads
 * in litres (0.9163 L, never 9.163e-4 m³) and a plant vessel in m³.
 */
export const SMALL_VOLUME_LIMIT_M3 = 1;

const SI_SET: DisplayUnits = { ...SI_UNIT };

const LITRES_HOURS_SET: DisplayUnits = {
  volume: "L",
  time: "h",
  amount: "kmol",
  temperature: "degC",
  temperatureDifference: "degC",
  volumetricFlow: "m3/h",
  molarFlow: "kmol/h",
  concentration: "mol/L",
  rate: "mol/(L h)",
  energyPerMol: "kJ/mol",
};

const US_SET: DisplayUnits = {
  volume: "gal",
  time: "h",
  amount: "lbmol",
  temperature: "degF",
  temperatureDifference: "degF",
  volumetricFlow: "gal/min",
  molarFlow: "lbmol/h",
  concentration: "lbmol/ft3",
  rate: "lbmol/(ft3 h)",
  energyPerMol: "Btu/lbmol",
};

export interface ResolveOptions {
  /** The largest volume the screen shows, m³; picks litres/m³ or US gal/ft³. */
  largestVolume?: number | null;
}

/** The volume unit of a set for the largest volume shown (see SMALL_VOLUME_LIMIT_M3). */
function volumeFor(preference: DisplayPreference, largest: number | null | undefined): UnitOf<"volume"> {
  const small = largest === null || largest === undefined || !Number.isFinite(largest) || Math.abs(largest) < SMALL_VOLUME_LIMIT_M3;
  if (preference === "us-customary") return small ? "gal" : "ft3";
  return small ? "L" : "m3";
}

/**
 * A unit per kind of quantity. "As typed" takes each kind the engineer typed (`typed`, from the
 * stored kinetics) and falls back to SI with litres and hours for the kinds they did not type; a
 * typed volume unit stays as typed whatever the size. The other choices ignore `typed`.
 */
export function resolveDisplayUnits(
  preference: DisplayPreference,
  typed?: Partial<Record<UnitKind, string>>,
  options: ResolveOptions = {},
): DisplayUnits {
  const base = preference === "si" ? SI_SET : preference === "us-customary" ? US_SET : LITRES_HOURS_SET;
  const units: DisplayUnits = { ...base, volume: volumeFor(preference, options.largestVolume) };
  if (preference !== "as-typed" || !typed) return units;
  const out = units as Record<UnitKind, string>;
  for (const kind of Object.keys(units) as UnitKind[]) {
    const unit = typed[kind];
    if (unit !== undefined && isUnit(kind, unit)) out[kind] = unit;
  }
  return units;
}
