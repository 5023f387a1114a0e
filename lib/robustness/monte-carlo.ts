import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";
import { EngineError, normaliseRatingSpec, rateTrainOutlet, type RatingSpec } from "@/lib/engine";
import { applyOverrides } from "@/lib/sweeps/grid";

/** How one numeric input of the rating spec is uncertain. */
export type Uncertainty =
  | { field: string; kind: "uniform"; low: number; high: number }
  | { field: string; kind: "normal"; mean: number; sd: number }
  /** The spec's own value ± a fraction, uniformly (e.g. 0.2 for ±20 %). */
  | { field: string; kind: "plusMinus"; fraction: number };

export interface RobustnessRequest {
  /** The fixed train to rate: feed, reaction and stage volumes. */
  spec: RatingSpec;
  uncertain: Uncertainty[];
  /** Conversion the train must reach. */
  target: number;
  samples: number;
  seed: number;
}

export interface RobustnessResult {
  samples: number;
  seed: number;
  /** Outlet conversion percentiles of the sampled trains. */
  p5: number;
  p50: number;
  p95: number;
  mean: number;
  /** Fraction of samples below the target (a sample the engine refuses counts as a miss). */
  probabilityOfMissingTarget: number;
  /** Standard error of that fraction, sqrt(p(1-p)/n). */
  probabilityStandardError: number;
  refusedSamples: number;
  /** Sorted outlet conversions, thinned to at most 200 points, for the distribution chart. */
  distribution: number[];
}

function valueAt(spec: unknown, path: string): number {
  const v = path.split(".").reduce<unknown>((node, key) => (node && typeof node === "object" ? (node as Record<string, unknown>)[key] : undefined), spec);
  if (typeof v !== "number") throw new Error(`${path} is not a number in the spec; give a uniform or normal range for it instead`);
  return v;
}

/** Standard normal from two uniforms (Box-Muller). */
function normal(u1: number, u2: number): number {
  return Math.sqrt(-2 * Math.log(1 - u1)) * Math.cos(2 * Math.PI * u2);
}

const quantile = (sorted: number[], p: number) => {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  return sorted[lo] + (h - lo) * ((sorted[Math.min(lo + 1, sorted.length - 1)] ?? sorted[lo]) - sorted[lo]);
};

/**
 * Rates the fixed train for `samples` draws of its uncertain inputs (xoroshiro128+ seeded,
 * so a seed gives the same answer everywhere) and summarises the outlet conversion. Each sample is
 * rated by the engine's lean path (rateTrainOutlet), which equals rateTrain's outlet to about 1e-9.
 * @throws EngineError when the spec itself cannot be read (a unit), before any sample.
 */
export function rateUnderUncertainty(req: RobustnessRequest): RobustnessResult {
  const rng = xoroshiro128plus(req.seed);
  const draw = () => uniformFloat64(rng);
  // Units are parsed once here; each sample then overrides SI numbers (and ±fractions apply to SI values).
  const spec = normaliseRatingSpec(req.spec);
  const base = req.uncertain.map((u) => (u.kind === "plusMinus" ? valueAt(spec, u.field) : 0));
  const outcomes: number[] = [];
  let refused = 0;
  let misses = 0;
  for (let s = 0; s < req.samples; s++) {
    const overrides: Record<string, number> = {};
    req.uncertain.forEach((u, i) => {
      if (u.kind === "uniform") overrides[u.field] = u.low + (u.high - u.low) * draw();
      else if (u.kind === "normal") overrides[u.field] = u.mean + u.sd * normal(draw(), draw());
      else overrides[u.field] = base[i] * (1 + u.fraction * (2 * draw() - 1));
    });
    try {
      const x = rateTrainOutlet(applyOverrides(spec, overrides));
      outcomes.push(x);
      if (x < req.target) misses++;
    } catch (err) {
      if (!(err instanceof EngineError)) throw err;
      refused++;
      misses++;
    }
  }
  outcomes.sort((a, b) => a - b);
  const p = misses / req.samples;
  const step = Math.max(1, Math.ceil(outcomes.length / 200));
  return {
    samples: req.samples,
    seed: req.seed,
    p5: quantile(outcomes, 0.05),
    p50: quantile(outcomes, 0.5),
    p95: quantile(outcomes, 0.95),
    mean: outcomes.reduce((a, b) => a + b, 0) / Math.max(1, outcomes.length),
    probabilityOfMissingTarget: p,
    probabilityStandardError: Math.sqrt((p * (1 - p)) / req.samples),
    refusedSamples: refused,
    distribution: outcomes.filter((_, i) => i % step === 0),
  };
}
