/**
 * The seeded draws of a Monte Carlo run: xoroshiro128+ from the run's seed, so a seed gives the same
 * samples everywhere; each sample draws its uncertain inputs in the order they were listed (a normal
 * input takes two uniforms, by Box-Muller). Shared by one-reaction and several-reaction runs.
 */
import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";
import type { Uncertainty } from "./monte-carlo";

/** Standard normal from two uniforms (Box-Muller). */
function normal(u1: number, u2: number): number {
  return Math.sqrt(-2 * Math.log(1 - u1)) * Math.cos(2 * Math.PI * u2);
}

/**
 * A function giving the next sample's values by field; `base` holds each input's own (SI) value,
 * used by the ± spreads.
 */
export function sampler(uncertain: readonly Uncertainty[], base: readonly number[], seed: number): () => Record<string, number> {
  const rng = xoroshiro128plus(seed);
  const draw = () => uniformFloat64(rng);
  return () => {
    const values: Record<string, number> = {};
    uncertain.forEach((u, i) => {
      if (u.kind === "uniform") values[u.field] = u.low + (u.high - u.low) * draw();
      else if (u.kind === "normal") values[u.field] = u.mean + u.sd * normal(draw(), draw());
      else values[u.field] = base[i] * (1 + u.fraction * (2 * draw() - 1));
    });
    return values;
  };
}
