import { describe, expect, it } from "vitest";
import { R10, r10Sizes } from "@/lib/costs/preferred-sizes";

describe("ISO 3 R10 preferred sizes", () => {
  it("are 10^(i/10) rounded as ISO 3 rounds them (from memory: 3.15 and 6.30 are the standard's roundings)", () => {
    R10.forEach((m, i) => expect(Math.abs(m / 10 ** (i / 10) - 1)).toBeLessThan(0.013));
    expect([...R10]).toEqual([1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8]);
  });

  it("repeat in every decade between the bounds", () => {
    expect(r10Sizes(0.5, 5)).toEqual([0.5, 0.63, 0.8, 1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5]);
    expect(r10Sizes(10, 12.5)).toEqual([10, 12.5]);
  });
});
