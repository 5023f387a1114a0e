import { describe, expect, it } from "vitest";
import { EngineError } from "../../../../lib/engine/errors";
import { designNetwork } from "../../../../lib/engine/network/design";
import type { NetworkDesignSpec } from "../../../../lib/engine/network/design-types";
import { CA0, seriesDesign, V0 } from "./design-helpers";
import { firstOrder, liquid } from "./helpers";

function errorOf(spec: NetworkDesignSpec): EngineError {
  try {
    designNetwork(spec);
  } catch (err) {
    if (err instanceof EngineError) return err;
    throw err;
  }
  throw new Error("expected an engine error");
}

describe("network designer refusals", { timeout: 120000 }, () => {
  it("no train reaches the minimum conversion within the volume limit", () => {
    // first order k = 0.8 1/s, tau at most 1 s: even a tube reaches only 1 - e^-0.8 = 55 % (closed form)
    const err = errorOf(seriesDesign(0.8, 0.3, { maxStages: 2 }, { minConversion: 0.6, maxTotalVolume: V0 }));
    expect(err.path).toBe("constraints.minConversion");
  });

  it("the conversion is reachable but the yield is not", () => {
    // best yield of B is (0.8/0.3)^(0.3/(0.3-0.8)) = 0.555 in a tube (Levenspiel, ch. 8), so 0.6 cannot be met
    const err = errorOf(seriesDesign(0.8, 0.3, { maxStages: 2 }, { minConversion: 0.5, minYield: 0.6 }));
    expect(err.path).toBe("constraints.minYield");
  });

  it("a train that cannot meet the limits comes last, with its reason and null totals", () => {
    // a tank reaches at most 0.8/1.8 = 44 % with tau 1 s (closed form X = k tau/(1 + k tau)); a tube 55 %
    const r = designNetwork(seriesDesign(0.8, 0.3, { maxStages: 1 }, { minConversion: 0.5, maxTotalVolume: V0 }));
    expect(r.candidates[0]).toMatchObject({ sequence: ["PFR"], feasible: true, rank: 1 });
    expect(r.candidates[1]).toMatchObject({ sequence: ["CSTR"], feasible: false, objective: null, totalVolume: null, outlet: null, stages: [], rank: 2 });
    expect(r.candidates[1].reason).toMatch(/minimum conversion/);
    expect(r.reference.singleCSTR).toBeNull();
  });

  it("a yield that keeps rising with volume asks for a volume limit", () => {
    const spec = { ...liquid({ A: CA0, B: 0 }, [firstOrder("A", "B", 0.5)], "A", V0), train: { maxStages: 2 }, objective: { maximise: "yield" as const, product: "B" } };
    expect(errorOf(spec).path).toBe("constraints.maxTotalVolume");
    // with a limit it fills it: A -> B in a tube of tau 4 s gives 1 - e^-2 (closed form)
    const limited = designNetwork({ ...spec, constraints: { maxTotalVolume: 4 * V0 } });
    expect(limited.candidates[0].objective!).toBeCloseTo(1 - Math.exp(-2), 9);
    expect(limited.candidates[0].onBound).toContain("largest total volume");
  });

  it("least volume without a minimum conversion is refused at its field", () => {
    expect(errorOf(seriesDesign(0.8, 0.3, { maxStages: 1 }, {}, { minimise: "volume" })).path).toBe("constraints.minConversion");
  });
});
