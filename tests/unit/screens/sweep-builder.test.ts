import { describe, expect, it } from "vitest";
import { builderPathOf, builderToRequest, defaultBuilderValues, implied, newAxis, sequenceCount } from "@/components/sweep-builder/builder-form-state";

const VERSION = "3f1c2a44-9b7e-4d1a-8c55-0a1b2c3d4e5f";

describe("sweep builder → request", () => {
  it("counts sequences of each train form", () => {
    expect(sequenceCount({ maxStages: 3, types: ["CSTR", "PFR"] })).toBe(14);
    expect(sequenceCount({ maxStages: 4, types: ["CSTR"] })).toBe(4);
    expect(sequenceCount({ candidates: [["CSTR", "PFR"], ["PFR"], ["CSTR", "PFR"]] })).toBe(2);
    expect(sequenceCount({ multiset: { CSTR: 2, PFR: 1 } })).toBe(3);
    expect(sequenceCount({ multiset: { CSTR: 2, PFR: 2 } })).toBe(6);
  });

  it("a grid with values and a log range gives scenarios × sequences optimisations", () => {
    const v = defaultBuilderValues(VERSION);
    v.grid = [
      { ...newAxis("feed.flowA"), values: "0.02, 0.05, 0.1" },
      { ...newAxis("target.conversion"), kind: "range", from: "0.8", to: "0.95", steps: "4", scale: "linear" },
    ];
    expect(implied(v)).toEqual({ scenarios: 12, sequences: 14, optimisations: 168 });
    const { body } = builderToRequest(v);
    expect(body!.grid[0]).toEqual({ field: "feed.flowA", values: [0.02, 0.05, 0.1] });
    expect(body!.train).toEqual({ maxStages: 3, types: ["CSTR", "PFR"] });
  });

  it("converts grid values and vessel sizes to SI", () => {
    const v = defaultBuilderValues(VERSION);
    v.grid = [{ ...newAxis("feed.temperature"), unit: "degC", values: "50, 70" }];
    v.objective = "cost";
    v.standardSizes = "500, 1000";
    v.sizeUnit = "L";
    v.maxVessel = "10";
    v.sizeUnit = "gal";
    const { body } = builderToRequest(v);
    const g = body!.grid[0] as { values: number[] };
    expect(g.values[0]).toBeCloseTo(323.15, 10);
    const o = body!.objective as { standardSizes: number[]; maxVesselVolume: number; vessels: unknown };
    expect(o.standardSizes[0]).toBeCloseTo(500 * 3.785411784e-3, 12);
    expect(o.maxVesselVolume).toBeCloseTo(10 * 3.785411784e-3, 12);
    expect(o.vessels).toEqual({ CSTR: { a: 20000, b: 45000, n: 0.6 }, PFR: { a: 15000, b: 38000, n: 0.6 } });
  });

  it("listed sequences and multisets", () => {
    const v = defaultBuilderValues(VERSION);
    v.trainMode = "candidates";
    expect(builderToRequest(v).body!.train).toEqual({ candidates: [["CSTR", "PFR"], ["PFR"]] });
    v.candidates.push({ seq: "" });
    expect(builderToRequest(v).issues).toContainEqual({ path: "candidates.2.seq", message: "Add at least one stage" });
    v.trainMode = "multiset";
    v.equalVolume = true;
    expect(builderToRequest(v).body!.train).toEqual({ multiset: { CSTR: 2, PFR: 1 }, equalVolume: true });
  });

  it("the request schema's own checks come back at form fields", () => {
    const v = defaultBuilderValues(VERSION);
    v.grid = [{ ...newAxis("feed.flowA"), kind: "range", from: "0", to: "1", steps: "3", scale: "log" }];
    expect(builderToRequest(v).issues).toContainEqual({ path: "grid.0.from", message: "A log range needs positive ends" });
    expect(builderToRequest({ ...v, kineticsVersionId: "" }).issues[0].path).toBe("kineticsVersionId");
    expect(builderPathOf("grid.1.field")).toBe("grid.1.customField");
    expect(builderPathOf("objective.vessels.PFR.n")).toBe("vesselPFR.n");
    expect(builderPathOf("kineticsVersionId (feed.flowA)")).toBe("kineticsVersionId");
  });
});
