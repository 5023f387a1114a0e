/**
 * The stage types as run-time lists, for zod enums, selects and loops, and the one way a sequence of
 * types is written as a key (the database's sequence_key, filters, links).
 * The types themselves are the engine's (StageType, TrainStageType); this module has no dependencies so
 * screens, schemas and the seed can all take the lists from here instead of spelling them again.
 */
import type { StageType, TrainStageType } from "@/lib/engine";

/** In the order screens list them. tests/unit/sweeps/shared-lists.test.ts checks it covers StageType. */
export const STAGE_TYPES = ["CSTR", "PFR"] as const satisfies readonly StageType[];

/** Every stage type of a one-reaction train: the ideal two and the tube with recycle. */
export const TRAIN_STAGE_TYPES = ["CSTR", "PFR", "PFR-recycle"] as const satisfies readonly TrainStageType[];

/**
 * A sequence key joins the types with "-" ("CSTR-PFR"); keys stored before the tube with recycle existed
 * keep their meaning. "PFR-recycle" itself holds a "-", so in a key it is written "PFRrecycle": a key
 * then splits back unambiguously, and a filter for the run "CSTR-PFR" (matched as "-CSTR-PFR-" inside
 * "-" + key + "-") never matches a CSTR followed by a tube with recycle.
 */
const KEY_TOKEN: Readonly<Record<TrainStageType, string>> = { CSTR: "CSTR", PFR: "PFR", "PFR-recycle": "PFRrecycle" };
const TYPE_OF_TOKEN: ReadonlyMap<string, TrainStageType> = new Map(TRAIN_STAGE_TYPES.map((t) => [KEY_TOKEN[t], t]));

/** The key of a sequence of stage types, e.g. "CSTR-PFR" or "CSTR-PFRrecycle". */
export function sequenceKey(sequence: readonly TrainStageType[]): string {
  return sequence.map((t) => KEY_TOKEN[t]).join("-");
}

/**
 * The sequence a key stands for. A token that is no stage type is kept as it is (a network's stored keys
 * hold only CSTR and PFR, which read back as themselves).
 */
export function sequenceFromKey(key: string): TrainStageType[] {
  if (key === "") return [];
  return key.split("-").map((token) => TYPE_OF_TOKEN.get(token) ?? (token as TrainStageType));
}

/** A run of types as a person writes it ("CSTR-PFR-recycle") in key form ("CSTR-PFRrecycle"), for filters. */
export function keyOfWrittenSequence(written: string): string {
  return written.replaceAll("PFR-recycle", KEY_TOKEN["PFR-recycle"]);
}

/**
 * What a stage type is called on screen, in the report and in exports: the trade's words. The short
 * label goes in badges and narrow columns; the name where there is room (selects, stage tables).
 * One name per type everywhere: a tube with part of its outlet recycled is "Tube with recycle", badged "PFR+R".
 */
export const STAGE_TYPE_NAME: Readonly<Record<TrainStageType, string>> = { CSTR: "CSTR", PFR: "PFR", "PFR-recycle": "Tube with recycle" };
export const STAGE_TYPE_SHORT: Readonly<Record<TrainStageType, string>> = { CSTR: "CSTR", PFR: "PFR", "PFR-recycle": "PFR+R" };

/** The name of a stored type, or the stored word itself for one the screens do not know. */
export const stageTypeName = (type: string): string => STAGE_TYPE_NAME[type as TrainStageType] ?? type;
export const stageTypeShort = (type: string): string => STAGE_TYPE_SHORT[type as TrainStageType] ?? type;

/**
 * A run of stage types as a filter takes it: types joined by "-", a tube with recycle written "PFR-recycle"
 * (as in sweep files) or "PFRrecycle" (as in keys), e.g. "CSTR-PFR-recycle".
 */
export const WRITTEN_SEQUENCE = /^(CSTR|PFR-recycle|PFRrecycle|PFR)(-(CSTR|PFR-recycle|PFRrecycle|PFR))*$/;

/**
 * The caution a result with a tube with recycle carries, in the engine's words (lib/engine/design.ts adds it to
 * a design's cautions but does not export it; tests/unit/sweeps/recycle-caution.test.ts checks this copy against
 * the engine's output so the two cannot drift). Screens, the report, its PDF and the exports show it beside the
 * general cautions whenever a train shown holds a tube with recycle.
 */
export const RECYCLE_CAUTION =
  "A tube with recycle is taken with its recycle mixed perfectly into the feed at the tube's inlet and plug flow in the tube; the recycle pump and line, their cost and their hold-up are not included.";

/** The cautions the stage types of the trains shown add to the general ones: the tube with recycle's, or none. */
export function stageTypeCautions(types: Iterable<string>): string[] {
  for (const t of types) if (t === "PFR-recycle") return [RECYCLE_CAUTION];
  return [];
}
