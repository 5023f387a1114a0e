import { describe, expect, it } from "vitest";
import { tickFormatter } from "@/components/charts/tick-format";

// Expected strings follow from the rule stated in tick-format.ts (ours), checked by hand.
describe("tickFormatter: one notation per axis", () => {
  it("never mixes exponent and plain numbers on large ticks", () => {
    const ticks = [0, 500_000, 1_000_000, 1_500_000];
    const f = tickFormatter(ticks);
    expect(ticks.map(f)).toEqual(["0", "0.5e6", "1e6", "1.5e6"]);
  });
  it("plain numbers with the decimals the step needs", () => {
    const ticks = [0, 0.2, 0.4, 0.6];
    expect(ticks.map(tickFormatter(ticks))).toEqual(["0.0", "0.2", "0.4", "0.6"]);
    const big = [0, 2500, 5000];
    expect(big.map(tickFormatter(big))).toEqual(["0", "2,500", "5,000"]);
  });
  it("small ticks share one power of ten", () => {
    const ticks = [0, 0.001, 0.002];
    expect(ticks.map(tickFormatter(ticks))).toEqual(["0", "1e-3", "2e-3"]);
  });
});
