import { describe, expect, it } from "vitest";
import type { DesignResult } from "@/lib/engine";
import { bestObjectiveOf } from "@/lib/sweeps/candidate-rows";

// A worked example of our own: three trains costed all new at 1,000 / 1,200 / 3,000, where reusing an
// idle vessel brings the third to 500. The heat map's best cost must be what rank 1 will cost.
const result = {
  objective: "cost",
  candidates: [
    { feasible: true, totalCost: 1000, totalVolume: 1 },
    { feasible: true, totalCost: 1200, totalVolume: 2 },
    { feasible: true, totalCost: 3000, totalVolume: 3 },
  ],
} as unknown as DesignResult;

describe("a scenario's best objective, as ranked", () => {
  it("with reuse of idle vessels, is the least installed cost with reuse", () => {
    const rows = [
      { feasible: true, installedCost: 1000, inventoryPlan: { assignments: [] } },
      { feasible: true, installedCost: 1200, inventoryPlan: { assignments: [] } },
      { feasible: true, installedCost: 500, inventoryPlan: { assignments: [{ vesselId: "v" }] } },
    ];
    expect(bestObjectiveOf(result, rows)).toBe(500);
  });

  it("without reuse, is the engine's best (its first feasible train)", () => {
    const rows = result.candidates.map(() => ({ feasible: true, installedCost: null, inventoryPlan: null }));
    expect(bestObjectiveOf(result, rows)).toBe(1000);
  });
});
