import { describe, expect, it } from "vitest";
import { defaultNetworkValues, networkBuilderToRequest, networkImplied, newNetworkAxis, type NetworkVersionInfo } from "@/components/sweep-builder/network-builder-form-state";
import { mapNetworkServerFields, networkBuilderPathOf } from "@/components/sweep-builder/network-field-paths";
import { networkFieldKind, networkGridFields } from "@/components/sweep-builder/network-grid-fields";

const VERSION: NetworkVersionInfo = {
  id: "3f1c2a44-9b7e-4d1a-8c55-0a1b2c3d4e5f",
  label: "Side reactions · v1",
  kind: "network",
  species: ["A", "B", "C", "D"],
  keyReactant: "A",
  product: "B",
  reactions: [
    { power: true, reverse: false, arrhenius: true },
    { power: true, reverse: true, arrhenius: false },
    { power: false, reverse: false, arrhenius: false },
  ],
  units: { concentration: "mol/L", temperature: "degC", volume: "L" },
};

const field = (path: string) => networkGridFields(VERSION).find((f) => f.field === path)!;

describe("network sweep builder → request", () => {
  it("starts from the model's wanted product, isothermal, up to three stages of both types", () => {
    const v = defaultNetworkValues(VERSION);
    expect(v.product).toBe("B");
    const { body, issues } = networkBuilderToRequest(v, VERSION);
    expect(issues).toEqual([]);
    expect(body).toEqual({
      kineticsVersionId: VERSION.id,
      thermal: { mode: "isothermal" },
      train: { maxStages: 3, types: ["CSTR", "PFR"] },
      objective: { maximise: "yield", product: "B" },
      grid: [],
    });
    // 2 + 4 + 8 sequences of up to three stages of two types (common practice: sum of 2^n).
    expect(networkImplied(v, VERSION)).toEqual({ scenarios: 1, sequences: 14, optimisations: 14 });
  });

  it("takes limits as percentages and volumes in the chosen unit, and stage temperatures in °C, as SI", () => {
    const v = { ...defaultNetworkValues(VERSION), objective: "selectivity" as const, minConversion: "50", minYield: "20", maxTotalVolume: "2000", maxStageVolume: "500", volumeUnit: "L", heat: "stageTemperature" as const, tMin: "27", tMax: "177", tUnit: "degC" };
    const { body } = networkBuilderToRequest(v, VERSION);
    expect(body!.objective).toEqual({ maximise: "selectivity", product: "B" });
    // 1 L = 1e-3 m3; 0 °C = 273.15 K (common practice).
    expect(body!.constraints!.minConversion).toBeCloseTo(0.5, 12);
    expect(body!.constraints!.minYield).toBeCloseTo(0.2, 12);
    expect(body!.constraints!.maxTotalVolume as number).toBeCloseTo(2, 12);
    expect(body!.constraints!.maxStageVolume as number).toBeCloseTo(0.5, 12);
    expect(body!.thermal).toEqual({ mode: "stageTemperature", min: expect.closeTo(300.15, 10), max: expect.closeTo(450.15, 10) });
  });

  it("lists each reaction's rate constants, the feed and the limits to vary, with the field labels", () => {
    const fields = networkGridFields(VERSION);
    expect(fields.map((f) => f.field)).toEqual([
      "reactions.0.rate.k",
      "reactions.0.rate.activationEnergy",
      "reactions.1.rate.k",
      "reactions.1.rate.reverse.k",
      "reactions.1.rate.activationEnergy",
      "feed.volumetricFlow",
      "feed.concentrations.A",
      "feed.concentrations.B",
      "feed.concentrations.C",
      "feed.concentrations.D",
      "feed.temperature",
      "constraints.maxTotalVolume",
      "constraints.minConversion",
      "constraints.minYield",
    ]);
    expect(field("reactions.1.rate.reverse.k").label).toBe("Reaction 2, reverse rate constant (m³, mol, s basis)");
    expect(field("feed.concentrations.C").label).toBe("Feed concentration of C");
    expect(field("constraints.maxTotalVolume").label).toBe("Largest total volume");
    // Units start in the ones the model was typed in.
    expect(field("feed.concentrations.A").defaultUnit).toBe("mol/L");
    expect(field("feed.temperature").defaultUnit).toBe("degC");
    expect(networkFieldKind("feed.concentrations.D")).toBe("concentration");
    expect(networkFieldKind("reactions.3.rate.k")).toBeNull();
  });

  it("converts grid values to SI and counts scenarios", () => {
    const v = defaultNetworkValues(VERSION);
    v.grid = [
      { ...newNetworkAxis(field("feed.concentrations.A")), values: "0.5, 0.58" },
      { ...newNetworkAxis(field("reactions.0.rate.k")), kind: "range", from: "5", to: "20", steps: "3", scale: "log" },
    ];
    const { body } = networkBuilderToRequest(v, VERSION);
    // 1 mol/L = 1000 mol/m3 (common practice).
    expect(body!.grid[0]).toEqual({ field: "feed.concentrations.A", values: [expect.closeTo(500, 9), expect.closeTo(580, 9)] });
    expect(body!.grid[1]).toEqual({ field: "reactions.0.rate.k", from: 5, to: 20, steps: 3, scale: "log" });
    expect(networkImplied(v, VERSION)).toEqual({ scenarios: 6, sequences: 14, optimisations: 84 });
  });

  it("puts each problem at the field a person corrects", () => {
    const base = defaultNetworkValues(VERSION);
    const issues = (patch: Partial<typeof base>) => networkBuilderToRequest({ ...base, ...patch }, VERSION).issues;
    expect(issues({ objective: "volume", product: "" })).toEqual([{ path: "minConversion", message: "The least total volume needs a minimum conversion to reach" }]);
    expect(issues({ product: "A" })).toEqual([{ path: "product", message: "The wanted product cannot be the key reactant" }]);
    expect(issues({ maxStages: "6" })[0]!.path).toBe("maxStages");
    expect(issues({ useCSTR: false, usePFR: false })[0]!.path).toBe("useCSTR");
    expect(issues({ minConversion: "120" })[0]).toEqual({ path: "minConversion", message: "Minimum conversion is a percentage from 0 to 100" });
    expect(issues({ maxTotalVolume: "-1" })[0]!.path).toBe("maxTotalVolume");
    expect(issues({ heat: "stageTemperature", tMin: "200", tMax: "100", tUnit: "K" })).toEqual([{ path: "tMax", message: "The highest stage temperature must be above the lowest" }]);
    expect(issues({ trainMode: "candidates", candidates: [{ seq: "CSTR-PFR" }, { seq: "CSTR-PFR" }, { seq: "" }] }).map((i) => i.path)).toEqual(["candidates.1.seq", "candidates.2.seq"]);
    expect(issues({ grid: [{ ...newNetworkAxis(field("feed.temperature")), values: "300, x" }] })[0]!.path).toBe("grid.0.values");
    expect(networkBuilderToRequest(base, undefined).issues[0]!.path).toBe("kineticsVersionId");
  });

  it("shows the server's field errors at the form's fields", () => {
    expect(networkBuilderPathOf("thermal.min")).toBe("tMin");
    expect(networkBuilderPathOf("train.candidates.2")).toBe("candidates.2.seq");
    expect(networkBuilderPathOf("objective.product")).toBe("product");
    expect(networkBuilderPathOf("constraints.maxTotalVolume")).toBe("maxTotalVolume");
    expect(networkBuilderPathOf("grid.1.from")).toBe("grid.1.from");
    expect(networkBuilderPathOf("grid.0.values.2")).toBe("grid.0.values");
    expect(mapNetworkServerFields({ kineticsVersionId: ["This model has one reaction"], "spec.reactions.0.rate.k": ["too large"] })).toEqual({
      byField: { kineticsVersionId: "This model has one reaction" },
      rest: ["too large"],
    });
  });
});
