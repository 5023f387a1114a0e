import { describe, expect, expectTypeOf, it } from "vitest";
import type { TrainStageType } from "@/lib/engine";
import { keyOfWrittenSequence, sequenceFromKey, sequenceKey, TRAIN_STAGE_TYPES } from "@/lib/stage-types";

describe("sequence keys", () => {
  it("the run-time list of a one-reaction train's stage types is the engine's TrainStageType", () => {
    expectTypeOf<(typeof TRAIN_STAGE_TYPES)[number]>().toEqualTypeOf<TrainStageType>();
    expect(new Set(TRAIN_STAGE_TYPES).size).toBe(TRAIN_STAGE_TYPES.length);
  });

  it("keys of CSTR and PFR trains are as stored before the tube with recycle", () => {
    expect(sequenceKey(["CSTR", "PFR", "PFR"])).toBe("CSTR-PFR-PFR");
    expect(sequenceFromKey("CSTR-PFR-PFR")).toEqual(["CSTR", "PFR", "PFR"]);
    expect(sequenceFromKey("")).toEqual([]);
  });

  it("a tube with recycle survives the round trip although its name holds a dash", () => {
    const all: TrainStageType[] = ["CSTR", "PFR", "PFR-recycle"];
    for (const a of all) for (const b of all) for (const c of all) {
      const seq = [a, b, c];
      const key = sequenceKey(seq);
      expect(sequenceFromKey(key)).toEqual(seq);
      expect(key.split("-")).toHaveLength(3);
    }
    expect(sequenceKey(["CSTR", "PFR-recycle"])).toBe("CSTR-PFRrecycle");
  });

  it("the stored filter for a run matches whole stage names only", () => {
    // The candidates query matches '-' || key || '-' LIKE '%-' || run || '-%' (lib/services/candidates.ts).
    const matches = (seq: TrainStageType[], written: string) => `-${sequenceKey(seq)}-`.includes(`-${keyOfWrittenSequence(written)}-`);
    expect(matches(["CSTR", "PFR-recycle"], "CSTR-PFR")).toBe(false);
    expect(matches(["CSTR", "PFR-recycle"], "CSTR-PFR-recycle")).toBe(true);
    expect(matches(["CSTR", "PFR", "PFR-recycle"], "CSTR-PFR")).toBe(true);
    expect(matches(["PFR-recycle", "PFR"], "PFR-recycle-PFR")).toBe(true);
    expect(matches(["PFR-recycle", "PFR"], "PFR-PFR")).toBe(false);
  });
});
