/**
 * Units the screens offer in their pickers, and their conversions to the SI values the
 * engine stores. Every factor is exact by definition:
 *   1 ft = 0.3048 m (international yard and pound agreement) → 1 ft3 = 0.028316846592 m3;
 *   1 US gal = 231 in3 = 3.785411784 L;  1 lb = 0.45359237 kg → 1 lbmol = 453.59237 mol;
 *   1 min = 60 s, 1 h = 3600 s;  T[K] = T[degC] + 273.15 = (T[degF] + 459.67) × 5/9;
 *   1 thermochemical cal = 4.184 J;  1 Btu (IT) = 1055.05585262 J.
 * Pure functions, no I/O; shared by the kinetics editor, the sweep builder and the result tables.
 */

import { formatNumber } from "@/lib/format/numbers";

export interface UnitDef {
  /** Label shown in pickers and beside numbers. */
  label: string;
  /** SI value of 1 unit: si = value × factor + offset. */
  factor: number;
  /** Offset to SI (temperatures only). */
  offset?: number;
}

const GAL = 3.785411784e-3; // m3
const FT3 = 0.028316846592; // m3
const LBMOL = 453.59237; // mol
const MIN = 60;
const HOUR = 3600;
const LITRE = 1e-3;
const BTU = 1055.05585262; // J

export const UNITS = {
  volume: {
    m3: { label: "m³", factor: 1 },
    L: { label: "L", factor: LITRE },
    gal: { label: "US gal", factor: GAL },
    ft3: { label: "ft³", factor: FT3 },
  },
  time: {
    s: { label: "s", factor: 1 },
    min: { label: "min", factor: MIN },
    h: { label: "h", factor: HOUR },
  },
  amount: {
    mol: { label: "mol", factor: 1 },
    kmol: { label: "kmol", factor: 1000 },
    lbmol: { label: "lbmol", factor: LBMOL },
  },
  temperature: {
    K: { label: "K", factor: 1, offset: 0 },
    degC: { label: "°C", factor: 1, offset: 273.15 },
    degF: { label: "°F", factor: 5 / 9, offset: (459.67 * 5) / 9 },
  },
  temperatureDifference: {
    K: { label: "K", factor: 1 },
    degC: { label: "°C (difference)", factor: 1 },
    degF: { label: "°F (difference)", factor: 5 / 9 },
  },
  /** Volumetric flow of a feed (models of several reactions), m3/s. */
  volumetricFlow: {
    "m3/s": { label: "m³/s", factor: 1 },
    "m3/h": { label: "m³/h", factor: 1 / HOUR },
    "L/s": { label: "L/s", factor: LITRE },
    "L/min": { label: "L/min", factor: LITRE / MIN },
    "L/h": { label: "L/h", factor: LITRE / HOUR },
    "gal/min": { label: "US gal/min", factor: GAL / MIN },
  },
  molarFlow: {
    "mol/s": { label: "mol/s", factor: 1 },
    "mol/min": { label: "mol/min", factor: 1 / MIN },
    "kmol/h": { label: "kmol/h", factor: 1000 / HOUR },
    "lbmol/h": { label: "lbmol/h", factor: LBMOL / HOUR },
  },
  concentration: {
    "mol/m3": { label: "mol/m³", factor: 1 },
    "mol/L": { label: "mol/L", factor: 1 / LITRE },
    "kmol/m3": { label: "kmol/m³", factor: 1000 },
    "lbmol/ft3": { label: "lbmol/ft³", factor: LBMOL / FT3 },
  },
  /** Rate of reaction, mol/(m3 s). */
  rate: {
    "mol/(m3 s)": { label: "mol/(m³·s)", factor: 1 },
    "mol/(L s)": { label: "mol/(L·s)", factor: 1 / LITRE },
    "mol/(L min)": { label: "mol/(L·min)", factor: 1 / LITRE / MIN },
    "mol/(L h)": { label: "mol/(L·h)", factor: 1 / LITRE / HOUR },
    "kmol/(m3 h)": { label: "kmol/(m³·h)", factor: 1000 / HOUR },
    "lbmol/(ft3 h)": { label: "lbmol/(ft³·h)", factor: LBMOL / FT3 / HOUR },
  },
  energyPerMol: {
    "J/mol": { label: "J/mol", factor: 1 },
    "kJ/mol": { label: "kJ/mol", factor: 1000 },
    "kcal/mol": { label: "kcal/mol", factor: 4184 },
    "Btu/lbmol": { label: "Btu/lbmol", factor: BTU / LBMOL },
  },
} as const satisfies Record<string, Record<string, UnitDef>>;

export type UnitKind = keyof typeof UNITS;
export type UnitOf<K extends UnitKind> = keyof (typeof UNITS)[K] & string;
export type VolumeUnit = UnitOf<"volume">;

/** The SI unit key of each kind (what the engine stores). */
export const SI_UNIT: { [K in UnitKind]: UnitOf<K> } = {
  volume: "m3",
  time: "s",
  amount: "mol",
  temperature: "K",
  temperatureDifference: "K",
  volumetricFlow: "m3/s",
  molarFlow: "mol/s",
  concentration: "mol/m3",
  rate: "mol/(m3 s)",
  energyPerMol: "J/mol",
};

export function unitDef<K extends UnitKind>(kind: K, unit: string): UnitDef {
  const def = (UNITS[kind] as Record<string, UnitDef>)[unit];
  if (!def) throw new Error(`unknown ${kind} unit "${unit}"`);
  return def;
}

export function isUnit<K extends UnitKind>(kind: K, unit: string): unit is UnitOf<K> {
  return Object.hasOwn(UNITS[kind], unit);
}

/** A value in `unit` as SI. */
export function toSI<K extends UnitKind>(kind: K, value: number, unit: UnitOf<K> | string): number {
  const d = unitDef(kind, unit);
  return value * d.factor + (d.offset ?? 0);
}

/** An SI value in `unit`. */
export function fromSI<K extends UnitKind>(kind: K, si: number, unit: UnitOf<K> | string): number {
  const d = unitDef(kind, unit);
  return (si - (d.offset ?? 0)) / d.factor;
}

export function convert<K extends UnitKind>(kind: K, value: number, from: string, to: string): number {
  return fromSI(kind, toSI(kind, value, from), to);
}

export function unitLabel(kind: UnitKind, unit: string): string {
  return unitDef(kind, unit).label;
}

export function unitOptions<K extends UnitKind>(kind: K): { value: UnitOf<K>; label: string }[] {
  return Object.entries(UNITS[kind] as Record<string, UnitDef>).map(([value, d]) => ({ value: value as UnitOf<K>, label: d.label }));
}

/**
 * Power-law rate constants: SI is (m3/mol)^(n-1)/s for total order n. A constant given
 * per `concentration` unit and per `time` unit, (1/c)^(n-1)/t, converts by c^(1-n)/t.
 */
export function rateConstantToSI(value: number, order: number, concentration: string, time: string): number {
  return (value * unitDef("concentration", concentration).factor ** (1 - order)) / unitDef("time", time).factor;
}

export function rateConstantFromSI(si: number, order: number, concentration: string, time: string): number {
  return (si * unitDef("time", time).factor) / unitDef("concentration", concentration).factor ** (1 - order);
}

/** Label of a rate-constant unit, e.g. "(L/mol)^1.5/min" or "1/h". */
export function rateConstantLabel(order: number, concentration: string, time: string): string {
  const t = unitLabel("time", time);
  const p = Math.round((order - 1) * 1000) / 1000;
  if (p === 0) return `1/${t}`;
  const c = unitLabel("concentration", concentration); // e.g. mol/L
  const [amount, volume] = c.split("/");
  const base = `(${volume}/${amount})`;
  return `${base}${p === 1 ? "" : `^${p}`}/${t}`;
}

/** An SI value shown in `unit` with its label, e.g. "38.38 L". */
export function formatQuantity(kind: UnitKind, si: number | null | undefined, unit: string, digits = 4): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "—";
  return `${formatNumber(fromSI(kind, si, unit), digits)} ${unitLabel(kind, unit)}`;
}

/**
 * The number to put back in a field for an SI value stored from what the engineer typed in `unit`:
 * 12 significant digits undo the round trip's rounding (5 kmol/h → 1.3888…mol/s → 5, not
 * 4.999999999999999) and keep every digit a person types.
 */
export function typedText(kind: UnitKind, si: number, unit: string): string {
  return String(Number(fromSI(kind, si, unit).toPrecision(12)));
}

/** The number a field holds as a number, or null when blank or not a number. */
export function readTyped(text: string): number | null {
  const t = text.trim();
  if (t === "") return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/**
 * What a typed quantity is in the engine's units, as a short echo beside the field, e.g.
 * "= 333.15 K" for 60 °C; empty when the unit is already the engine's or the text is no number.
 */
export function echoInEngineUnits(kind: UnitKind, text: string, unit: string): string {
  const n = readTyped(text);
  if (n === null || !isUnit(kind, unit) || unit === SI_UNIT[kind]) return "";
  return `= ${formatNumber(toSI(kind, n, unit), 6)} ${unitLabel(kind, SI_UNIT[kind])}`;
}
