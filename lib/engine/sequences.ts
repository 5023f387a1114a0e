import { ensure } from "./errors";
import type { StageType, TrainSpec, TrainStageType } from "./types";

/** Longest train the engine searches. */
export const MAX_STAGES = 8;

function allSequences(maxStages: number, types: readonly TrainStageType[]): TrainStageType[][] {
  const out: TrainStageType[][] = [];
  let level: TrainStageType[][] = [[]];
  for (let n = 1; n <= maxStages; n++) {
    level = level.flatMap((s) => types.map((t) => [...s, t]));
    out.push(...level);
  }
  return out;
}

function orderings(counts: ReadonlyMap<StageType, number>): StageType[][] {
  const total = [...counts.values()].reduce((s, v) => s + v, 0);
  if (total === 0) return [[]];
  const out: StageType[][] = [];
  for (const [t, c] of counts) {
    if (c === 0) continue;
    const rest = new Map(counts);
    rest.set(t, c - 1);
    for (const tail of orderings(rest)) out.push([t, ...tail]);
  }
  return out;
}

/** Every sequence of stage types a train spec asks for, without duplicates, in a stable order. */
export function enumerateSequences(train: TrainSpec): TrainStageType[][] {
  if ("maxStages" in train) {
    const n = train.maxStages;
    ensure(Number.isInteger(n) && n >= 1 && n <= MAX_STAGES, `maxStages must be an integer within 1..${MAX_STAGES}`, "train.maxStages");
    const types: TrainStageType[] = [...new Set<TrainStageType>(train.types ?? ["CSTR", "PFR"])];
    ensure(types.length > 0, "give at least one stage type", "train.types");
    return allSequences(n, types);
  }
  if ("candidates" in train) {
    ensure(train.candidates.length > 0, "give at least one candidate sequence", "train.candidates");
    const seen = new Set<string>();
    const out: TrainStageType[][] = [];
    train.candidates.forEach((s, i) => {
      ensure(s.length >= 1 && s.length <= MAX_STAGES, `a candidate has 1..${MAX_STAGES} stages`, `train.candidates.${i}`);
      const key = s.join(",");
      if (!seen.has(key)) out.push([...s]);
      seen.add(key);
    });
    return out;
  }
  const counts = new Map<StageType, number>();
  for (const t of ["CSTR", "PFR"] as const) {
    const c = train.multiset[t] ?? 0;
    ensure(Number.isInteger(c) && c >= 0, "stage counts must be whole numbers >= 0", `train.multiset.${t}`);
    counts.set(t, c);
  }
  const total = [...counts.values()].reduce((s, v) => s + v, 0);
  ensure(total >= 1 && total <= MAX_STAGES, `the multiset holds 1..${MAX_STAGES} stages`, "train.multiset");
  return orderings(counts);
}
