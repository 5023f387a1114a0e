import { describe, expect, it } from "vitest";
import { CAUTIONS, designTrains, rateTrain } from "../../../lib/engine/index";
import { RECYCLE_CAUTION, stageTypeCautions } from "../../../lib/stage-types";

const chemistry = {
  feed: { flowA: 1, concA: 1, ratios: { R: 0.05 } },
  reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power" as const, k: 1, orders: { A: 1, R: 1 } } },
};

describe("the tube with recycle's caution", () => {
  it("is the engine's own sentence, word for word, and only with a tube with recycle", () => {
    const withRecycle = designTrains({ ...chemistry, target: { conversion: 0.9 }, train: { candidates: [["CSTR", "PFR-recycle"]] } });
    expect(withRecycle.cautions).toContain(RECYCLE_CAUTION);
    expect(withRecycle.cautions.filter((c) => !CAUTIONS.includes(c))).toEqual([RECYCLE_CAUTION]);
    const without = designTrains({ ...chemistry, target: { conversion: 0.9 }, train: { candidates: [["CSTR", "PFR"]] } });
    expect(without.cautions).not.toContain(RECYCLE_CAUTION);
  });

  it("is added for trains that hold one", () => {
    expect(stageTypeCautions(["CSTR", "PFR-recycle"])).toEqual([RECYCLE_CAUTION]);
    expect(stageTypeCautions(["CSTR", "PFR"])).toEqual([]);
    // A rating of such a train gets it from the screens (the engine's rating carries the general cautions only).
    expect(rateTrain({ ...chemistry, stages: [{ type: "PFR-recycle", volume: 3, recycleRatio: 0.5 }] }).cautions).not.toContain(RECYCLE_CAUTION);
  });
});
