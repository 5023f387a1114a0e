import { describe, expect, it } from "vitest";
import { formatNumber, RECORD_NUMBERS, TABLE_NUMBERS } from "@/lib/format/numbers";

// Rounding to significant figures is arithmetic (common practice): 0.0383764 to 4 figures is
// 0.03838, 1151.29 is 1151, 123456.7 to 3 figures is 123000.
describe("one number formatter", () => {
  it("rounds to the significant figures asked for, plainly between 0.001 and a million", () => {
    expect(formatNumber(0.0383764)).toBe("0.03838");
    expect(formatNumber(0.0383764, 2)).toBe("0.038");
    expect(formatNumber(1151.29)).toBe("1151");
    expect(formatNumber(123456.7, 3)).toBe("123000");
    expect(formatNumber(-2.71828, 3)).toBe("-2.72");
    expect(formatNumber(0.001)).toBe("0.001");
  });

  it("writes very small and very large magnitudes with an exponent, trimmed on screens", () => {
    expect(formatNumber(2.5e-5)).toBe("2.5e-5");
    expect(formatNumber(1e-4)).toBe("1e-4");
    expect(formatNumber(0.00099996)).toBe("1e-3");
    expect(formatNumber(1e6)).toBe("1e+6");
    expect(formatNumber(2.345e7, 3)).toBe("2.35e+7");
  });

  it("keeps every figure in the report's style and groups thousands in the tables' style", () => {
    expect(formatNumber(1e-4, 4, RECORD_NUMBERS)).toBe("1.000e-4");
    expect(formatNumber(1151.29, 4, RECORD_NUMBERS)).toBe("1151");
    expect(formatNumber(1151.29, 4, TABLE_NUMBERS)).toBe("1,151");
    expect(formatNumber(125000, 3, TABLE_NUMBERS)).toBe("125,000");
    expect(formatNumber(2.5e-5, 3, TABLE_NUMBERS)).toBe("2.50e-5");
  });

  it("never shows a missing value as a number", () => {
    for (const v of [null, undefined, Number.NaN, Number.POSITIVE_INFINITY, "12"]) expect(formatNumber(v)).toBe("—");
    expect(formatNumber(0)).toBe("0");
  });
});
