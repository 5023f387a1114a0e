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

function parseQuantity(text: string, path: string) {
  const math = mathInstance();
  try {
    return math.unit(text.trim());
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
    throw new EngineError("invalid-unit", `${path} is dimensionless; "${value}" carries a unit`, path);
  }
  const q = parseQuantity(trimmed, path);
  const math = mathInstance();
  const expected = math.unit(dimension);
  if (!q.equalBase(expected)) {
    throw new EngineError("invalid-unit", `${path}: "${value}" is not in units of ${dimension}`, path);
  }
  return finiteOrThrow(q.toNumber(dimension), path);
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
