import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cheapestByBruteForce, inventoryVesselArb } from "../helpers/cheapest-by-brute-force";
import { fits, planFromInventory, type InventoryVessel, type StageNeed } from "@/lib/costs/inventory";

/** Exhaustive enumeration: every stage either bought or given a distinct fitting vessel. */
const bruteForce = (stages: StageNeed[], inventory: InventoryVessel[]) => cheapestByBruteForce(stages, inventory, (s) => s.purchaseCost, fits);

const stageArb = fc.record({
  type: fc.constantFrom<"CSTR" | "PFR">("CSTR", "PFR"),
  volume: fc.double({ min: 0.5, max: 20, noNaN: true }),
  purchaseCost: fc.double({ min: 1e4, max: 5e5, noNaN: true }),
});

describe("equipping a train from inventory", () => {
  it("finds the least cost that exhaustive enumeration finds, on small inventories", () => {
    fc.assert(
      fc.property(fc.array(stageArb, { minLength: 1, maxLength: 4 }), fc.array(inventoryVesselArb, { minLength: 0, maxLength: 6 }), (stages, inventory) => {
        const plan = planFromInventory(stages, inventory);
        const exact = bruteForce(stages, inventory);
        expect(plan.totalCost).toBeCloseTo(exact, 4);
        // The plan itself is valid: distinct vessels, each fitting its stage.
        const usedIds = plan.assignments.filter((a) => a.vesselId).map((a) => a.vesselId);
        expect(new Set(usedIds).size).toBe(usedIds.length);
        for (const a of plan.assignments) {
          if (a.vesselId) expect(fits(stages[a.stage], inventory.find((v) => v.id === a.vesselId)!)).toBe(true);
        }
      }),
      { numRuns: 150, seed: 20261202 },
    );
  });

  it("never uses an unavailable, too small or wrong-type vessel", () => {
    const plan = planFromInventory(
      [{ type: "CSTR", volume: 5, purchaseCost: 1e5 }],
      [
        { id: "small", type: "CSTR", volume: 4, available: true },
        { id: "busy", type: "CSTR", volume: 8, available: false },
        { id: "tube", type: "PFR", volume: 9, available: true },
      ],
    );
    expect(plan.assignments).toEqual([{ stage: 0, vesselId: null, cost: 1e5 }]);
    expect(plan.totalCost).toBe(plan.allNewCost);
  });
});
