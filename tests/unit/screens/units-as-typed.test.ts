import { describe, expect, it } from "vitest";
import { defaultKineticsValues, formToSpec, specToForm } from "@/components/kinetics/kinetics-form-state";
import { kineticsSpecSchema, type KineticsSpec } from "@/lib/schemas/sweeps";
import { echoInEngineUnits, readTyped, typedText } from "@/lib/units/display";
import { typedUnits } from "@/lib/units/typed-units";

// Conversion factors are the exact definitions listed in lib/units/display.ts:
// T[K] = T[degC] + 273.15; 1 kmol/h = 1000 mol / 3600 s; 1 lbmol = 453.59237 mol (international pound).

describe("the quantity input keeps the number and the unit as typed", () => {
  it("60 with °C picked after typing is saved as 333.15 K and reopens as 60 °C", () => {
    const v = defaultKineticsValues();
    v.feed.temperature = { value: "60", unit: "degC" };
    const { spec } = formToSpec(v);
    expect(spec!.feed.temperature).toBeCloseTo(333.15, 12);
    expect(spec!.shownUnits!["feed.temperature"]).toBe("degC");
    expect(specToForm(spec!).feed.temperature).toEqual({ value: "60", unit: "degC" });
  });

  it("5 kmol/h is saved as 1.38889 mol/s and reopens as 5 kmol/h, not 4.99999 or 1.38889", () => {
    const v = defaultKineticsValues();
    v.feed.flowA = { value: "5", unit: "kmol/h" };
    const { spec } = formToSpec(v);
    expect(spec!.feed.flowA).toBeCloseTo(5000 / 3600, 12);
    expect(specToForm(spec!).feed.flowA).toEqual({ value: "5", unit: "kmol/h" });
  });

  it("a rate constant reopens in its concentration and time basis with the number typed", () => {
    const v = defaultKineticsValues();
    v.reaction.rate.orders = [{ name: "A", value: "2" }];
    v.reaction.rate.k = { value: "0.03", conc: "mol/L", time: "h" };
    const { spec } = formToSpec(v);
    // (L/mol)/h → (m3/mol)/s: × 1e-3 / 3600
    expect((spec!.reaction.rate as { k: number }).k).toBeCloseTo((0.03 * 1e-3) / 3600, 18);
    expect(specToForm(spec!).reaction.rate.k).toEqual({ value: "0.03", conc: "mol/L", time: "h" });
  });

  it("a rate table reopens in the rate unit it was typed in", () => {
    const v = defaultKineticsValues();
    v.reaction.rate.law = "table";
    v.reaction.rate.table = { rateUnit: "mol/(L h)", rows: [{ conversion: "0", rate: "7.2" }, { conversion: "0.95", rate: "0.36" }] };
    const { spec } = formToSpec(v);
    expect((spec!.reaction.rate as { rate: number[] }).rate[0]).toBeCloseTo(7.2 / 1e-3 / 3600, 12);
    expect(specToForm(spec!).reaction.rate.table).toEqual(v.reaction.rate.table);
  });

  it("a model stored before units were kept still reads and opens in the default units", () => {
    const old: KineticsSpec = { feed: { flowA: 0.05, concA: 1500 }, reaction: { rate: { law: "power", k: 0.002, orders: { A: 1 } } } };
    expect(kineticsSpecSchema.safeParse(old).success).toBe(true);
    expect(specToForm(old).feed.flowA).toEqual({ value: "0.05", unit: "mol/s" });
  });

  it("the echo reads in real units, never 'SI'", () => {
    expect(echoInEngineUnits("temperature", "60", "degC")).toBe("= 333.15 K");
    expect(echoInEngineUnits("molarFlow", "5", "kmol/h")).toBe("= 1.38889 mol/s");
    expect(echoInEngineUnits("molarFlow", "5", "mol/s")).toBe("");
    expect(echoInEngineUnits("molarFlow", "abc", "kmol/h")).toBe("");
    expect(readTyped(" 2.5 ")).toBe(2.5);
    expect(readTyped("")).toBeNull();
    // 1 lbmol/h = 453.59237 / 3600 mol/s: 10 lbmol/h back from SI reads 10
    expect(typedText("molarFlow", (10 * 453.59237) / 3600, "lbmol/h")).toBe("10");
  });
});

describe("typedUnits: the engineer's units by kind", () => {
  it("reads flow, concentration, temperature, time and energy, and litres from a per-litre concentration", () => {
    const v = defaultKineticsValues();
    v.feed.flowA = { value: "5", unit: "kmol/h" };
    v.feed.temperature = { value: "60", unit: "degC" };
    v.reaction.rate.k = { value: "0.5", conc: "mol/L", time: "min" };
    v.reaction.rate.arrheniusOn = true;
    v.reaction.rate.activationEnergy = { value: "50", unit: "kJ/mol" };
    const { spec } = formToSpec(v);
    expect(typedUnits(spec)).toEqual({ molarFlow: "kmol/h", concentration: "mol/L", temperature: "degC", time: "min", energyPerMol: "kJ/mol", volume: "L" });
  });

  it("gives cubic metres for a per-cubic-metre concentration and nothing for an old model", () => {
    expect(typedUnits({ shownUnits: { "feed.concA": "kmol/m3" } })).toEqual({ concentration: "kmol/m3", volume: "m3" });
    expect(typedUnits({})).toEqual({});
    expect(typedUnits({ shownUnits: { "feed.flowA": "furlongs" } })).toEqual({});
  });
});
