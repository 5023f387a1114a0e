import { describe, expect, it } from "vitest";
import { parseRateCsv, UPLOAD_LIMITS } from "@/lib/datasets/rate-table";

const mapping = { columns: { X: "conversion", "rate (mol/L/min)": "rate", "T (degC)": "temperature" } } as const;

describe("rate-table uploads", () => {
  it("converts each column to SI with the chosen units", () => {
    const t = parseRateCsv("X,rate (mol/L/min),T (degC)\n0.1,0.6,60\n0.2,0.48,60\n", {
      ...mapping,
      toSI: { rate: { factor: 1000 / 60 }, temperature: { offset: 273.15 } },
    });
    expect(t.problems).toEqual([]);
    expect(t.rows).toEqual([
      { line: 2, conversion: 0.1, rate: 10, temperature: 333.15 },
      { line: 3, conversion: 0.2, rate: 8, temperature: 333.15 },
    ]);
  });

  it("marks every kind of bad row with its line and column, and keeps the good ones", () => {
    const csv = [
      "X,rate (mol/L/min),T (degC)",
      "0.1,0.6,60", // good
      ",0.5,60", // missing conversion
      "0.3,fast,60", // not a number
      "0.4,-0.2,60", // negative rate
      "1.2,0.1,60", // conversion out of range
      "0.1,0.59,60", // duplicate conversion at this temperature
      "0.1,0.9,80", // same conversion, other temperature: fine
    ].join("\n");
    const t = parseRateCsv(csv, mapping);
    expect(t.rows.map((r) => r.line)).toEqual([2, 8]);
    expect(t.problems).toEqual([
      { line: 3, column: "X", message: "missing" },
      { line: 4, column: "rate (mol/L/min)", message: '"fast" is not a number' },
      { line: 5, column: "rate (mol/L/min)", message: "the rate must be positive" },
      { line: 6, column: "X", message: "conversion must be in [0, 1)" },
      { line: 7, column: null, message: "duplicate conversion 0.1 at one temperature (first on line 2)" },
    ]);
  });

  it("refuses a mapping that names missing columns or lacks the rate", () => {
    expect(parseRateCsv("a,b\n1,2\n", { columns: { X: "conversion", r: "rate" } }).problems.map((p) => p.message)).toEqual(['No column "X" in the file', 'No column "r" in the file']);
    expect(parseRateCsv("X\n0.1\n", { columns: { X: "conversion" } }).problems[0].message).toMatch(/measured rate/);
  });

  it("refuses files over the size and row limits with a clear message", () => {
    expect(parseRateCsv("x".repeat(UPLOAD_LIMITS.bytes + 1), mapping).problems[0].message).toMatch(/larger than 2 MB/);
    const many = ["X,rate (mol/L/min),T (degC)", ...Array.from({ length: UPLOAD_LIMITS.rows + 1 }, (_, i) => `${(i / 1e6).toFixed(7)},1,60`)].join("\n");
    expect(parseRateCsv(many, mapping).problems[0].message).toBe("The file has 20,001 rows; at most 20,000 are accepted");
  });

  it("ignores a byte-order mark and blank lines", () => {
    const t = parseRateCsv("\uFEFFX,rate (mol/L/min),T (degC)\n\n0.1,1,50\n\n", mapping);
    expect(t.rows).toEqual([{ line: 3, conversion: 0.1, rate: 1, temperature: 50 }]); // line 3 as an editor numbers it (blank line 2 counted)
    expect(t.problems).toEqual([]);
  });
});
