import { describe, expect, it } from "vitest";
import { builderToRequest, defaultBuilderValues, GRID_FIELDS, newAxis } from "@/components/sweep-builder/builder-form-state";
import { fieldName } from "@/components/sweeps/scenario-picker";

const VERSION = "3f1c2a44-9b7e-4d1a-8c55-0a1b2c3d4e5f";

describe("inputs a sweep can vary, picked by name", () => {
  it("varies the activation energy in kJ/mol and sends J/mol (1 kJ = 1000 J, by definition)", () => {
    const v = defaultBuilderValues(VERSION);
    v.grid = [{ ...newAxis("reaction.rate.activationEnergy"), values: "45, 60" }];
    expect(builderToRequest(v).body!.grid[0]).toEqual({ field: "reaction.rate.activationEnergy", values: [45_000, 60_000] });
  });

  it("varies a temperature rise as a difference: 18 °F of rise is 10 K (1 K = 1.8 °F as a difference, common practice)", () => {
    const v = defaultBuilderValues(VERSION);
    v.grid = [{ ...newAxis("reaction.thermal.adiabaticRise"), unit: "degF", values: "18" }];
    const [value] = (builderToRequest(v).body!.grid[0] as { values: number[] }).values;
    expect(value).toBeCloseTo(10, 12);
  });

  it("names every offered input in words on the sweep page, never by its path", () => {
    for (const g of GRID_FIELDS.filter((f) => f.field !== "custom")) expect(fieldName(g.field)).not.toMatch(/\w\.\w/);
    expect(fieldName("feed.ratios.B")).not.toMatch(/\w\.\w/);
  });
});
