import { UNITS, type UnitDef } from "@/lib/units/display";

/**
 * The unit pickers of an uploaded rate table, one per column role, with their exact factors to
 * SI (si = value × factor + offset). Concentration, rate and temperature reuse the app's unit
 * table (lib/units/display.ts); conversion may be a fraction or a percentage, and
 * 1 mmol/L = 1e-3 mol / 1e-3 m3 = 1 mol/m3 exactly.
 */
export const DATASET_UNITS = {
  conversion: {
    fraction: { label: "fraction (0–1)", factor: 1 },
    percent: { label: "%", factor: 0.01 },
  },
  concentration: {
    "mol/m3": UNITS.concentration["mol/m3"],
    "mol/L": UNITS.concentration["mol/L"],
    "mmol/L": { label: "mmol/L", factor: 1 },
    "kmol/m3": UNITS.concentration["kmol/m3"],
  },
  rate: {
    "mol/(m3 s)": UNITS.rate["mol/(m3 s)"],
    "mol/(L s)": UNITS.rate["mol/(L s)"],
    "mol/(L min)": UNITS.rate["mol/(L min)"],
    "mol/(L h)": UNITS.rate["mol/(L h)"],
    "kmol/(m3 h)": UNITS.rate["kmol/(m3 h)"],
  },
  temperature: UNITS.temperature,
} as const satisfies Record<string, Record<string, UnitDef>>;

export type DatasetUnitKind = keyof typeof DATASET_UNITS;

/** The roles a column may take; "ignore" drops it. concR is the product's concentration. */
export const COLUMN_ROLES = ["conversion", "concA", "concR", "rate", "temperature", "ignore"] as const;
export type ColumnRole = (typeof COLUMN_ROLES)[number];
export type ValueRole = Exclude<ColumnRole, "ignore">;
export const VALUE_ROLES = COLUMN_ROLES.filter((r): r is ValueRole => r !== "ignore");

export const ROLE_LABELS: Record<ColumnRole, string> = {
  conversion: "Conversion of A",
  concA: "Concentration of A",
  concR: "Concentration of product R",
  rate: "Rate of reaction, −rA",
  temperature: "Temperature",
  ignore: "Ignore this column",
};

/** Which unit list each role picks from. */
export const ROLE_UNIT_KIND: Record<ValueRole, DatasetUnitKind> = {
  conversion: "conversion",
  concA: "concentration",
  concR: "concentration",
  rate: "rate",
  temperature: "temperature",
};

/** The unit each role starts with in the pickers. */
export const DEFAULT_UNITS: Record<ValueRole, string> = {
  conversion: "fraction",
  concA: "mol/L",
  concR: "mol/L",
  rate: "mol/(L min)",
  temperature: "degC",
};

export function datasetUnitOptions(kind: DatasetUnitKind): { value: string; label: string }[] {
  return Object.entries(DATASET_UNITS[kind] as Record<string, UnitDef>).map(([value, d]) => ({ value, label: d.label }));
}

export function datasetUnit(role: ValueRole, unit: string): UnitDef | undefined {
  const table = DATASET_UNITS[ROLE_UNIT_KIND[role]] as Record<string, UnitDef>;
  return Object.hasOwn(table, unit) ? table[unit] : undefined;
}
