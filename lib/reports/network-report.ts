/**
 * The part of a design report that belongs to a train of several reactions: the chemistry in words,
 * the train, the outlet composition table (the feed, then each stage's outlet, one column per
 * species), the key measures, notes on limits and steady states, and the concentration path chart's
 * lines. Pure: the profiles and paths are computed by the caller (network-curves.ts) and passed in.
 */
import type { PinnedNetworkCandidate, NetworkScenarioReference } from "@/lib/sweeps/stored-json";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";
import type { WordLine } from "./kinetics-words";
import { describeHeat, describeNetworkFeed, describeNetworkObjective, describeNetworkReaction, objectiveWords, type ReactionWords } from "./network-words";

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === "object" && !Array.isArray(v) ? (v as Obj) : {});
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

/** A stage of the train along cumulative residence time (the engine's TrainProfileStage). */
export interface ProfileStage {
  type: "CSTR" | "PFR";
  startResidenceTime: number;
  endResidenceTime: number;
  points: { residenceTime: number; concentrations: Record<string, number> }[];
}

/** The single tube's path from the feed (the engine's PathPoint, the parts the report draws). */
export interface PathPointLike {
  residenceTime: number;
  key: number;
  product: number | null;
}

/** What the caller computed from the chemistry and the train; either part may be missing when the engine refused. */
export interface NetworkCurves {
  profiles: { species: string[]; stages: ProfileStage[] } | null;
  paths: { key: string; product: string | null; tube: PathPointLike[]; tanks: PathPointLike[] } | null;
  /** Why a curve is missing, in words. */
  note: string | null;
}

export interface NetworkStageRow {
  index: number;
  type: "CSTR" | "PFR";
  /** m3 */
  volume: number;
  /** s */
  residenceTime: number;
  /** K */
  temperature: number;
  steadyStates: number;
}

export interface CompositionRow {
  /** "Feed" or "Stage 2 (PFR) outlet". */
  label: string;
  /** null for the feed row. */
  stage: number | null;
  /** mol/m3 per species, in `species` order; null where not known. */
  values: (number | null)[];
}

export interface PathChart {
  key: string;
  product: string;
  /** Each stage's segment of C_product against C_key, mol/m3. */
  stages: { index: number; type: "CSTR" | "PFR"; points: { x: number; y: number }[] }[];
  /** The single tube from the feed. */
  tube: { x: number; y: number }[];
  /** Single stirred tanks of every size from the feed. */
  tanks: { x: number; y: number }[];
}

export interface NetworkReference {
  label: string;
  /** Yield or selectivity when maximised, else the volume (m3). */
  objective: number | null;
  /** m3 */
  volume: number | null;
  /** K, when each stage's temperature is chosen. */
  temperature: number | null;
}

export interface NetworkReport {
  species: string[];
  keyReactant: string;
  product: string | null;
  feed: WordLine[];
  reactions: ReactionWords[];
  heat: string;
  objective: WordLine[];
  measures: { conversion: number | null; yield: number | null; selectivity: number | null; totalVolume: number | null; totalResidenceTime: number | null; objective: number | null; objectiveLabel: string };
  stages: NetworkStageRow[];
  composition: { species: string[]; rows: CompositionRow[] };
  limitNotes: string[];
  steadyStateNotes: string[];
  /** The best single stirred tank and single tube from the same feed (null numbers: it cannot meet the limits). */
  references: NetworkReference[];
  chart: PathChart | null;
  /** Why there is no path chart (no wanted product, or the engine could not draw it). */
  chartNote: string | null;
  /** The pinned candidate, the chemistry it was computed with and the profiles: the JSON export's payload. */
  candidate: PinnedNetworkCandidate;
  chemistry: Obj;
  profiles: NetworkCurves["profiles"];
}

export interface NetworkReportInput {
  candidate: PinnedNetworkCandidate;
  /** The scenario's design spec: feed, phase, reactions, key reactant, heat mode, train, objective, limits. */
  spec: Obj;
  /** The units the engineer typed the model in (the kinetics version's shownUnits). */
  shownUnits: Record<string, string>;
  /** The model's wanted product, used when the objective names none. */
  modelProduct: string | null;
  curves: NetworkCurves | null;
}

function reference_(label: string, ref: unknown): NetworkReference {
  const r = obj(ref);
  return { label, objective: num(r.objective), volume: num(r.volume), temperature: num(r.temperature) };
}

/** The network section of a report from the frozen candidate and its scenario's spec. */
export function buildNetworkReport(input: NetworkReportInput): NetworkReport {
  const { candidate: c, spec, shownUnits, curves } = input;
  const feed = obj(obj(spec.feed).concentrations);
  const species = curves?.profiles?.species ?? Object.keys(feed);
  const keyReactant = String(spec.keyReactant ?? "");
  const product = (obj(spec.objective).product as string | undefined) ?? input.modelProduct ?? null;
  const stages: NetworkStageRow[] = c.stages.map((s, i) => ({
    index: i + 1,
    type: s.type,
    volume: s.volume,
    residenceTime: s.residenceTime,
    temperature: s.temperature,
    steadyStates: s.steadyStates?.length ?? 1,
  }));

  // The feed row: stored numbers, or (for a quantity kept with its unit) the first profile point, which is the feed.
  const inlet = curves?.profiles?.stages[0]?.points[0]?.concentrations ?? {};
  const feedRow: CompositionRow = { label: "Feed", stage: null, values: species.map((sp) => num(feed[sp]) ?? num(inlet[sp])) };
  const rows: CompositionRow[] = [feedRow, ...c.stages.map((s, i) => ({ label: `Stage ${i + 1} (${s.type}) outlet`, stage: i + 1, values: species.map((sp) => num(s.outlet[sp])) }))];

  const limitNotes = (c.onBound ?? []).map((b) => `At a limit: ${b.charAt(0).toUpperCase()}${b.slice(1)}.`);
  const steadyStateNotes = c.stages.flatMap((s, i) =>
    s.steadyStates && s.steadyStates.length > 1
      ? [
          `Stage ${i + 1} (${s.type}) has ${s.steadyStates.length} steady states at this size (conversion ${s.steadyStates.map((x) => `${formatNumber(x.conversion * 100, 3, RECORD_NUMBERS)} %`).join(", ")}); ` +
            `the train continues from the lowest, and start-up decides which one the plant reaches.`,
        ]
      : [],
  );
  const reference = c.scenario.reference as NetworkScenarioReference | null;

  let chart: PathChart | null = null;
  let chartNote: string | null = null;
  if (!product) chartNote = "No wanted product is named, so there is no concentration path to draw.";
  else if (!curves?.profiles || !curves.paths) chartNote = curves?.note ?? "The concentration path could not be computed for this design.";
  else {
    const at = (conc: Record<string, number>) => ({ x: conc[keyReactant] ?? NaN, y: conc[product] ?? NaN });
    chart = {
      key: keyReactant,
      product,
      stages: curves.profiles.stages.map((s, i) => ({ index: i, type: s.type, points: s.points.map((p) => at(p.concentrations)) })),
      tube: curves.paths.tube.filter((p) => p.product !== null).map((p) => ({ x: p.key, y: p.product as number })),
      tanks: curves.paths.tanks.filter((p) => p.product !== null).map((p) => ({ x: p.key, y: p.product as number })),
    };
  }

  return {
    species,
    keyReactant,
    product,
    feed: describeNetworkFeed(spec, shownUnits),
    reactions: (Array.isArray(spec.reactions) ? spec.reactions : []).map((r, j) => describeNetworkReaction(r, j, shownUnits)),
    heat: describeHeat(spec.thermal),
    objective: describeNetworkObjective(spec),
    measures: {
      conversion: c.conversion,
      yield: c.yield,
      selectivity: c.selectivity,
      totalVolume: c.totalVolume,
      totalResidenceTime: c.totalResidenceTime,
      objective: c.objective,
      objectiveLabel: objectiveWords(spec.objective),
    },
    stages,
    composition: { species, rows },
    limitNotes,
    steadyStateNotes,
    references: reference ? [reference_("Single stirred tank", reference.singleCSTR), reference_("Single tube", reference.singlePFR)] : [],
    chart,
    chartNote,
    candidate: c,
    chemistry: spec,
    profiles: curves?.profiles ?? null,
  };
}

/** True for a frozen candidate of a train of several reactions. */
export function isPinnedNetworkCandidate(candidate: unknown): candidate is PinnedNetworkCandidate {
  return obj(candidate).kind === "network";
}
