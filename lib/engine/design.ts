import { costObjective, volumeObjective } from "./chain-objective";
import { purchase, resolveCostModel, stageObjective, type CostModel } from "./cost";
import { CAUTIONS } from "./cautions";
import { optimiseOnGrid } from "./dynamic-programme";
import { equalVolumeBoundaries } from "./equal-volume";
import { EngineError, ensure } from "./errors";
import { checkTarget, equilibriumConversion } from "./feasibility";
import { checkRateMagnitude, checkVolumeMagnitude } from "./magnitude";
import { buildGridTables } from "./grid-tables";
import { stagePlot } from "./levenspiel";
import { sharedPath, stageTemperature, type SizingBasis } from "./sizing-basis";
import { equalisePfrRuns } from "./pfr-runs";
import { refineChain } from "./refine";
import { resolveSizingBasis } from "./resolve-sizing-basis";
import { enumerateSequences } from "./sequences";
import { fullVesselConversions, optimiseStandardSizes, type SizedDesign } from "./standard-sizes";
import { stageRecycleRatio, stageVolume } from "./stage-volume";
import { stageFrame } from "./stage-temperature-search";
import { bestPathReference, checkChosenTemperatures, TEMPERATURE_CAUTION } from "./design-temperatures";
import { cstrVolume, pfrVolume, type StagePlace } from "./stages";
import type { CandidateResult, DesignResult, DesignSpec, StageResult, StageType, TrainStageType } from "./types";

/** Options of the design search. */
export interface DesignOptions {
  /** Points of the conversion grid of the dynamic programme. @default 128 */
  gridPoints?: number;
}

interface Evaluated {
  readonly sequence: TrainStageType[];
  readonly boundaries: number[] | null;
  readonly objective: number;
  readonly totalVolume: number;
  readonly stages: StageResult[];
}

function placesOf(sequence: readonly TrainStageType[], recycleRatio: number | null = null): StagePlace[] {
  return sequence.map((type, k) => (type === "PFR-recycle" ? { type, first: k === 0, recycleRatio } : { type, first: k === 0 }));
}

function totalObjective(basis: SizingBasis, cm: CostModel, places: readonly StagePlace[], x: readonly number[]): number {
  return places.reduce((s, p, k) => s + stageObjective(cm, p.type, stageVolume(basis, p, x[k], x[k + 1])), 0);
}

/** Memo of refined reduced problems within one design call: many sequences reduce to the same one. */
type RefineMemo = Map<string, number[]>;

function refine(basis: SizingBasis, cm: CostModel, places: StagePlace[], x: number[], memo: RefineMemo): number[] {
  // Stages of zero length at the grid optimum stay closed; the rest form a reduced chain.
  const active = places.map((_, k) => k).filter((k) => x[k + 1] !== x[k]);
  const reducedPlaces = active.map((k) => places[k]);
  const reducedX = [x[0], ...active.map((k) => x[k + 1])];
  const pieces = reducedPlaces.map((p, m) => purchase(cm, p.type, stageVolume(basis, p, reducedX[m], reducedX[m + 1])));
  const key = `${reducedPlaces.map((p) => `${p.type}${p.first ? 1 : 0}`).join(",")}|${reducedX.join(",")}|${pieces.map((p) => `${p.count}:${p.sizeIndex}`).join(",")}`;
  let refined = memo.get(key);
  if (!refined) {
    const objective = cm.kind === "volume" ? volumeObjective(basis, reducedPlaces) : costObjective(basis, cm, reducedPlaces, pieces);
    // With standard sizes the cost is flat within a size; a few steps toward less volume are enough.
    refined = refineChain(objective, reducedX, reducedPlaces.map(() => false), cm.sizes ? 8 : 60);
    memo.set(key, refined);
  }
  const full = [x[0]];
  let m = 0;
  for (let k = 0; k < places.length; k++) {
    if (active.includes(k)) m++;
    full.push(active.includes(k) ? refined[m] : full[k]);
  }
  return cm.kind === "volume" && sharedPath(basis) ? equalisePfrRuns(basis, places, full) : full;
}

function stageResults(basis: SizingBasis, cm: CostModel, places: readonly StagePlace[], x: readonly number[]): StageResult[] {
  return places.map((p, k) => {
    const a = x[k];
    const b = x[k + 1];
    const volume = stageVolume(basis, p, a, b);
    const bought = purchase(cm, p.type, volume);
    const ratio = p.type === "PFR-recycle" ? stageRecycleRatio(basis, p, a, b) : undefined;
    // A stage whose inlet temperature is chosen is reported at its best temperature.
    const frame = stageFrame(basis, p, a, b);
    return {
      type: p.type,
      conversionIn: a,
      conversionOut: b,
      temperatureIn: stageTemperature(frame.basis, frame.first, a, a),
      temperatureOut: stageTemperature(frame.basis, frame.first, a, b),
      volume,
      residenceTime: volume / basis.v0,
      vessels: { count: bought.count, sizeEach: bought.sizeEach },
      cost: cm.kind === "cost" ? bought.cost : null,
      levenspiel: stagePlot(frame.basis, p.type, frame.first, a, b, ratio),
      ...(ratio !== undefined ? { recycleRatio: ratio } : {}),
      ...(frame.chosen ? { temperatureChosen: true } : {}),
    };
  });
}

/** A train bought with standard sizes: every vessel full, conversions by rating (the last may pass the target). */
function evaluateSized(basis: SizingBasis, sequence: StageType[], design: SizedDesign | null): Evaluated {
  // Standard sizes are refused for trains with a tube with recycle (designTrains), so these are CSTR and PFR.
  if (!design) return evaluate(basis, VOLUME_ONLY, sequence, null);
  const capacities = design.pieces.map((p) => p.capacity);
  const x = fullVesselConversions(basis, sequence, capacities);
  const stages = sequence.map((type, k): StageResult => {
    const first = k === 0;
    const a = x[k];
    const b = x[k + 1];
    const p = design.pieces[k];
    return {
      type,
      conversionIn: a,
      conversionOut: b,
      temperatureIn: stageTemperature(basis, first, a, a),
      temperatureOut: stageTemperature(basis, first, a, b),
      volume: p.capacity,
      residenceTime: p.capacity / basis.v0,
      vessels: { count: p.count, sizeEach: p.sizeEach },
      cost: p.cost,
      levenspiel: stagePlot(basis, type, first, a, b),
    };
  });
  return { sequence, boundaries: x, objective: design.cost, totalVolume: capacities.reduce((s, v) => s + v, 0), stages };
}

const VOLUME_ONLY: CostModel = { kind: "volume", vessels: { CSTR: { a: 0, b: 1, n: 1 }, PFR: { a: 0, b: 1, n: 1 } }, sizes: null, maxVessel: Infinity };

function evaluate(basis: SizingBasis, cm: CostModel, sequence: TrainStageType[], x: number[] | null, recycleRatio: number | null = null): Evaluated {
  if (!x) return { sequence, boundaries: null, objective: Infinity, totalVolume: Infinity, stages: [] };
  const places = placesOf(sequence, recycleRatio);
  const stages = stageResults(basis, cm, places, x);
  const totalVolume = stages.reduce((s, st) => s + st.volume, 0);
  const objective = cm.kind === "volume" ? totalVolume : stages.reduce((s, st) => s + (st.cost ?? 0), 0);
  return { sequence, boundaries: x, objective, totalVolume, stages };
}

function infeasibleReason(basis: SizingBasis, n: number, target: number): string {
  const what = n === 1 ? "a single stage" : `${n} stages`;
  if (basis.choice) {
    return `${what} cannot reach conversion ${target} at any temperatures of the ranges given${basis.reversible ? " (each stage stops at its own equilibrium)" : ""}${Number.isFinite(basis.maxTemperature) ? ` within the maximum temperature ${basis.maxTemperature} K` : ""}`;
  }
  if (Number.isFinite(basis.maxTemperature)) {
    return `${what} cannot reach conversion ${target} without exceeding the maximum temperature ${basis.maxTemperature} K`;
  }
  if (basis.reversible) return `${what} cannot reach conversion ${target}: each stage stops at its own equilibrium`;
  return `${what} cannot reach conversion ${target} with a positive rate throughout`;
}

/** Orders two objective values, treating values within 1e-9 relative as equal (round-off, not a difference). */
function compareClose(p: number, q: number): number {
  if (p === q) return 0;
  if (Number.isFinite(p) && Number.isFinite(q) && Math.abs(p - q) <= 1e-9 * Math.max(Math.abs(p), Math.abs(q))) return 0;
  return p < q ? -1 : 1;
}

/**
 * A stage whose conversion step is below this (absolute, in conversion) does no work: the train it sits
 * in is the shorter train without it, padded with an empty vessel.
 */
export const EMPTY_STAGE_STEP = 1e-6;

function emptyStages(e: Evaluated): number {
  return e.stages.filter((st) => st.conversionOut - st.conversionIn < EMPTY_STAGE_STEP).length;
}

function vesselCount(e: Evaluated): number {
  return e.stages.reduce((s, st) => s + (st.conversionOut - st.conversionIn < EMPTY_STAGE_STEP ? 0 : st.vessels.count), 0);
}

/**
 * Ranks by objective; at an equal objective fewer vessels, then less volume, then the shorter train.
 * Trains with empty stages (see EMPTY_STAGE_STEP) come after every feasible train without one (and before
 * the infeasible ones), because each is
 * only a shorter train padded with a vessel that does nothing and would otherwise crowd the top ranks.
 */
function rank(evaluated: Evaluated[], basis: SizingBasis, target: number, cm: CostModel): CandidateResult[] {
  const order = evaluated
    .map((e, i) => ({ e, i, empty: Number.isFinite(e.objective) ? emptyStages(e) : 0, vessels: vesselCount(e) }))
    .sort(
      (p, q) =>
        Number(!Number.isFinite(p.e.objective)) - Number(!Number.isFinite(q.e.objective)) ||
        Number(p.empty > 0) - Number(q.empty > 0) ||
        compareClose(p.e.objective, q.e.objective) ||
        p.vessels - q.vessels ||
        compareClose(p.e.totalVolume, q.e.totalVolume) ||
        p.e.sequence.length - q.e.sequence.length ||
        p.i - q.i,
    );
  return order.map(({ e, empty }, idx) => {
    const feasible = Number.isFinite(e.objective);
    return {
      rank: idx + 1,
      sequence: e.sequence,
      feasible,
      totalVolume: feasible ? e.totalVolume : null,
      totalCost: feasible && cm.kind === "cost" ? e.objective : null,
      conversionReached: feasible ? e.stages[e.stages.length - 1].conversionOut : null,
      reason: feasible ? null : infeasibleReason(basis, e.sequence.length, target),
      emptyStages: empty,
      stages: e.stages,
    };
  });
}

const SIZED_CAUTION =
  "With standard sizes every vessel is used full, so a train may pass the target (see conversionReached); each CSTR is taken at its lowest steady state from the feed side, the conservative choice when it has several.";

const RECYCLE_CAUTION =
  "A tube with recycle is taken with its recycle mixed perfectly into the feed at the tube's inlet and plug flow in the tube; the recycle pump and line, their cost and their hold-up are not included.";

function finite(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}

/**
 * The user's recycle ratio for every tube with recycle, or null when the design chooses it per stage.
 * Refuses what the tube with recycle does not support yet: equal volumes and standard sizes (both rate
 * full vessels, which would need the recycle ratio chosen for a given volume).
 */
function fixedRecycleRatio(spec: DesignSpec, withRecycle: boolean): number | null {
  const train = spec.train;
  const given = "recycleRatio" in train ? train.recycleRatio : undefined;
  if (given !== undefined) ensure(Number.isFinite(given) && given >= 0, "the recycle ratio must be a number >= 0", "train.recycleRatio");
  if (withRecycle) {
    ensure(!train.equalVolume, "equal volumes are not available for trains with a tube with recycle; list them without it", "train.equalVolume");
    ensure(
      !(spec.objective?.minimise === "cost" && spec.objective.standardSizes),
      "standard sizes are not available for trains with a tube with recycle; leave the tube with recycle out or drop the standard sizes",
      "objective.standardSizes",
    );
  }
  return given ?? null;
}

/**
 * Designs every requested train: for each sequence of stage types the intermediate conversions that
 * minimise total volume or vessel cost, found globally on a conversion grid and refined by Newton's method.
 * @throws EngineError for an invalid spec, or when no sequence can reach the target.
 */
export function designTrains(spec: DesignSpec, options: DesignOptions = {}): DesignResult {
  const { basis, rateRange } = resolveSizingBasis(spec.feed, spec.reaction);
  const target = spec.target.conversion;
  const ratePath = spec.reaction.rate.law === "expression" ? "reaction.rate.expression" : "reaction.rate";
  const sequences = enumerateSequences(spec.train);
  const withRecycle = sequences.some((s) => s.includes("PFR-recycle"));
  const recycleRatio = fixedRecycleRatio(spec, withRecycle);
  checkChosenTemperatures(spec, basis);
  // A tube with recycle mixes product into its inlet, so a rate of zero at the feed itself (autocatalysis
  // from a feed without product) does not stop it; every other stage type still needs a positive rate.
  checkTarget(basis, target, rateRange, ratePath, withRecycle);
  checkRateMagnitude(basis, target, ratePath);
  const cm = resolveCostModel(spec.objective, [...new Set(sequences.flat())]);
  let evaluated: Evaluated[];
  if (spec.train.equalVolume) {
    evaluated = sequences.map((s) => evaluate(basis, cm, s, equalVolumeBoundaries(basis, placesOf(s), target)));
  } else if (cm.sizes) {
    // Standard sizes: an exact search over the purchase choices (not limited by a grid).
    const ideal = sequences as StageType[][];
    const designs = optimiseStandardSizes(basis, cm, target, ideal);
    evaluated = ideal.map((s, i) => evaluateSized(basis, s, designs[i]));
  } else {
    const tables = buildGridTables(basis, cm, target, options.gridPoints ?? 128, { used: withRecycle, ratio: recycleRatio });
    const grid = optimiseOnGrid(tables, sequences);
    const memo: RefineMemo = new Map();
    evaluated = sequences.map((s, i) => {
      const g = grid[i];
      if (!Number.isFinite(g.value)) return evaluate(basis, cm, s, null);
      const places = placesOf(s, recycleRatio);
      const start = g.boundaries.map((j) => tables.x[j]);
      const refined = refine(basis, cm, places, start, memo);
      // The refined design is kept unless it is clearly worse than the grid design (a safeguard only).
      const before = totalObjective(basis, cm, places, start);
      const better = totalObjective(basis, cm, places, refined) <= before * (1 + 1e-9) ? refined : start;
      return evaluate(basis, cm, s, better, recycleRatio);
    });
  }
  const path = bestPathReference(spec, basis, target);
  const candidates = rank(evaluated, basis, target, cm).map((c) =>
    path ? { ...c, volumeOverBestPath: c.totalVolume !== null ? c.totalVolume / path.volume : null } : c,
  );
  if (!candidates.some((c) => c.feasible)) {
    throw new EngineError("infeasible", `no sequence can reach the target conversion ${target}: ${candidates[0].reason}`, "target.conversion");
  }
  const best = candidates.find((c) => c.feasible);
  checkVolumeMagnitude(best?.totalVolume ?? Infinity, "the smallest train's volume", ratePath);
  const eq = equilibriumConversion(basis);
  return {
    candidates,
    reference: {
      // With a chosen first-stage temperature the single stages are taken at their best temperature.
      singleCSTR: finite(basis.choice ? stageVolume(basis, { type: "CSTR", first: true }, 0, target) : cstrVolume(basis, true, 0, target)),
      singlePFR: finite(basis.choice ? stageVolume(basis, { type: "PFR", first: true }, 0, target) : pfrVolume(basis, true, 0, target)),
      bestTemperaturePath: path,
    },
    ...(eq !== null ? { equilibriumConversion: eq } : {}),
    feedVolumetricFlow: basis.v0,
    objective: cm.kind,
    cautions: [...CAUTIONS, ...(cm.sizes && !spec.train.equalVolume ? [SIZED_CAUTION] : []), ...(withRecycle ? [RECYCLE_CAUTION] : []), ...(basis.choice ? [TEMPERATURE_CAUTION] : [])],
  };
}
