import { describe, expect, it } from "vitest";
import { formatNumber } from "@/lib/format/numbers";
import {
  convert,
  formatQuantity,
  fromSI,
  rateConstantFromSI,
  rateConstantLabel,
  rateConstantToSI,
  toSI,
  UNITS,
  unitOptions,
  type UnitKind,
} from "@/lib/units/display";

// Every expected value below follows from a definition that is exact by definition:
// 1 ft = 0.3048 m, 1 US gal = 231 in3 (1 in = 0.0254 m), 1 lb = 0.45359237 kg,
// 1 min = 60 s, 1 h = 3600 s, T[K] = T[degC] + 273.15, T[degF] = T[degC] × 9/5 + 32,
// 1 thermochemical cal = 4.184 J, 1 IT Btu = 1055.05585262 J.

describe("volume (exact by definition)", () => {
  it("1 US gal = 231 in3 = 3.785411784 L", () => {
    expect(toSI("volume", 1, "gal")).toBeCloseTo(231 * 0.0254 ** 3, 15);
    expect(convert("volume", 1, "gal", "L")).toBeCloseTo(3.785411784, 12);
  });
  it("1 ft3 = 0.3048^3 m3 = 28.316846592 L", () => {
    expect(toSI("volume", 1, "ft3")).toBe(0.028316846592);
    expect(toSI("volume", 1, "ft3")).toBeCloseTo(0.3048 ** 3, 15);
    expect(convert("volume", 1, "ft3", "L")).toBeCloseTo(28.316846592, 11);
  });
  it("1 L = 1e-3 m3; round trips", () => {
    expect(toSI("volume", 250, "L")).toBeCloseTo(0.25, 15);
    for (const u of ["m3", "L", "gal", "ft3"]) expect(fromSI("volume", toSI("volume", 7.25, u), u)).toBeCloseTo(7.25, 12);
  });
});

describe("time, amount, molar flow, concentration (exact by definition)", () => {
  it("minutes and hours", () => {
    expect(toSI("time", 1, "min")).toBe(60);
    expect(toSI("time", 1.5, "h")).toBe(5400);
  });
  it("1 lbmol = 453.59237 mol, 1 kmol = 1000 mol", () => {
    expect(toSI("amount", 1, "lbmol")).toBe(453.59237);
    expect(toSI("amount", 2, "kmol")).toBe(2000);
  });
  it("molar flow: 3.6 kmol/h = 1 mol/s; 1 lbmol/h = 453.59237/3600 mol/s", () => {
    expect(toSI("molarFlow", 3.6, "kmol/h")).toBeCloseTo(1, 14);
    expect(toSI("molarFlow", 1, "lbmol/h")).toBeCloseTo(453.59237 / 3600, 14);
    expect(toSI("molarFlow", 60, "mol/min")).toBeCloseTo(1, 14);
  });
  it("concentration: 1 mol/L = 1000 mol/m3; 1 lbmol/ft3 = 453.59237/0.028316846592 mol/m3", () => {
    expect(toSI("concentration", 1.5, "mol/L")).toBeCloseTo(1500, 10);
    expect(toSI("concentration", 1, "lbmol/ft3")).toBeCloseTo(453.59237 / 0.028316846592, 9);
    expect(toSI("concentration", 1, "lbmol/ft3")).toBeCloseTo(16018.463373960138, 8);
  });
  it("rate: 1 mol/(L min) = 1000/60 mol/(m3 s)", () => {
    expect(toSI("rate", 1, "mol/(L min)")).toBeCloseTo(1000 / 60, 12);
    expect(toSI("rate", 1, "lbmol/(ft3 h)")).toBeCloseTo(453.59237 / 0.028316846592 / 3600, 10);
  });
  it("energy: 1 kcal/mol = 4184 J/mol; 1 Btu/lbmol = 1055.05585262/453.59237 J/mol", () => {
    expect(toSI("energyPerMol", 1, "kcal/mol")).toBe(4184);
    expect(toSI("energyPerMol", 1, "Btu/lbmol")).toBeCloseTo(2.326, 12); // 1 Btu/lb = 2326 J/kg exactly
  });
});

describe("temperature (exact by definition)", () => {
  it("degC and degF are affine", () => {
    expect(toSI("temperature", 0, "degC")).toBeCloseTo(273.15, 12);
    expect(toSI("temperature", 66.85, "degC")).toBeCloseTo(340, 12);
    expect(toSI("temperature", 32, "degF")).toBeCloseTo(273.15, 12);
    expect(toSI("temperature", 212, "degF")).toBeCloseTo(373.15, 12);
    expect(fromSI("temperature", 373.15, "degF")).toBeCloseTo(212, 11);
    expect(convert("temperature", -40, "degC", "degF")).toBeCloseTo(-40, 11);
  });
  it("a temperature difference has no offset: 9 degF = 5 K", () => {
    expect(toSI("temperatureDifference", 9, "degF")).toBeCloseTo(5, 14);
    expect(toSI("temperatureDifference", 120, "degC")).toBe(120);
  });
});

describe("power-law rate constants", () => {
  it("first order: only the time unit matters", () => {
    expect(rateConstantToSI(0.12, 1, "mol/L", "min")).toBeCloseTo(0.002, 15);
    expect(rateConstantLabel(1, "mol/L", "min")).toBe("1/min");
  });
  it("second order: L/(mol min) → m3/(mol s) is 1e-3/60", () => {
    expect(rateConstantToSI(6, 2, "mol/L", "min")).toBeCloseTo(6e-3 / 60, 15);
    expect(rateConstantFromSI(1e-4, 2, "mol/L", "min")).toBeCloseTo(6, 12);
    expect(rateConstantLabel(2, "mol/L", "h")).toBe("(L/mol)/h");
    expect(rateConstantLabel(2.5, "lbmol/ft3", "s")).toBe("(ft³/lbmol)^1.5/s");
  });
  it("zero order: k is a rate", () => {
    expect(rateConstantToSI(1, 0, "mol/L", "s")).toBeCloseTo(1000, 10);
  });
});

describe("pickers and formatting", () => {
  it("every kind offers its SI unit with factor 1", () => {
    for (const kind of Object.keys(UNITS) as UnitKind[]) {
      expect(unitOptions(kind).length).toBeGreaterThan(1);
      expect(Object.values(UNITS[kind]).some((d) => d.factor === 1)).toBe(true);
    }
  });
  it("formats significant digits", () => {
    expect(formatNumber(0.0383764)).toBe("0.03838");
    expect(formatNumber(1151.29)).toBe("1151");
    expect(formatNumber(2.5e-5)).toBe("2.5e-5");
    expect(formatNumber(null)).toBe("—");
    expect(formatQuantity("volume", 0.0383764, "L")).toBe("38.38 L");
  });
  it("rejects unknown units", () => {
    expect(() => toSI("volume", 1, "bbl")).toThrow(/unknown volume unit/);
  });
});
