import type { RobustnessRunResult, UncertainInput } from "@/lib/schemas/robustness";

export interface RobustnessRunView {
  id: string;
  status: "queued" | "running" | "succeeded" | "failed";
  request: { uncertain: UncertainInput[]; target: number; samples: number; seed: number };
  result: RobustnessRunResult | null;
  error: string | null;
  createdAt: string;
  finishedAt: string | null;
}

export interface OfferedField {
  field: UncertainInput["field"];
  label: string;
  unit: string;
  value: number;
}

export interface RobustnessList {
  runs: RobustnessRunView[];
  fields: OfferedField[];
  target: number;
}
