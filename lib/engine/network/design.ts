import { EngineError, ensure } from "../errors";
import type { Quantity, StageType } from "../types";
import { toSI } from "../units";
import { cstrSteadyStates } from "./cstr";
import { tanksHaveOneState } from "./cstr-uniqueness";
import type { NetworkCandidate, NetworkDesignResult, NetworkDesignSpec, NetworkReferenceDesign, NetworkStageResult } from "./design-types";
import { makeKinetics, type Kinetics } from "./kinetics";
import { chemistryTimeScale } from "./time-scale";
import { streamMeasures } from "./measures";
import { better, GRID_POINTS, optimiseSequence, POLISH_STARTS, type SequenceDesign } from "./optimise";
import { pfrOutlet } from "./pfr";
import { resolveNetwork } from "./resolve";
import { isFeasible, scoreOutlet, stageOutlet, type DesignProblem } from "./train-eval";

/**
 * Designs trains of stirred tanks and tubes for a reaction network: every sequence of 1..maxStages stages
 * over the stage types (or the listed sequences), each at its best residence times (optimise.ts), ranked
 * best first; sequences that cannot meet the limits follow with `feasible: false` and their reason.
 *
 * Stages are isothermal at the feed temperature, or each at its own temperature within the bounds given.
 * @throws EngineError naming the field at fault; `constraints.maxTotalVolume` when the objective keeps
 * improving as the volume grows; `constraints.minConversion` / `constraints.minYield` when no train meets them.
 */
export interface NetworkDesignOptions {
  /** Tube tolerance during the search. @default 1e-6 */
  searchRtol?: number;
  /** Scan grid points per stage. @default 16 */
  gridPoints?: number;
  /** Designs polished per sequence. @default 1 */
  polishStarts?: number;
}

export function designNetwork(spec: NetworkDesignSpec, options: NetworkDesignOptions = {}): NetworkDesignResult {
  const net = resolveNetwork(spec);
  const kin = makeKinetics(net);
  const problem = { ...makeProblem(spec, kin), ...definedOnly(options) };
  const sequences = sequencesOf(spec);
  const memo = new Map<string, SequenceDesign>();
  const designs = sequences.map((s) => optimiseSequence(problem, s, memo));

  const candidates = designs.map((d) => report(problem, d, spec.objective.product));
  checkBounded(problem, designs);
  const feasible = candidates.filter((c) => c.feasible);
  if (feasible.length === 0) {
    const yieldOnly = candidates.some((c) => c.reason === YIELD_SHORT);
    throw new EngineError(
      "infeasible",
      yieldOnly ? "no train reaches the minimum yield within the volume limits" : "no train reaches the minimum conversion within the volume limits",
      yieldOnly ? "constraints.minYield" : "constraints.minConversion",
    );
  }
  const volume = problem.kind === "volume";
  // Objectives equal to 1e-9 relative are a tie (the optimiser's own accuracy): then the train with fewer
  // stages in use, then fewer stages, then the smaller volume comes first.
  const used = (c: NetworkCandidate) => c.stages.filter((s) => s.volume > 0).length;
  feasible.sort((a, b) => {
    const gap = volume ? a.objective! - b.objective! : b.objective! - a.objective!;
    if (Math.abs(gap) > 1e-9 * Math.max(Math.abs(a.objective!), Math.abs(b.objective!))) return gap;
    return used(a) - used(b) || a.sequence.length - b.sequence.length || a.totalVolume! - b.totalVolume!;
  });
  const ranked = [...feasible, ...candidates.filter((c) => !c.feasible)].map((c, i) => ({ ...c, rank: i + 1 }));
  const reference = (type: StageType): NetworkReferenceDesign | null => {
    const c = report(problem, optimiseSequence(problem, [type], memo), spec.objective.product);
    if (!c.feasible) return null;
    return { objective: c.objective!, volume: c.totalVolume!, ...(problem.temperatures ? { temperature: c.stages[0].temperature } : {}) };
  };
  return { candidates: ranked, reference: { singleCSTR: reference("CSTR"), singlePFR: reference("PFR") } };
}

/** Tube tolerance during the search (bench/network-design.bench.ts compares with a search at 1e-10). */
const SEARCH_RTOL = 1e-6;
const CONVERSION_SHORT = "does not reach the minimum conversion within the volume limits";
const YIELD_SHORT = "reaches the minimum conversion but not the minimum yield within the volume limits";

export function makeProblem(spec: NetworkDesignSpec, kin: Kinetics): DesignProblem {
  const net = kin.net;
  const objective = spec.objective;
  const c = spec.constraints ?? {};
  let product = -1;
  if (objective.product !== undefined) {
    const p = net.index.get(objective.product);
    if (p === undefined) throw new EngineError("invalid-spec", `the product "${objective.product}" is not in the feed`, "objective.product");
    let changed = false;
    for (let j = 0; j < net.nReactions; j++) if (net.nu[p * net.nReactions + j] !== 0) changed = true;
    ensure(changed, `no reaction forms or consumes the product "${objective.product}"`, "objective.product");
    product = p;
  }
  const kind = "maximise" in objective ? objective.maximise : "volume";
  ensure(kind !== "volume" || c.minConversion !== undefined, "give the minimum conversion the least volume must reach", "constraints.minConversion");
  ensure(c.minYield === undefined || product >= 0, "name the product whose yield is limited", "objective.product");
  const limit = (q: Quantity | undefined, path: string) => {
    if (q === undefined) return Number.POSITIVE_INFINITY;
    const v = toSI(q, "m^3", path);
    ensure(v > 0, "a volume limit must be above zero", path);
    return v / net.v0;
  };
  const maxTotalTau = limit(c.maxTotalVolume, "constraints.maxTotalVolume");
  const maxStageTau = limit(c.maxStageVolume, "constraints.maxStageVolume");

  // Time scale of the chemistry: the time the feed's key reactant lasts at its initial rate of use.
  const tc = chemistryTimeScale(kin);
  // The scan reaches the volume limit, or far beyond where the key reactant is used up when there is none.
  const tauHi = Number.isFinite(maxTotalTau) ? maxTotalTau : Number.isFinite(maxStageTau) ? maxStageTau : 1e4 * tc;
  return {
    kin,
    T: net.T0,
    temperatures: net.temperatureBounds,
    product,
    kind,
    minConversion: c.minConversion ?? null,
    minYield: c.minYield ?? null,
    maxTotalTau,
    maxStageTau,
    tauLo: 1e-3 * tc,
    tauHi,
    searchRtol: SEARCH_RTOL,
    tanksUnique: tanksHaveOneState(net),
    gridPoints: GRID_POINTS,
    polishStarts: POLISH_STARTS,
    warmStarts: [],
    feedTube: {},
  };
}

function sequencesOf(spec: NetworkDesignSpec): StageType[][] {
  const train = spec.train;
  if ("candidates" in train) return train.candidates.map((c) => [...c]);
  const types = train.types ?? ["CSTR", "PFR"];
  const out: StageType[][] = [];
  let layer: StageType[][] = [[]];
  for (let n = 1; n <= train.maxStages; n++) {
    layer = layer.flatMap((s) => types.map((t) => [...s, t]));
    out.push(...layer);
  }
  return out;
}

/** The reported design: every tank re-solved with the full steady-state search (all states listed). */
function report(p: DesignProblem, d: SequenceDesign, product: string | undefined): NetworkCandidate {
  try {
    return reportSolved(p, d, product);
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    const nulls = { objective: null, totalVolume: null, totalResidenceTime: null, conversion: null, yield: null, selectivity: null, outlet: null };
    return { rank: 0, sequence: d.sequence, feasible: false, ...nulls, stages: [], reason: `no design of this train could be solved: ${err.message}` };
  }
}

function reportSolved(p: DesignProblem, d: SequenceDesign, product: string | undefined): NetworkCandidate {
  const net = p.kin.net;
  const stages: NetworkStageResult[] = [];
  let F = net.F0;
  d.sequence.forEach((type, s) => {
    const tau = d.taus[s];
    const V = tau * net.v0;
    const T = d.temps[s];
    const stage: NetworkStageResult = { type, volume: V, residenceTime: tau, temperature: T, outlet: {} };
    if (tau > 0 && type === "PFR") F = pfrOutlet(p.kin, F, T, V).flows;
    else if (tau > 0) {
      const states = cstrSteadyStates(p.kin, F, T, V, { path: `stages.${s}` });
      if (states.length > 1) stage.steadyStates = states.map((q) => ({ conversion: q.conversion, outlet: streamMeasures(p.kin, q.flows, T).outlet }));
      F = states[0].flows;
    }
    stage.outlet = streamMeasures(p.kin, F, T).outlet;
    stages.push(stage);
  });
  const totalTau = d.taus.reduce((a, b) => a + b, 0);
  const score = scoreOutlet(p, F, totalTau);
  const base = { rank: 0, sequence: d.sequence };
  if (!isFeasible(score)) {
    return { ...base, feasible: false, objective: null, totalVolume: null, totalResidenceTime: null, conversion: null, yield: null, selectivity: null, outlet: null, stages: [], reason: score.conversionShort ? CONVERSION_SHORT : YIELD_SHORT };
  }
  // Gas outlet concentrations are at the last stage's temperature.
  const m = streamMeasures(p.kin, F, d.temps[d.temps.length - 1], product);
  const onBound: string[] = [];
  d.taus.forEach((t, s) => {
    if (t === 0) onBound.push(`stage ${s + 1}: zero volume`);
    else if (Math.abs(t - p.maxStageTau) <= 1e-9 * t) onBound.push(`stage ${s + 1}: largest stage volume`);
    const b = p.temperatures;
    if (t > 0 && b !== null && b.max > b.min) {
      if (d.temps[s] - b.min <= 1e-6 * (b.max - b.min)) onBound.push(`stage ${s + 1}: lowest temperature`);
      else if (b.max - d.temps[s] <= 1e-6 * (b.max - b.min)) onBound.push(`stage ${s + 1}: highest temperature`);
    }
  });
  if (Math.abs(totalTau - p.maxTotalTau) <= 1e-9 * totalTau) onBound.push("largest total volume");
  return {
    ...base,
    feasible: true,
    objective: p.kind === "volume" ? totalTau * net.v0 : score.value,
    totalVolume: totalTau * net.v0,
    totalResidenceTime: totalTau,
    conversion: m.conversion,
    yield: m.yield,
    selectivity: m.selectivity,
    outlet: m.outlet,
    stages,
    ...(onBound.length > 0 ? { onBound } : {}),
  };
}

/** Without a volume limit, an objective still improving when the best design is made ten times larger has no finite optimum. */
function checkBounded(p: DesignProblem, designs: SequenceDesign[]): void {
  if (p.kind === "volume" || Number.isFinite(p.maxTotalTau) || Number.isFinite(p.maxStageTau)) return;
  const best = designs.reduce((a, b) => (better(b, a) ? b : a));
  if (!isFeasible(best.score)) return;
  const larger = designs.some((d) => {
    if (!isFeasible(d.score) || d.score.value < best.score.value - 1e-9 * Math.abs(best.score.value)) return false;
    const taus = d.taus.map((t) => t * 10);
    const F = trainFlows(p, d.sequence, taus, d.temps);
    return scoreOutlet(p, F, 0).value >= d.score.value - 1e-9 * Math.abs(d.score.value);
  });
  if (larger) {
    throw new EngineError("invalid-spec", "the objective keeps improving as the volume grows; give a largest total volume", "constraints.maxTotalVolume");
  }
}

function trainFlows(p: DesignProblem, sequence: readonly StageType[], taus: readonly number[], temps: readonly number[]): Float64Array {
  let F = p.kin.net.F0;
  sequence.forEach((type, s) => {
    F = stageOutlet(p, type, F, taus[s], temps[s]);
  });
  return F;
}

function definedOnly(options: NetworkDesignOptions): NetworkDesignOptions {
  return Object.fromEntries(Object.entries(options).filter(([, v]) => v !== undefined));
}
