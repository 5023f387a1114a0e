import { describe, expect, it } from "vitest";
import { axisTicks } from "@/components/charts/axis-ticks";

// Expected ticks follow from the rule stated in axis-ticks.ts and tick-format.ts (ours), checked by hand.
describe("axisTicks: round values and one notation per axis", () => {
  it("a range that crosses 100,000 reads in one power of ten, never mixed", () => {
    const { tickValues, format } = axisTicks(0, 1_600_000, 4);
    expect(tickValues).toEqual([0, 500_000, 1_000_000, 1_500_000]);
    expect(tickValues.map(format)).toEqual(["0", "0.5e6", "1e6", "1.5e6"]);
  });
  it("temperatures between bounds start at the first round value inside them", () => {
    const { tickValues, format } = axisTicks(331, 349, 4);
    expect(tickValues).toEqual([335, 340, 345]);
    expect(tickValues.map(format)).toEqual(["335", "340", "345"]);
  });
  it("a residual axis symmetric about zero keeps zero and one exponent", () => {
    const { tickValues, format } = axisTicks(-0.0033, 0.0033, 4);
    expect(tickValues).toEqual([-0.002, 0, 0.002]);
    expect(tickValues.map(format)).toEqual(["-2e-3", "0", "2e-3"]);
  });
  it("decimals the step needs and no floating-point noise", () => {
    const { tickValues, format } = axisTicks(0, 1, 5);
    expect(tickValues).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(tickValues.map(format)).toEqual(["0.0", "0.2", "0.4", "0.6", "0.8", "1.0"]);
  });
  it("an empty range gives its one value rather than nothing", () => {
    expect(axisTicks(0.5, 0.5).tickValues).toEqual([0.5]);
  });
});
