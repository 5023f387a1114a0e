import { describe, expect, it } from "vitest";
import { costObjectiveOf, defaultCostBasis, installedCost, standardSizesOf } from "@/lib/costs/cost-basis";
import { withCosting } from "@/lib/costs/candidate-costing";
import { costBasisSchema } from "@/lib/schemas/costs";
import { inventoryVesselSchema } from "@/lib/schemas/inventory";
import { DEMO_COST_BASIS, DEMO_INVENTORY } from "@/lib/demo/inventory";

describe("the default cost basis", () => {
  it("is valid, and every number says where it comes from", () => {
    const basis = defaultCostBasis();
    expect(costBasisSchema.safeParse(basis).success).toBe(true);
    for (const s of [basis.vessels.CSTR.source, basis.vessels.PFR.source, basis.installationFactor.source]) expect(s).toMatch(/from memory|common practice/);
    // Size exponents of vessels lie near 0.6–0.8 (common practice); the installation factor within 3–5 (from memory).
    for (const v of Object.values(basis.vessels)) expect(v.n).toBeGreaterThanOrEqual(0.5);
    expect(basis.installationFactor.value).toBeGreaterThanOrEqual(3);
  });

  it("buys ISO 3 R10 preferred sizes between its limits", () => {
    // ISO 3, series R10: 1.00 1.25 1.60 2.00 2.50 3.15 4.00 5.00 6.30 8.00 in every decade.
    expect(standardSizesOf({ sizes: { mode: "r10", min: 0.5, max: 2 } })).toEqual([0.5, 0.63, 0.8, 1, 1.25, 1.6, 2]);
    expect(standardSizesOf({ sizes: { mode: "custom", values: [4, 1, 4, 2] } })).toEqual([1, 2, 4]);
    expect(standardSizesOf({ sizes: { mode: "any" } })).toBeNull();
  });

  it("gives the engine's cost objective without sources", () => {
    const o = costObjectiveOf({ ...defaultCostBasis(), sizes: { mode: "any" }, maxVesselVolume: null });
    expect(o).toEqual({ minimise: "cost", vessels: { CSTR: { a: 61500, b: 32500, n: 0.8 }, PFR: { a: 11600, b: 34000, n: 0.6 } } });
  });

  it("rejects a basis with a bad field, naming it", () => {
    const bad = { ...defaultCostBasis(), vessels: { ...defaultCostBasis().vessels, PFR: { a: 1, b: 2, n: 0, source: "x" } } };
    const r = costBasisSchema.safeParse(bad);
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path.join(".")).toBe("vessels.PFR.n");
  });
});

describe("the demo data", () => {
  it("holds a valid cost basis and valid vessels", () => {
    expect(costBasisSchema.safeParse(DEMO_COST_BASIS).success).toBe(true);
    for (const v of DEMO_INVENTORY) expect(inventoryVesselSchema.safeParse(v).success, v.tag).toBe(true);
  });
});

describe("installed cost", () => {
  it("is purchase × installation factor", () => {
    expect(installedCost(250000, 4)).toBe(1000000);
  });

  it("is written on feasible candidates of a costed sweep, and null otherwise", () => {
    const rows = [
      { rank: 1, feasible: true, totalCost: 100000, stages: [] },
      { rank: 2, feasible: false, totalCost: null, stages: [] },
    ];
    const costed = withCosting(rows, { baseSpec: { costing: { installationFactor: 3.5 } }, inventory: null });
    expect(costed.map((r) => r.installedCost)).toEqual([350000, null]);
    expect(withCosting(rows, { baseSpec: {}, inventory: null }).map((r) => r.installedCost)).toEqual([null, null]);
  });
});

describe("rank with reuse of idle vessels", () => {
  const stage = (type: "CSTR" | "PFR", volume: number, cost: number) => ({ type, volume, vessels: { count: 1, sizeEach: volume }, cost });
  it("follows the installed cost with reuse, not the all-new cost, and keeps the row order", () => {
    // Worked example of our own: factor 1; rank 1 and 2 buy new (1,000 and 1,200); rank 3 would cost
    // 3,000 new but an idle 2 m3 CSTR serves it for 500, so with reuse it costs the least.
    const rows = [
      { rank: 1, feasible: true, totalCost: 1000, stages: [stage("PFR", 1, 1000)] },
      { rank: 2, feasible: true, totalCost: 1200, stages: [stage("PFR", 1.2, 1200)] },
      { rank: 3, feasible: true, totalCost: 3000, stages: [stage("CSTR", 2, 3000)] },
      { rank: 4, feasible: false, totalCost: null, stages: [] },
    ];
    const inventory = [{ id: "v1", tag: "R-1", type: "CSTR", volume: 2, available: true, reuseCost: 500 }];
    const costed = withCosting(rows, { baseSpec: { costing: { installationFactor: 1, reuseInventory: true } }, inventory });
    expect(costed.map((r) => r.installedCost)).toEqual([1000, 1200, 500, null]);
    expect(costed.map((r) => r.rank)).toEqual([2, 3, 1, 4]);
    expect(costed.map((r) => (r.inventoryPlan as { allNewCost: number } | null)?.allNewCost ?? null)).toEqual([1000, 1200, 3000, null]);
  });
});
