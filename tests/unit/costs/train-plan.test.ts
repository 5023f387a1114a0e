import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cheapestByBruteForce, inventoryVesselArb } from "../helpers/cheapest-by-brute-force";
import { planTrain, type DesignedStage, type SnapshotVessel } from "@/lib/costs/train-plan";

/**
 * Brute force over the parallel-vessel stages: every slot (stage share of stage.volume/count) is
 * bought at its share of the installed cost or given a distinct vessel of the stage's type,
 * available and holding at least the share.
 */
function bruteForce(stages: DesignedStage[], inventory: SnapshotVessel[], factor: number): number {
  const slots = stages.flatMap((s) => Array.from({ length: s.vessels.count }, () => ({ type: s.type, need: s.volume / s.vessels.count, buy: ((s.cost ?? 0) / s.vessels.count) * factor })));
  return cheapestByBruteForce(slots, inventory, (slot) => slot.buy, (slot, v) => v.available && v.type === slot.type && v.volume >= slot.need * (1 - 1e-9));
}

const stageArb = fc.record({
  type: fc.constantFrom<"CSTR" | "PFR">("CSTR", "PFR"),
  volume: fc.double({ min: 0.5, max: 40, noNaN: true }),
  vessels: fc.record({ count: fc.integer({ min: 1, max: 3 }), sizeEach: fc.constant(0) }),
  cost: fc.double({ min: 1e4, max: 3e5, noNaN: true }),
});

describe("equipping a designed train with parallel vessels from the inventory", () => {
  it("matches brute-force enumeration over every slot", () => {
    fc.assert(
      fc.property(fc.array(stageArb, { minLength: 1, maxLength: 3 }), fc.uniqueArray(inventoryVesselArb, { minLength: 0, maxLength: 5, selector: (v) => v.id }), fc.double({ min: 1, max: 5, noNaN: true }), (stages, inventory, factor) => {
        const plan = planTrain(stages, inventory, factor);
        expect(plan.totalCost).toBeCloseTo(bruteForce(stages, inventory, factor), 4);
        // All-new is purchase × factor, stage by stage.
        expect(plan.allNewCost).toBeCloseTo(stages.reduce((t, s) => t + s.cost * factor, 0), 4);
        for (const sp of plan.stages) {
          expect(sp.slots).toHaveLength(stages[sp.stage].vessels.count);
          for (const slot of sp.slots) {
            if (!slot.vesselId) continue;
            const v = inventory.find((x) => x.id === slot.vesselId)!;
            expect(v.available && v.type === sp.type && v.volume >= sp.volumeEach * (1 - 1e-9)).toBe(true);
          }
        }
      }),
      { numRuns: 120, seed: 20261202 },
    );
  });

  it("reuses one fitting vessel in a stage of two and buys the other", () => {
    const plan = planTrain(
      [{ type: "CSTR", volume: 12, vessels: { count: 2, sizeEach: 6.3 }, cost: 200000 }],
      [
        { id: "a", tag: "R-101", type: "CSTR", volume: 6.5, available: true, reuseCost: 15000 },
        { id: "b", tag: "R-102", type: "CSTR", volume: 5.9, available: true, reuseCost: 0 }, // too small for 6 m3
        { id: "c", tag: "T-201", type: "PFR", volume: 20, available: true, reuseCost: 0 }, // wrong type
      ],
      4,
    );
    const [stage] = plan.stages;
    expect(stage.reused).toBe(1);
    expect(stage.bought).toBe(1);
    expect(stage.slots.map((s) => s.tag).sort()).toEqual(["R-101", null].sort());
    // One new vessel at half the stage's purchase × 4, plus the reuse cost.
    expect(plan.totalCost).toBeCloseTo(100000 * 4 + 15000, 6);
    expect(plan.saving).toBeCloseTo(800000 - 415000, 6);
  });
});
