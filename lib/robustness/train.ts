import { EngineError, normaliseRatingSpec, rateTrain, type DesignSpec, type RatingSpec, type StageType } from "@/lib/engine";
import { AppError } from "@/lib/errors";
import { labelFor } from "@/lib/schemas/field-labels";
import { ROBUSTNESS_FIELD_LABELS, ROBUSTNESS_FIELDS, type RobustnessField, type RobustnessRunResult, type UncertainInput } from "@/lib/schemas/robustness";
import { rateUnderUncertainty } from "./monte-carlo";

/** A fixed train: a scenario's resolved design spec and the stage types and volumes (m3) of one candidate (and each tube with recycle's ratio). */
export function trainSpec(spec: DesignSpec | Record<string, unknown>, stages: readonly Record<string, unknown>[]): RatingSpec {
  const s = spec as DesignSpec;
  return {
    feed: s.feed,
    reaction: s.reaction,
    // A tube with recycle is rated at the recycle ratio it was designed with.
    stages: stages.map((st) =>
      st.type === "PFR-recycle" ? { type: "PFR-recycle" as const, volume: st.volume as number, recycleRatio: st.recycleRatio as number } : { type: st.type as StageType, volume: st.volume as number },
    ),
  };
}

function valueAt(spec: unknown, path: string): unknown {
  return path.split(".").reduce<unknown>((node, key) => (node && typeof node === "object" ? (node as Record<string, unknown>)[key] : undefined), spec);
}

/** The uncertain inputs a train offers: each field present in its spec as a number, with its SI value. */
export function offeredFields(train: RatingSpec): { field: RobustnessField; label: string; unit: string; value: number }[] {
  const si = normaliseRatingSpec(train);
  return ROBUSTNESS_FIELDS.flatMap((field) => {
    const v = valueAt(si, field);
    return typeof v === "number" && Number.isFinite(v) ? [{ field, ...ROBUSTNESS_FIELD_LABELS[field], value: v }] : [];
  });
}

/** 400 naming uncertain.N.field for every field the train's spec does not hold as a number. */
export function checkUncertainFields(train: RatingSpec, uncertain: UncertainInput[], prefix = "uncertain"): void {
  const offered = new Set<string>(offeredFields(train).map((f) => f.field));
  const fields: Record<string, string[]> = {};
  uncertain.forEach((u, i) => {
    // In the form's words: the field's label, never its path.
    if (!offered.has(u.field)) fields[`${prefix}.${i}.field`] = [`${labelFor(u.field)} is not an input of this train that can be varied; choose one from the list`];
  });
  if (Object.keys(fields).length > 0) {
    throw new AppError("bad_request", `Not inputs of this train: ${Object.values(fields).flat().join("; ")}`, { fields });
  }
}

/** Rates the train under uncertainty and adds the nominal outlet and the cautions. */
export function rateRobustness(train: RatingSpec, req: { uncertain: UncertainInput[]; target: number; samples: number; seed: number }): RobustnessRunResult {
  const result = rateUnderUncertainty({ spec: train, ...req });
  let nominal: number | null = null;
  let cautions: string[] = [];
  try {
    const rated = rateTrain(normaliseRatingSpec(train));
    nominal = rated.conversionOut;
    cautions = rated.cautions;
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
  }
  return { ...result, target: req.target, nominal, cautions };
}
