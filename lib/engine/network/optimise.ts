/**
 * The residence times of one stage sequence that give the best objective within the limits.
 *
 * Method
 * 1. Variables: one residence time tau_s >= 0 per stage (tau = V / v0), searched as
 *    x_s = ln(1 + tau_s / tauLo), so that zero is an ordinary point (a stage left out) and large and small
 *    tanks get the same relative resolution. The total and per-stage volume limits are met by projection:
 *    each tau is capped at the stage limit and, when the total exceeds its limit, all are scaled down
 *    together. The minimum conversion and yield are met by an exact penalty (a large multiple of the
 *    shortfall), then repaired exactly (step 4).
 *    When the optimiser chooses stage temperatures, each stage adds y_s in [0, 1] across the bounds; the
 *    scan tries TEMPERATURE_POINTS temperatures per stage (both bounds among them) in (a) and (c), and two
 *    tubes in a row are no longer merged (they may differ in temperature).
 * 2. Coarse scan, from three families of starting designs, each evaluated exactly:
 *    a. the best design of the sequence without its last stage (already optimised: sequences are treated
 *       shortest first), followed by the last stage at every grid time, 0 included: the prefix's outlet is
 *       computed once, and a tube's outlets at all grid times come from ONE integration;
 *    b. a zero-volume first stage followed by the best design of the sequence without its first stage,
 *       and (b') the same with a first stage of every grid time taken from the rest's first stage in use
 *       (a small tank ahead of a tube can beat the tube alone by a few parts in a million, a gain the
 *       polish does not find from (b): measured on the example's chemistry with k2 = 0.5 and 0.5 m3);
 *    c. every stage at the same grid time.
 *    For a single stage the scan is the whole grid. The grid is log-spaced, GRID_POINTS points from tauLo
 *    to the largest time allowed (design.ts sets the range from the feed's rates and the limits).
 * 3. Polish: Nelder–Mead (nelder-mead.ts) in x from the best POLISH_STARTS starting designs; the best
 *    result is kept. With stage temperatures a projected quasi-Newton finish (quasi-newton.ts) follows the
 *    simplex, which alone stalls short of the optimum in 2n variables.
 *    A stirred tank pressed against the fold of its steady-state curve (its lowest-conversion state exists
 *    only up to a volume, then jumps: the objective has a cliff there, which Nelder–Mead approaches but
 *    does not locate exactly) is set to the volume where its lowest state jumps, located by continuation
 *    (cstr-fold.ts) and bisection to FOLD_TOLERANCE, on the side that scores better, the other stages kept
 *    (snapToFolds).
 * 4. Repair and tidy: a design that misses the minimum conversion or yield by a little (the penalty's
 *    kink) has all its times scaled up by bisection until it meets them; then each stage whose removal does
 *    not worsen the objective is set to zero (of designs equally good, the least volume).
 *
 * Guarantee. By construction the result is at least as good as (a) and (b): by induction, at least as good
 * as every design of every contiguous part of the sequence — in particular the best single stage of each
 * type it contains — and as every equal split on the grid. Two tubes in a row are merged exactly (one tube
 * of their summed time) when no stage limit applies. That it is the global optimum is not proven.
 * Measured (bench/network-design.bench.ts and the tests): on the 62 sequences of the three-reaction example
 * every objective is within 1e-9 relative (largest 1.7e-10) of a search with 50 grid times, 8 polishes
 * and tubes at 1e-10, and that search is better by more than 1e-9 on none (nor on 10 more scenarios of
 * the queue benchmark's grid of k2 and volume limits: largest 9.5e-10);
 * five tanks of Van de Vusse land within 4e-10 of the published best-known C_B (which is given to 10
 * digits); random series rate constants never lose to a random fixed split (fast-check). The grid needed
 * on these cases was measured: 3 grid times per stage already give the same optima (they are unimodal in
 * the stage times), so the default GRID_POINTS = 16 is margin for networks with several local optima,
 * not a proven resolution. Tubes are integrated at SEARCH_RTOL during the search; the reported design is
 * re-run at 1e-9 (design.ts), so its figures are those of its own stage times. Two things keep an
 * evaluation cheap: a tube fed with the feed is read off one fine integration (feed-tube.ts), and when
 * tanks have one state each tank's Newton starts from the last tank solved at its place in the train
 * (train-eval.ts), which is usually a few percent away.
 *
 * Bounds: a stage at zero volume, at the stage volume limit, or a train at the total volume limit is
 * reported in the candidate's `onBound` (design.ts).
 */
import { EngineError } from "../errors";
import type { StageType } from "../types";
import { snapToFolds } from "./cstr-fold-snap";
import { nelderMead } from "./nelder-mead";
import { quasiNewton } from "./quasi-newton";
import { evaluateTrain, isFeasible, NEGLIGIBLE_TAU_FRACTION, pfrOutletsAt, stageOutlet, trainOutlets, type DesignProblem, type Score, scoreOutlet, UNSOLVED } from "./train-eval";

/** Defaults of the scan and the polish (DesignProblem carries the values used). */
export const GRID_POINTS = 16;
export const POLISH_STARTS = 1;
const PENALTY = 1e4;
/** Tube tolerance of the reported design (pfr.ts's default). */
export const REPORT_RTOL = 1e-9;

export interface SequenceDesign {
  sequence: StageType[];
  taus: number[];
  /** Each stage's temperature, K (all the feed's when isothermal). */
  temps: number[];
  score: Score;
}

/** Temperatures tried per stage in the scan when the optimiser chooses them: the bounds and three between. */
const TEMPERATURE_POINTS = 5;

const total = (taus: readonly number[]) => taus.reduce((a, b) => a + b, 0);

/** True when design a is better than b: feasible first, then the larger objective, then the smaller volume. */
export function better(a: SequenceDesign, b: SequenceDesign): boolean {
  const fa = isFeasible(a.score);
  const fb = isFeasible(b.score);
  if (fa !== fb) return fa;
  if (!fa && a.score.violation !== b.score.violation) return a.score.violation < b.score.violation;
  if (a.score.value !== b.score.value) return a.score.value > b.score.value;
  return total(a.taus) < total(b.taus);
}

export function scanGrid(p: DesignProblem): number[] {
  const hi = Math.min(p.tauHi, p.maxStageTau, p.maxTotalTau);
  const lo = Math.min(p.tauLo, hi);
  const points = p.gridPoints;
  const ratio = (hi / lo) ** (1 / (points - 1));
  return [0, ...Array.from({ length: points }, (_, k) => (k === points - 1 ? hi : lo * ratio ** k))];
}

/** Takes a negligible time as an empty stage, caps each time at the stage limit and scales all down when the total exceeds its limit. */
export function project(p: DesignProblem, taus: number[]): number[] {
  const capped = taus.map((t) => (t <= NEGLIGIBLE_TAU_FRACTION * p.tauLo ? 0 : Math.min(t, p.maxStageTau)));
  const sum = total(capped);
  return sum > p.maxTotalTau ? capped.map((t) => (t * p.maxTotalTau) / sum) : capped;
}

function design(p: DesignProblem, sequence: StageType[], taus: number[], temps: number[]): SequenceDesign {
  const projected = project(p, taus);
  return { sequence, taus: projected, temps, score: evaluateTrain(p, sequence, projected, temps) };
}

function temperatureGrid(p: DesignProblem): number[] {
  const b = p.temperatures;
  if (b === null) return [p.T];
  return Array.from({ length: TEMPERATURE_POINTS }, (_, k) => b.min + ((b.max - b.min) * k) / (TEMPERATURE_POINTS - 1));
}

export function optimiseSequence(p: DesignProblem, sequence: StageType[], memo: Map<string, SequenceDesign>): SequenceDesign {
  const key = sequence.join(" ");
  const known = memo.get(key);
  if (known) return known;
  // Two tubes in a row at one temperature are one tube of their summed time: without a stage limit the
  // sequence's best is its merged sequence's, the second tube left at zero (exact, and half the work).
  const pair = Number.isFinite(p.maxStageTau) || p.temperatures !== null ? -1 : sequence.findIndex((t, i) => t === "PFR" && sequence[i + 1] === "PFR");
  if (pair >= 0) {
    const merged = optimiseSequence(p, [...sequence.slice(0, pair + 1), ...sequence.slice(pair + 2)], memo);
    const at = (xs: number[], filler: number) => [...xs.slice(0, pair + 1), filler, ...xs.slice(pair + 1)];
    const result = design(p, sequence, at(merged.taus, 0), at(merged.temps, merged.temps[pair]));
    memo.set(key, result);
    return result;
  }
  const grid = scanGrid(p);
  const tGrid = temperatureGrid(p);
  const starts: SequenceDesign[] = [];
  const n = sequence.length;

  // (a) best prefix, then the last stage over the grid (one tube integration, or one tank per grid time).
  const prefixDesign = n > 1 ? optimiseSequence(p, sequence.slice(0, -1), memo) : null;
  const prefix = prefixDesign?.taus ?? [];
  const prefixTemps = prefixDesign?.temps ?? [];
  const solvable = (f: () => Float64Array) => {
    try {
      return f();
    } catch (err) {
      if (err instanceof EngineError) return null;
      throw err;
    }
  };
  const Fprefix = n > 1 ? solvable(() => trainOutlets(p, sequence.slice(0, -1), prefix, prefixTemps)[n - 2]) : p.kin.net.F0;
  const last = sequence[n - 1];
  for (const T of tGrid) {
    const tube = last === "PFR" && Fprefix !== null ? pfrOutletsOrNull(p, Fprefix, grid, T) : null;
    grid.forEach((t, q) => {
      const taus = [...prefix, t];
      if (total(taus) > p.maxTotalTau * (1 + 1e-12)) return;
      const F = Fprefix === null ? null : last === "PFR" ? (tube?.[q] ?? null) : solvable(() => stageOutlet(p, last, Fprefix, t, T, n - 1));
      starts.push({ sequence, taus, temps: [...prefixTemps, T], score: F === null ? UNSOLVED : scoreOutlet(p, F, total(taus)) });
    });
  }
  if (n > 1) {
    // (b) the first stage left out, then the best design of the rest.
    const suffix = optimiseSequence(p, sequence.slice(1), memo);
    starts.push(design(p, sequence, [0, ...suffix.taus], [suffix.temps[0], ...suffix.temps]));
    // (b') a first stage of every grid time taken from the rest's first stage in use: a small tank
    // ahead of a tube can beat the tube alone by a little, too little for the polish to find from (b).
    const first = suffix.taus.findIndex((t) => t > 0);
    if (first >= 0) {
      for (const t of grid.slice(1)) {
        if (t >= suffix.taus[first]) break;
        const rest = [...suffix.taus];
        rest[first] -= t;
        starts.push(design(p, sequence, [t, ...rest], [suffix.temps[0], ...suffix.temps]));
      }
    }
    // (c) equal splits, all stages at one temperature.
    for (const T of tGrid) for (const t of grid.slice(1)) starts.push(design(p, sequence, new Array<number>(n).fill(t), new Array<number>(n).fill(T)));
  }

  starts.sort((a, b) => (better(a, b) ? -1 : better(b, a) ? 1 : 0));
  let best = starts[0];
  const picked: SequenceDesign[] = [];
  for (const s of starts) {
    if (picked.length >= p.polishStarts) break;
    if (picked.some((q) => q.taus.every((t, i) => Math.abs(t - s.taus[i]) <= 1e-9 * Math.max(t, 1e-300)))) continue;
    picked.push(s);
  }
  for (const start of picked) {
    const polished = polish(p, sequence, start);
    if (better(polished, best)) best = polished;
  }
  best = snapToFolds(p, best, (taus) => design(p, sequence, taus, best.temps), better);
  // The repair sets a limit exactly, so it integrates tubes at the tolerance the design is reported at.
  best = tidy(p, repair({ ...p, searchRtol: REPORT_RTOL }, best));
  memo.set(key, best);
  return best;
}

function pfrOutletsOrNull(p: DesignProblem, Fin: Float64Array, grid: readonly number[], T: number): Float64Array[] | null {
  try {
    return pfrOutletsAt(p, Fin, grid, T);
  } catch (err) {
    if (err instanceof EngineError) return null;
    throw err;
  }
}

function polish(p: DesignProblem, sequence: StageType[], start: SequenceDesign): SequenceDesign {
  const lo = p.tauLo;
  const cap = Math.min(p.tauHi, p.maxStageTau, p.maxTotalTau);
  const toTaus = (x: readonly number[]) => project(p, x.map((v) => lo * Math.expm1(v)));
  const merit = (s: Score, taus: readonly number[]) => {
    const base = p.kind === "volume" ? Math.log(total(taus) / lo + 1e-300) : -s.value;
    return base + PENALTY * s.violation;
  };
  // With chosen temperatures, each stage's temperature is a further variable y in [0, 1] across the bounds.
  const n = sequence.length;
  const b = p.temperatures;
  const toTemps = (x: readonly number[]) => (b === null ? start.temps : x.slice(n).map((y) => b.min + y * (b.max - b.min)));
  const x0 = start.taus.map((t) => Math.log1p(t / lo));
  const upper = x0.map(() => Math.log1p(cap / lo));
  const lower = x0.map(() => 0);
  if (b !== null) {
    for (const T of start.temps) x0.push(b.max > b.min ? (T - b.min) / (b.max - b.min) : 0);
    for (let s = 0; s < n; s++) {
      lower.push(0);
      upper.push(1);
    }
  }
  const f = (x: readonly number[]) => {
    const taus = toTaus(x.slice(0, n));
    return merit(evaluateTrain(p, sequence, taus, toTemps(x)), taus);
  };
  if (b !== null) {
    // Stage temperatures: Nelder–Mead in 2n variables stalls short of the optimum (measured up to 9e-5 on the
    // bench's example within 400 evaluations per variable); a quasi-Newton finish from where it stops
    // converges on the smooth part, so the simplex may stop early (values within 1e-7): all 62 sequences
    // within 2.5e-8 of the best found by any setting, for about a third less work than the long simplex. Stopping the
    // simplex by a budget instead (150 or 200 evaluations per variable) was as fast but twice landed on
    // another local optimum, up to 5e-4 short.
    const nm = nelderMead(f, x0, { lower, upper, step: 0.1, maxEvaluations: 400 * x0.length, fTolerance: 1e-7, xTolerance: 1e-4 });
    const qn = quasiNewton(f, nm.x, { lower, upper, h: 1e-4, maxIterations: 60 });
    const x = qn.value <= nm.value ? qn.x : nm.x;
    return design(p, sequence, toTaus(x.slice(0, n)), toTemps(x));
  }
  const res = nelderMead(f, x0, { lower, upper, step: 0.1, maxEvaluations: 400 * x0.length, fTolerance: 1e-11, xTolerance: 1e-8 });
  return design(p, sequence, toTaus(res.x.slice(0, n)), toTemps(res.x));
}

/**
 * A design short of the minimum conversion or yield by a little (the penalty's kink) has all its times
 * scaled up until it meets them; a least-volume design is scaled down to where it just meets them. The
 * bisection brackets the scale between a design that misses the limits and one that meets them exactly.
 */
function repair(p: DesignProblem, d: SequenceDesign): SequenceDesign {
  if (total(d.taus) === 0 || (p.minConversion === null && p.minYield === null)) return d;
  const meets = (x: SequenceDesign) => x.score.violation === 0;
  const scaled = (f: number) => design(p, d.sequence, d.taus.map((t) => t * f), d.temps);
  let lo = 1;
  let hi = 1;
  let found: SequenceDesign | null = meets(d) ? d : null;
  if (!found) {
    for (let k = 0; k < 20 && !found; k++) {
      hi *= 1.5;
      const trial = scaled(hi);
      if (meets(trial)) found = trial;
      else lo = hi;
      if (total(trial.taus) < total(d.taus) * hi * (1 - 1e-12)) break; // the volume limit stopped the scaling
    }
    if (!found) return d;
  } else if (p.kind === "volume") {
    for (let k = 0; k < 60; k++) {
      lo *= 0.9;
      if (!meets(scaled(lo))) break;
      hi = lo;
      found = scaled(hi);
    }
  } else return d;
  for (let k = 0; k < 60 && hi - lo > 1e-14 * hi; k++) {
    const mid = 0.5 * (lo + hi);
    const trial = scaled(mid);
    if (meets(trial)) {
      hi = mid;
      found = trial;
    } else lo = mid;
  }
  return found;
}

/** Sets to zero each stage whose removal does not worsen the objective (ties go to the least volume). */
function tidy(p: DesignProblem, d: SequenceDesign): SequenceDesign {
  let best = d;
  for (let s = 0; s < d.taus.length; s++) {
    if (best.taus[s] === 0) continue;
    const taus = [...best.taus];
    taus[s] = 0;
    const trial = design(p, d.sequence, taus, d.temps);
    // Within the search's own accuracy (1e-9 relative, measured in the bench) a stage left empty is as good.
    const tolerance = 1e-9 * Math.max(Math.abs(best.score.value), 1e-300);
    if (isFeasible(trial.score) === isFeasible(best.score) && trial.score.value >= best.score.value - tolerance && trial.score.violation <= best.score.violation) best = trial;
  }
  return best;
}
