import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { designNetwork, type NetworkDesignSpec } from "@/lib/engine";
import { applyOverrides } from "@/lib/sweeps/grid";
import { bestNetworkObjective, networkCandidateRows, networkScenarioReference } from "@/lib/sweeps/network-candidate-rows";
import { isNetworkSweepBody } from "@/lib/schemas/sweeps";

// The three-reaction example of the command line (invented chemistry), with two stages at most.
const FIXTURE = JSON.parse(readFileSync("tests/fixtures/specs/network-three-reactions.json", "utf8")) as NetworkDesignSpec;
const SPEC: NetworkDesignSpec = { ...FIXTURE, train: { maxStages: 2, types: ["CSTR", "PFR"] } };

describe("network candidate rows", () => {
  const result = designNetwork(SPEC);
  const rows = networkCandidateRows("sweep", "scenario", result);

  it("keep the engine's ranking and measures, one row per train", () => {
    expect(rows.map((r) => r.sequenceKey)).toEqual(result.candidates.map((c) => c.sequence.join("-")));
    expect(rows.map((r) => r.rank)).toEqual(result.candidates.map((c) => c.rank));
    rows.forEach((r, i) => {
      const c = result.candidates[i]!;
      expect(r).toMatchObject({ stageCount: c.sequence.length, feasible: c.feasible, totalVolume: c.totalVolume, conversion: c.conversion, yield: c.yield, selectivity: c.selectivity, objectiveValue: c.objective });
      expect(r.stages).toEqual(c.stages);
      expect(r.levenspiel).toEqual([]);
      expect(r.totalCost).toBeNull();
    });
  });

  it("give the ratio to the single tube as total volume over the single tube's volume", () => {
    const pfr = result.reference.singlePFR!.volume;
    for (const r of rows.filter((x) => x.feasible)) expect(r.ratioToPfr).toBeCloseTo(r.totalVolume! / pfr, 14);
    // The single tube is one of the candidates: its ratio is 1 by definition (common practice).
    expect(rows.find((r) => r.sequenceKey === "PFR")!.ratioToPfr).toBeCloseTo(1, 12);
  });

  it("store yield as formed product per key reactant fed, and selectivity per key reactant used", () => {
    // Definitions of the trade: Y = (C_B - C_B0)/C_A0 and S = (C_B - C_B0)/(C_A0 - C_A) for a liquid (constant flow).
    for (const r of rows.filter((x) => x.feasible)) {
      const outlet = (r.stages.at(-1) as unknown as { outlet: Record<string, number> }).outlet;
      expect(r.yield!).toBeCloseTo(outlet.B! / 580, 9);
      expect(r.selectivity!).toBeCloseTo(outlet.B! / (580 - outlet.A!), 9);
      expect(r.conversion!).toBeCloseTo(1 - outlet.A! / 580, 9);
    }
  });

  it("write an infeasible train with null measures and its reason", () => {
    const tight = designNetwork({ ...SPEC, constraints: { minConversion: 0.5, maxTotalVolume: 0.008 } });
    // A tank needs k tau >= 1 for half conversion at first order (tau >= 0.1 s, V >= 0.01 m3), a tube only ln 2: the tank alone falls short.
    expect(networkCandidateRows("s", "c", tight).find((r) => r.sequenceKey === "CSTR")!.feasible).toBe(false);
    const bad = networkCandidateRows("s", "c", tight).filter((r) => !r.feasible);
    expect(bad.length).toBeGreaterThan(0);
    for (const r of bad) expect(r).toMatchObject({ totalVolume: null, ratioToPfr: null, yield: null, objectiveValue: null, reason: expect.any(String) });
  });

  it("record the scenario's references, what it ranked by and the feed flow in m3/s", () => {
    const withUnits = { ...SPEC, feed: { ...SPEC.feed, volumetricFlow: "100 L/s" } };
    const ref = networkScenarioReference(withUnits, result);
    expect(ref).toMatchObject({ kind: "network", objective: { maximise: "yield", product: "B" }, singlePFR: result.reference.singlePFR, singleCSTR: result.reference.singleCSTR });
    expect(ref.feedVolumetricFlow).toBeCloseTo(0.1, 12); // 100 L/s = 0.1 m3/s
    expect(bestNetworkObjective(result)).toBe(result.candidates[0]!.objective);
  });
});

describe("grid values at array positions", () => {
  it("change one reaction and keep the reactions a list, without touching the base", () => {
    const out = applyOverrides(SPEC, { "reactions.1.rate.k": 2, "feed.concentrations.A": 600 });
    expect(Array.isArray(out.reactions)).toBe(true);
    expect(out.reactions).toHaveLength(3);
    expect((out.reactions[1]!.rate as { k: number }).k).toBe(2);
    expect((out.reactions[0]!.rate as { k: number }).k).toBe(10);
    expect(out.feed.concentrations.A).toBe(600);
    expect((SPEC.reactions[1]!.rate as { k: number }).k).toBe(1);
    expect(SPEC.feed.concentrations.A).toBe(580);
  });
});

describe("telling a network sweep body from today's", () => {
  it("by its target, limits, heat mode or objective", () => {
    expect(isNetworkSweepBody({ target: { conversion: 0.9 }, objective: { minimise: "volume" } })).toBe(false);
    expect(isNetworkSweepBody({ objective: { maximise: "yield", product: "B" } })).toBe(true);
    expect(isNetworkSweepBody({ constraints: {} })).toBe(true);
    expect(isNetworkSweepBody({ thermal: { mode: "isothermal" } })).toBe(true);
    expect(isNetworkSweepBody({ train: { maxStages: 2 } })).toBe(false);
    expect(isNetworkSweepBody(null)).toBe(false);
  });
});
