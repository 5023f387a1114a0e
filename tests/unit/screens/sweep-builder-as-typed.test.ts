import { describe, expect, it } from "vitest";
import { builderToRequest, defaultBuilderValues, implied, newAxis } from "@/components/sweep-builder/builder-form-state";

const VERSION = "3f1c2a44-9b7e-4d1a-8c55-0a1b2c3d4e5f";

function issuesOf(patch: (v: ReturnType<typeof defaultBuilderValues>) => void) {
  const v = defaultBuilderValues(VERSION);
  patch(v);
  return { ...builderToRequest(v), count: implied(v) };
}

describe("sweep builder refuses as typed what the server would refuse", () => {
  for (const t of ["1.5", "0", "-0.2"]) {
    it(`target ${t} is refused at the field`, () => {
      const r = issuesOf((v) => (v.target = t));
      expect(r.body).toBeNull();
      expect(r.issues).toContainEqual({ path: "target", message: "The target conversion is a number between 0 and 1, e.g. 0.9" });
    });
  }

  for (const n of ["9", "0", "2.5"]) {
    it(`a stage count of ${n} is refused and no sequences are counted`, () => {
      const r = issuesOf((v) => (v.maxStages = n));
      expect(r.issues.map((i) => i.path)).toContain("maxStages");
      expect(r.count.sequences).toBeNull();
    });
  }

  it("8 stages of two types count 2 + 4 + ... + 256 = 510 sequences (geometric sum, common practice)", () => {
    expect(issuesOf((v) => (v.maxStages = "8")).count.sequences).toBe(510);
  });

  it("grid values with a negative, or a value missing between commas, are refused", () => {
    expect(issuesOf((v) => (v.grid = [{ ...newAxis("feed.flowA"), values: "-1, 2" }])).issues.map((i) => i.path)).toContain("grid.0.values");
    const gap = issuesOf((v) => (v.grid = [{ ...newAxis("feed.flowA"), values: "1,,2" }]));
    expect(gap.issues).toContainEqual({ path: "grid.0.values", message: "A value is missing between two commas" });
  });

  it("a range from -1 is refused; a temperature range from -10 degC is kept (263.15 K)", () => {
    const neg = issuesOf((v) => (v.grid = [{ ...newAxis("feed.flowA"), kind: "range", from: "-1", to: "2", steps: "3", scale: "linear" }]));
    expect(neg.issues.map((i) => i.path)).toContain("grid.0.from");
    const cold = issuesOf((v) => (v.grid = [{ ...newAxis("feed.temperature"), unit: "degC", kind: "range", from: "-10", to: "20", steps: "3", scale: "linear" }]));
    expect(cold.issues).toEqual([]);
    // 0 degC = 273.15 K (common practice)
    expect((cold.body!.grid[0] as { from: number }).from).toBeCloseTo(263.15, 9);
  });
});
