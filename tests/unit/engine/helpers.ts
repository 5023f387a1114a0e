import type { DesignSpec, StageType } from "../../../lib/engine/index";

/** A liquid, isothermal design spec for -rA = k C_A^order with the given train. */
export function powerSpec(opts: {
  k: number;
  order: number;
  target: number;
  fa0?: number;
  ca0?: number;
  candidates?: StageType[][];
  maxStages?: number;
  equalVolume?: boolean;
}): DesignSpec {
  const train = opts.candidates
    ? { candidates: opts.candidates, equalVolume: opts.equalVolume }
    : { maxStages: opts.maxStages ?? 1, equalVolume: opts.equalVolume };
  return {
    feed: { flowA: opts.fa0 ?? 1, concA: opts.ca0 ?? 1 },
    reaction: { rate: { law: "power", k: opts.k, orders: { A: opts.order } } },
    target: { conversion: opts.target },
    train,
  };
}

/** Relative difference. */
export function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

/** n copies of a stage type. */
export function repeat(type: StageType, n: number): StageType[] {
  return Array.from({ length: n }, () => type);
}
