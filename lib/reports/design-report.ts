/**
 * The design report of a pinned design: one plain object that the printable page, the PDF,
 * the JSON export and the CSV export all render. Sections whose tables hold no row say so
 * ("not recorded") rather than disappearing, so a reader sees what was never done.
 */
import type { PinnedDesign } from "@/db/schema";
import type { ChartStage, Point } from "@/lib/charts/levenspiel-geometry";
import { CAUTIONS, MODEL_ASSUMPTIONS, thermalWarnings } from "@/lib/engine";
import { typedUnits, type WithShownUnits } from "@/lib/units/typed-units";
import { resolveDisplayUnits, type DisplayPreference } from "@/lib/units/display-preference";
import type { UnitKind } from "@/lib/units/display";
import { describeFeed, describeObjective, describeRate, describeReaction, type WordLine } from "./kinetics-words";
import type { BestTemperaturePath, TrainStageType } from "@/lib/engine";
import { stageTypeCautions, stageTypeName, TRAIN_STAGE_TYPES } from "@/lib/stage-types";
import { isPinnedNetworkCandidate, type NetworkCurves, type NetworkReport } from "./network-report";
import { networkDesignReport } from "./network-design-report";
import { costsSection, kineticsLabel, originSection, pinSection, robustnessSection, sourceSection } from "./report-sections";

export const REPORT_FORMAT = "seriatim.design-report/1";

export type { PinState } from "./design-report-states";
import type { PinState } from "./design-report-states";

export { STATE_LABEL } from "./design-report-states";

export interface ReportStage {
  index: number;
  type: TrainStageType;
  /** A tube with recycle's recycle ratio (recycled flow over the flow leaving the stage); null for other stages. */
  recycleRatio: number | null;
  conversionIn: number;
  conversionOut: number;
  /** K */
  temperatureIn: number;
  /** K */
  temperatureOut: number;
  /** m3 */
  volume: number;
  /** s */
  residenceTime: number;
  vesselCount: number;
  /** m3 */
  vesselSize: number;
  cost: number | null;
}

export interface FitParameter {
  name: string;
  value: number;
  standardError: number | null;
  interval95: [number, number] | null;
}

export interface DesignReport {
  format: typeof REPORT_FORMAT;
  /** "network" for a train of several reactions: then `network` holds its chemistry, composition and path; the one-reaction sections stay empty. */
  kind: "single" | "network";
  network: NetworkReport | null;
  generatedAt: string;
  project: { id: string; name: string; description: string };
  pin: {
    id: string;
    state: PinState;
    stateLabel: string;
    note: string;
    pinnedBy: string;
    pinnedAt: string;
    reviewedBy: string | null;
    reviewedAt: string | null;
    reviewComment: string | null;
  };
  origin: { sweep: { id: string; name: string } | null; scenarioIndex: number | null; overrides: Record<string, number>; rank: number | null };
  feed: WordLine[];
  kinetics: {
    label: string;
    model: string | null;
    version: number | null;
    law: string;
    formula: string;
    parameters: WordLine[];
    reaction: WordLine[];
    /** The units the engineer typed the model in, for the "as typed" display choice. */
    typedUnits: Partial<Record<UnitKind, string>>;
  };
  source:
    | { recorded: false }
    | {
        recorded: true;
        kind: string;
        dataset: string;
        datasetVersion: number;
        fileName: string;
        rowCount: number;
        fit: { law: string | null; formula: string | null; parameters: FitParameter[]; rSquared: number | null; residualSumOfSquares: number | null } | null;
      };
  target: { conversion: number | null; conversionReached: number | null };
  objective: WordLine[];
  train: { sequence: TrainStageType[]; label: string; totalVolume: number | null; totalCost: number | null; ratioToPfr: number | null };
  stages: ReportStage[];
  equilibriumConversion: number | null;
  references: { singleCSTR: number | null; singlePFR: number | null; feedVolumetricFlow: number | null; bestTemperaturePath: BestTemperaturePath | null };
  thermal: { mode: "isothermal" | "adiabatic"; adiabaticRise: number | null; maxTemperature: number | null };
  costs: {
    settings: { recorded: false } | { recorded: true; currency: string | null; basisYear: number | null; correlations: { type: string; a: number | null; b: number | null; n: number | null; source: string }[]; other: WordLine[]; updatedAt: string };
    totalCost: number | null;
    installedCost: number | null;
    inventoryPlan: { recorded: false } | { recorded: true; totalCost: number | null; allNewCost: number | null; assignments: { stage: number; vesselId: string | null; vesselTag: string | null; cost: number | null }[] };
  };
  robustness:
    | { recorded: false }
    | {
        recorded: true;
        runId: string;
        finishedAt: string | null;
        samples: number | null;
        seed: number | null;
        target: number | null;
        uncertain: WordLine[];
        p5: number | null;
        p50: number | null;
        p95: number | null;
        mean: number | null;
        probabilityOfMissingTarget: number | null;
        probabilityStandardError: number | null;
        refusedSamples: number | null;
        /** For a train of several reactions: the yield's distribution and the chances of missing the minimum yield and of meeting every limit. */
        network: {
          yield: { p5: number | null; p50: number | null; p95: number | null; mean: number | null } | null;
          minYield: number | null;
          probabilityMissMinYield: number | null;
          probabilityMeet: number | null;
        } | null;
      };
  assumptions: { note: string; model: string[]; spec: Record<string, unknown> };
  chart: { curve: Point[]; stages: ChartStage[]; target: number | null; equilibrium: number | null };
  cautions: { warnings: string[]; general: string[] };
}

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === "object" && !Array.isArray(v) ? (v as Obj) : {});
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);
const str = (v: unknown): string | null => (typeof v === "string" ? v : null);

/** What the report reads besides the pin; every part optional, as the tables may hold nothing. */
export interface ReportInputs {
  pin: PinnedDesign;
  project: { id: string; name: string; description: string };
  names: Record<string, string>;
  kinetics: { model: string; version: number; spec?: unknown } | null;
  source: { kind: string; fit: Obj | null; dataset: string; datasetVersion: number; fileName: string; rowCount: number } | null;
  candidate: { installedCost: number | null; inventoryPlan: Obj | null } | null;
  costSettings: { settings: Obj; updatedAt: Date } | null;
  robustness: { id: string; request: Obj; result: Obj; finishedAt: Date | null } | null;
  inventoryTags: Record<string, string>;
  now: Date;
  /** The reader's display-unit choice for the feed and temperature lines; absent, SI. */
  preference?: DisplayPreference;
  /** For a train of several reactions: its scenario's design spec (the pin's, else the sweep's with the scenario's values) and its curves. */
  network?: { spec: Obj; curves: NetworkCurves | null };
}

/** The report from what was read: pure, so the same rows always give the same report. */
export function buildDesignReport(input: ReportInputs): DesignReport {
  if (isPinnedNetworkCandidate(input.pin.candidate)) return networkDesignReport(input);
  const wordUnits = input.preference ? resolveDisplayUnits(input.preference, typedUnits(obj(input.kinetics?.spec) as WithShownUnits)) : undefined;
  const { pin } = input;
  const c = obj(pin.candidate);
  const spec = obj(pin.spec);
  const reaction = obj(spec.reaction);
  const thermal = obj(reaction.thermal);
  const scenario = obj(c.scenario);
  const reference = obj(scenario.reference);
  const rawStages = (Array.isArray(c.stages) ? c.stages : []).map(obj);
  const stages: ReportStage[] = rawStages.map((s, i) => {
    const vessels = obj(s.vessels);
    return {
      index: i + 1,
      type: TRAIN_STAGE_TYPES.includes(s.type as TrainStageType) ? (s.type as TrainStageType) : "CSTR",
      recycleRatio: s.type === "PFR-recycle" ? num(s.recycleRatio) : null,
      conversionIn: num(s.conversionIn) ?? 0,
      conversionOut: num(s.conversionOut) ?? 0,
      temperatureIn: num(s.temperatureIn) ?? NaN,
      temperatureOut: num(s.temperatureOut) ?? NaN,
      volume: num(s.volume) ?? 0,
      residenceTime: num(s.residenceTime) ?? NaN,
      vesselCount: num(vessels.count) ?? 1,
      vesselSize: num(vessels.sizeEach) ?? num(s.volume) ?? 0,
      cost: num(s.cost),
    };
  });
  const sequence = (Array.isArray(c.sequence) ? c.sequence : stages.map((s) => s.type)) as TrainStageType[];
  const plots = rawStages.map((s) => obj(s.levenspiel));
  const curve = plots.flatMap((p) => (Array.isArray(p.curve) ? (p.curve as Point[]) : []));
  const rate = describeRate(reaction.rate);
  const target = num(obj(spec.target).conversion);
  const equilibrium = num(reference.equilibriumConversion);
  const adiabatic = thermal.mode === "adiabatic";

  return {
    format: REPORT_FORMAT,
    kind: "single",
    network: null,
    generatedAt: input.now.toISOString(),
    project: input.project,
    pin: pinSection(input),
    origin: originSection(input),
    feed: describeFeed(spec.feed, wordUnits),
    kinetics: {
      label: kineticsLabel(input),
      model: input.kinetics?.model ?? null,
      version: input.kinetics?.version ?? null,
      typedUnits: typedUnits(obj(input.kinetics?.spec) as WithShownUnits),
      law: rate.law,
      formula: rate.formula,
      parameters: rate.parameters,
      reaction: describeReaction(reaction, wordUnits),
    },
    source: sourceSection(input),
    target: { conversion: target, conversionReached: num(c.conversionReached) ?? (stages.length ? stages[stages.length - 1].conversionOut : null) },
    objective: describeObjective(spec),
    train: { sequence, label: sequence.map(stageTypeName).join(" → "), totalVolume: num(c.totalVolume), totalCost: num(c.totalCost), ratioToPfr: num(c.ratioToPfr) },
    stages,
    equilibriumConversion: equilibrium,
    references: {
      singleCSTR: num(reference.singleCSTR),
      singlePFR: num(reference.singlePFR),
      feedVolumetricFlow: num(reference.feedVolumetricFlow),
      bestTemperaturePath: bestPathOf(reference.bestTemperaturePath),
    },
    thermal: { mode: adiabatic ? "adiabatic" : "isothermal", adiabaticRise: num(thermal.adiabaticRise), maxTemperature: num(thermal.maxTemperature) },
    costs: costsSection(input, num(c.totalCost)),
    robustness: robustnessSection(input),
    assumptions: { note: pin.note, model: [...MODEL_ASSUMPTIONS], spec },
    chart: {
      curve,
      stages: stages.map((s, i) => {
        const recycle = obj(plots[i].recycle);
        const x1 = num(recycle.inletConversion);
        return {
          type: s.type,
          conversionIn: s.conversionIn,
          conversionOut: s.conversionOut,
          volume: s.volume,
          area: Array.isArray(plots[i].area) ? (plots[i].area as Point[]) : undefined,
          // A tube with recycle's tube: from its mixed inlet, with the area under the curve the chart draws.
          ...(s.type === "PFR-recycle" && s.recycleRatio !== null && x1 !== null
            ? { recycle: { recycleRatio: s.recycleRatio, inletConversion: x1, underCurve: Array.isArray(recycle.underCurve) ? (recycle.underCurve as Point[]) : undefined } }
            : {}),
        };
      }),
      target,
      equilibrium,
    },
    cautions: {
      warnings: thermalWarnings({ thermal: adiabatic ? (thermal as { mode: string }) : null, stageTemperatures: stages.map((s) => s.temperatureOut).filter(Number.isFinite) }),
      general: [...CAUTIONS, ...stageTypeCautions(sequence)],
    },
  };
}

/**
 * The costing a report shows: the pin's frozen copy wins; pins made before it held costing fall
 * back to the candidate row.
 */
export function reportCosting(pin: PinnedDesign, candidate: { installedCost: number | null; inventoryPlan: unknown } | null): ReportInputs["candidate"] {
  const frozen = pin.candidate as { installedCost?: number | null; inventoryPlan?: Obj | null };
  if (frozen.installedCost != null) return { installedCost: frozen.installedCost ?? null, inventoryPlan: frozen.inventoryPlan ?? null };
  return candidate ? { installedCost: candidate.installedCost, inventoryPlan: (candidate.inventoryPlan as Obj | null) ?? null } : null;
}

/** The idle vessels a costing's reuse plan assigns, by id, whose tags the report names. */
export function plannedVesselIds(costing: ReportInputs["candidate"]): string[] {
  const plan = obj(costing?.inventoryPlan);
  return (Array.isArray(plan.assignments) ? plan.assignments : []).map((a) => str(obj(a).vesselId)).filter((id): id is string => !!id);
}

/** A stored best temperature path, when the scenario has a whole one (older scenarios have none). */
function bestPathOf(v: unknown): BestTemperaturePath | null {
  const p = obj(v);
  const volume = num(p.volume);
  const lowest = num(p.lowestTemperature);
  const highest = num(p.highestTemperature);
  if (volume === null || lowest === null || highest === null || !Array.isArray(p.points)) return null;
  const points = p.points.map(obj).flatMap((q) => {
    const conversion = num(q.conversion);
    const temperature = num(q.temperature);
    const equilibriumTemperature = num(q.equilibriumTemperature);
    if (conversion === null || temperature === null) return [];
    return [equilibriumTemperature === null ? { conversion, temperature } : { conversion, temperature, equilibriumTemperature }];
  });
  return { volume, lowestTemperature: lowest, highestTemperature: highest, points };
}
