/** Shapes of the JSON API's sweep and candidate answers, as the screens read them. */
import type { TrainPlan } from "@/lib/costs/train-plan";
import type { StagePlot, StageResult, StageType } from "@/lib/engine/types";

export type SweepStatus = "queued" | "running" | "succeeded" | "failed" | "cancelled";

export interface SweepProgress {
  done: number;
  total: number;
  fraction: number;
  elapsedSeconds: number | null;
  remainingSeconds: number | null;
}

export interface GridAxis {
  field: string;
  values?: number[];
  from?: number;
  to?: number;
  steps?: number;
  scale?: "linear" | "log";
}

export interface SweepView {
  id: string;
  projectId: string;
  name: string;
  status: SweepStatus;
  total: number;
  done: number;
  failedScenarios: number;
  error: string | null;
  grid: GridAxis[];
  rerunOf: string | null;
  submittedBy: string;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  spec: {
    target?: { conversion: number };
    objective?: { minimise: "volume" | "cost" };
    reaction?: { thermal?: { mode: string; adiabaticRise?: unknown; maxTemperature?: unknown } };
  } & Record<string, unknown>;
  progress: SweepProgress;
}

export interface ScenarioReference {
  singleCSTR: number | null;
  singlePFR: number | null;
  equilibriumConversion: number | null;
  feedVolumetricFlow?: number;
  objective?: "volume" | "cost";
}

export interface ScenarioRow {
  index: number;
  overrides: Record<string, number>;
  status: "pending" | "succeeded" | "failed";
  error: { message: string; path: string | null; code: string } | null;
  bestObjective: number | null;
  reference: ScenarioReference | null;
  candidateCount: number;
}

/** A stage as stored with a candidate (its plot data travels separately). */
export type StoredStage = Omit<StageResult, "levenspiel">;

export interface CandidateRow {
  id: string;
  rank: number;
  sequenceKey: string;
  sequence: StageType[];
  stageCount: number;
  feasible: boolean;
  totalVolume: number | null;
  totalCost: number | null;
  ratioToPfr: number | null;
  /** Probability of meeting the target under the sweep's uncertain inputs, when it asked for them. */
  probabilityMeet?: number | null;
  reason: string | null;
  stages: StoredStage[];
  /** Stages that do no work (the train reduces to a shorter one); ranked after every train without. */
  emptyStages?: number;
  levenspiel?: StagePlot[];
  /** Installed cost (purchase × installation factor, less reuse) when the sweep was costed. */
  installedCost?: number | null;
  /** Vessels reused from the inventory. */
  reused?: number;
  /** Installed cost had every vessel been bought new, when the sweep reuses idle vessels. */
  allNewCost?: number | null;
}

export interface CandidatePage {
  scenario: { index: number; overrides: Record<string, number>; status: string; error: unknown; reference: ScenarioReference | null };
  page: number;
  pageSize: number;
  total: number;
  items: CandidateRow[];
}

export interface CandidateDetail extends Omit<CandidateRow, "sequenceKey" | "reason"> {
  sweep: { id: string; name: string; projectId: string };
  scenario: { index: number; overrides: Record<string, number>; reference: ScenarioReference | null };
  levenspiel: StagePlot[];
  differences: { volumeOverBest: number | null; costOverBest: number | null };
  inventoryPlan?: TrainPlan | null;
}
