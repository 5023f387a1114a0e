import { EngineError, normaliseRatingSpec, rateTrainOutlet, type RatingSpec } from "@/lib/engine";
import { applyOverrides } from "@/lib/sweeps/grid";
import { sampler } from "./draws";
import { quantile } from "./sample-stats";

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

/**
 * Rates the fixed train for `samples` draws of its uncertain inputs (xoroshiro128+ seeded,
 * so a seed gives the same answer everywhere) and summarises the outlet conversion. Each sample is
 * rated by the engine's lean path (rateTrainOutlet), which equals rateTrain's outlet to about 1e-9.
 * @throws EngineError when the spec itself cannot be read (a unit), before any sample.
 */
export function rateUnderUncertainty(req: RobustnessRequest): RobustnessResult {
  // Units are parsed once here; each sample then overrides SI numbers (and ±fractions apply to SI values).
  const spec = normaliseRatingSpec(req.spec);
  const base = req.uncertain.map((u) => (u.kind === "plusMinus" ? valueAt(spec, u.field) : 0));
  const next = sampler(req.uncertain, base, req.seed);
  const outcomes: number[] = [];
  let refused = 0;
  let misses = 0;
  for (let s = 0; s < req.samples; s++) {
    const overrides = next();
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
