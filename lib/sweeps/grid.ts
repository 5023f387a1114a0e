/**
 * The scenario grid of a sweep: axes over numeric fields of the engine spec, expanded to
 * their Cartesian product. Pure functions; no I/O.
 */
import type { z } from "zod";
import type { gridAxisSchema } from "@/lib/schemas/sweeps";

/**
 * One varied field: listed values, or a range with a number of steps (both ends included).
 * The request's schema is its one definition, so what is accepted is what is expanded.
 */
export type GridAxis = z.infer<typeof gridAxisSchema>;

/** Field path → value for one scenario, e.g. { "feed.flowA": 0.02, "target.conversion": 0.9 } or { "reactions.1.rate.k": 2 }. */
export type Overrides = Record<string, number>;

/** The values an axis takes, in order. */
export function axisValues(axis: GridAxis): number[] {
  if ("values" in axis) return [...axis.values];
  const { from, to, steps } = axis;
  if (axis.scale === "log") {
    const a = Math.log(from);
    const b = Math.log(to);
    return Array.from({ length: steps }, (_, i) => Math.exp(a + ((b - a) * i) / (steps - 1)));
  }
  return Array.from({ length: steps }, (_, i) => (i === steps - 1 ? to : from + ((to - from) * i) / (steps - 1)));
}

/** Number of scenarios the grid implies (1 for an empty grid). */
export function scenarioCount(grid: GridAxis[]): number {
  return grid.reduce((n, axis) => n * axisValues(axis).length, 1);
}

/** Every combination of axis values; the last axis varies fastest. */
export function expandGrid(grid: GridAxis[]): Overrides[] {
  let out: Overrides[] = [{}];
  for (const axis of grid) {
    const values = axisValues(axis);
    out = out.flatMap((o) => values.map((v) => ({ ...o, [axis.field]: v })));
  }
  return out;
}

/** A copy of `spec` with each override written at its dot path (objects on the way are copied, never mutated). */
export function applyOverrides<T>(spec: T, overrides: Overrides): T {
  let result: unknown = spec;
  for (const [path, value] of Object.entries(overrides)) result = setPath(result, path.split("."), value);
  return result as T;
}

/**
 * Writes one value; an array on the way (a network's reactions) is copied as an array and a numeric key
 * indexes it, so `reactions.1.rate.k` changes the second reaction's constant and keeps the list a list.
 */
function setPath(node: unknown, keys: string[], value: number): unknown {
  const [head, ...rest] = keys;
  if (Array.isArray(node) && /^\d+$/.test(head)) {
    const copy = [...node];
    copy[Number(head)] = rest.length === 0 ? value : setPath(node[Number(head)], rest, value);
    return copy;
  }
  const obj = node !== null && typeof node === "object" && !Array.isArray(node) ? (node as Record<string, unknown>) : {};
  return { ...obj, [head]: rest.length === 0 ? value : setPath(obj[head], rest, value) };
}

/** Splits scenario indexes 0..total-1 into consecutive chunks of at most `size`. */
export function chunkRanges(total: number, size: number): { from: number; to: number }[] {
  const out: { from: number; to: number }[] = [];
  for (let from = 0; from < total; from += size) out.push({ from, to: Math.min(total, from + size) });
  return out;
}
