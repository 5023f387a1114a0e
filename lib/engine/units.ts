import type { Unit } from "mathjs";
import { EngineError } from "./errors";
import { mathInstance } from "./math-instance";
import type { Quantity } from "./types";

/** Physical dimension a field expects, given as a unit whose base the value's unit must share. */
export type Dimension = string | null;

/** Common dimensions, as SI unit strings. */
export const DIM = {
  molarFlow: "mol/s",
  concentration: "mol/m^3",
  temperature: "K",
  volume: "m^3",
  energyPerMole: "J/mol",
  rate: "mol/(m^3 s)",
  none: null,
} as const;

const RECIPROCAL = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*1\s*\/\s*([\w\s*^.()-]+)$/;

/**
 * Reads "2 mol/L" and also "0.06 1/min" or "3 1/(L h)": mathjs takes no number inside a unit,
 * so a reciprocal unit is read as number / (1 unit).
 */
function parseQuantity(text: string, path: string): Unit {
  const math = mathInstance();
  try {
    const m = RECIPROCAL.exec(text.trim());
    if (!m) return math.unit(text.trim()) as Unit;
    const inner = m[2].trim().replace(/^\((.*)\)$/, "$1");
    return math.divide(Number(m[1]), math.unit(`1 ${inner}`)) as unknown as Unit;
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    throw new EngineError("invalid-unit", `${path}: cannot read "${text}" as a quantity (${why})`, path);
  }
}

function finiteOrThrow(value: number, path: string): number {
  if (!Number.isFinite(value)) throw new EngineError("invalid-spec", `${path} must be a finite number`, path);
  return value;
}

/**
 * Converts a number (already SI) or a string with a unit to an SI number.
 * @param dimension SI unit string the value must be commensurable with, or null for a plain number.
 * @throws EngineError naming `path` for an unknown or mismatched unit or a non-finite value.
 */
export function toSI(value: Quantity, dimension: Dimension, path: string): number {
  if (typeof value === "number") return finiteOrThrow(value, path);
  const trimmed = value.trim();
  if (/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(trimmed)) return finiteOrThrow(Number(trimmed), path);
  if (dimension === null) {
    // A dimensionless field may be given in percent: "90 %" or "90%" is 0.9.
    const pct = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*%$/.exec(trimmed);
    if (pct) return finiteOrThrow(Number(pct[1]) / 100, path);
    throw new EngineError("invalid-unit", `${path} is dimensionless; "${value}" carries a unit`, path);
  }
  const q = parseQuantity(trimmed, path);
  const math = mathInstance();
  // "1/s" holds a number, which math.unit refuses: compare and convert in its reciprocal form.
  const target = dimension.startsWith("1/") ? `${dimension.slice(2).trim()}^-1` : dimension;
  const expected = math.unit(target);
  if (!q.equalBase(expected)) {
    throw new EngineError("invalid-unit", `${path}: "${value}" is not in units of ${dimension}`, path);
  }
  try {
    return finiteOrThrow(q.toNumber(target), path);
  } catch (err) {
    if (err instanceof EngineError) throw err;
    throw new EngineError("invalid-unit", `${path}: cannot convert "${value}" to ${dimension}`, path);
  }
}

/**
 * Converts a temperature difference (K). "degC" counts as K and "degF" as 5/9 K: a difference has no offset.
 */
export function toTemperatureDifference(value: Quantity, path: string): number {
  if (typeof value === "number") return finiteOrThrow(value, path);
  const m = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(K|degC|celsius|degF|fahrenheit|degR)?\s*$/.exec(value);
  if (!m) throw new EngineError("invalid-unit", `${path}: "${value}" is not a temperature difference in K, degC or degF`, path);
  const n = Number(m[1]);
  const unit = m[2] ?? "K";
  const factor = unit === "degF" || unit === "fahrenheit" || unit === "degR" ? 5 / 9 : 1;
  return finiteOrThrow(n * factor, path);
}

/** SI unit string of a rate constant for a power law of total order `order`: (m^3/mol)^(order-1)/s. */
export function rateConstantDimension(order: number): string {
  const p = order - 1;
  if (Math.abs(p) < 1e-12) return "1/s";
  return `m^${3 * p} / (mol^${p} s)`;
}

/** Converts a quantity of any dimension to its SI value (for free parameters of a user expression). */
export function anyToSI(value: Quantity, path: string): number {
  if (typeof value === "number") return finiteOrThrow(value, path);
  const trimmed = value.trim();
  if (/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(trimmed)) return finiteOrThrow(Number(trimmed), path);
  const q = parseQuantity(trimmed, path).toSI();
  return finiteOrThrow(q.toNumber(q.formatUnits()), path);
}
