import { describe, expect, it } from "vitest";
import { builderPathOf, builderToRequest, defaultBuilderValues, implied, parseSequence } from "@/components/sweep-builder/builder-form-state";

const VERSION = "3f1c2a44-9b7e-4d1a-8c55-0a1b2c3d4e5f";

describe("sweep builder: the tube with recycle", () => {
  it("offers it as a stage type; the design chooses the ratio unless one is typed", () => {
    const v = { ...defaultBuilderValues(VERSION), maxStages: "2", usePFRrecycle: true };
    expect(builderToRequest(v).body!.train).toEqual({ maxStages: 2, types: ["CSTR", "PFR", "PFR-recycle"] });
    // 3 + 9 sequences of one and two stages of three types.
    expect(implied(v).sequences).toBe(12);
    const fixed = builderToRequest({ ...v, recycleMode: "fixed", recycleRatio: " 0.43 " });
    expect(fixed.body!.train).toEqual({ maxStages: 2, types: ["CSTR", "PFR", "PFR-recycle"], recycleRatio: 0.43 });
  });

  it("keeps a listed train's tube with recycle as one stage (its key form) and sends the type's own word", () => {
    expect(parseSequence("CSTR-PFRrecycle-PFR")).toEqual(["CSTR", "PFR-recycle", "PFR"]);
    const v = { ...defaultBuilderValues(VERSION), trainMode: "candidates" as const, candidates: [{ seq: "CSTR-PFRrecycle" }, { seq: "PFRrecycle" }] };
    expect(builderToRequest(v).body!.train).toEqual({ candidates: [["CSTR", "PFR-recycle"], ["PFR-recycle"]] });
  });

  it("names the recycle ratio box for a missing, unreadable or negative ratio", () => {
    const v = { ...defaultBuilderValues(VERSION), usePFRrecycle: true, recycleMode: "fixed" as const };
    for (const typed of ["", "lots", "-0.5"]) {
      const { body, issues } = builderToRequest({ ...v, recycleRatio: typed });
      expect(body).toBeNull();
      expect(issues.map((i) => i.path)).toEqual(["recycleRatio"]);
    }
    expect(builderPathOf("train.recycleRatio")).toBe("recycleRatio");
  });

  it("a typed ratio is ignored while no stage is a tube with recycle", () => {
    const v = { ...defaultBuilderValues(VERSION), recycleMode: "fixed" as const, recycleRatio: "-1" };
    expect(builderToRequest(v).body!.train).toEqual({ maxStages: 3, types: ["CSTR", "PFR"] });
  });

  it("refuses same-volume trains and standard sizes with a tube with recycle, at those boxes", () => {
    const v = { ...defaultBuilderValues(VERSION), usePFRrecycle: true, equalVolume: true };
    expect(builderToRequest(v).issues.map((i) => i.path)).toEqual(["equalVolume"]);
    const sizes = { ...defaultBuilderValues(VERSION), usePFRrecycle: true, objective: "cost" as const, standardSizes: "1, 2" };
    expect(builderToRequest(sizes).issues.map((i) => i.path)).toEqual(["standardSizes"]);
  });
});
