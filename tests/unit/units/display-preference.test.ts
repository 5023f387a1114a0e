import { describe, expect, it } from "vitest";
import { formatQuantity, fromSI } from "@/lib/units/display";
import { DISPLAY_PREFERENCES, isDisplayPreference, resolveDisplayUnits, SMALL_VOLUME_LIMIT_M3 } from "@/lib/units/display-preference";

// Conversion factors are exact by definition (as in lib/units/display.ts): 1 L = 1e-3 m3,
// 1 US gal = 231 in3 = 3.785411784 L, 1 ft = 0.3048 m, 1 lb = 0.45359237 kg (1 lbmol = 453.59237 mol),
// 1 h = 3600 s, T[degC] = T[K] - 273.15, T[degF] = T[K] × 9/5 - 459.67.

describe("resolveDisplayUnits: the fixed sets", () => {
  it("SI shows m3 for plant sizes, mol/s and K", () => {
    const u = resolveDisplayUnits("si", undefined, { largestVolume: 12 });
    expect(u).toMatchObject({ volume: "m3", molarFlow: "mol/s", temperature: "K", time: "s", concentration: "mol/m3" });
  });
  it("SI with litres and hours shows L, kmol/h and degC", () => {
    const u = resolveDisplayUnits("si-litres-hours", undefined, { largestVolume: 0.5 });
    expect(u).toMatchObject({ volume: "L", molarFlow: "kmol/h", temperature: "degC", time: "h", concentration: "mol/L", energyPerMol: "kJ/mol" });
  });
  it("US customary shows US gal for small volumes, ft3 for large, lbmol/h and degF", () => {
    expect(resolveDisplayUnits("us-customary", undefined, { largestVolume: 0.2 })).toMatchObject({ volume: "gal", molarFlow: "lbmol/h", temperature: "degF" });
    expect(resolveDisplayUnits("us-customary", undefined, { largestVolume: 30 }).volume).toBe("ft3");
  });
  it("typed units are ignored unless the choice is 'as typed'", () => {
    expect(resolveDisplayUnits("si", { molarFlow: "kmol/h", temperature: "degC" }).molarFlow).toBe("mol/s");
  });
});

describe("resolveDisplayUnits: the volume rule", () => {
  it("a small volume never shows as a fraction of a cubic metre in the metric sets", () => {
    const si = 9.163e-4; // m3, the volume of the report in the issue
    for (const p of ["si", "si-litres-hours", "as-typed"] as const) {
      const u = resolveDisplayUnits(p, undefined, { largestVolume: si });
      expect(u.volume).toBe("L");
      expect(formatQuantity("volume", si, u.volume)).toBe("0.9163 L"); // 1 L = 1e-3 m3, exact
    }
  });
  it("switches at the stated limit: below it litres, at it cubic metres", () => {
    expect(SMALL_VOLUME_LIMIT_M3).toBe(1);
    expect(resolveDisplayUnits("si", undefined, { largestVolume: 0.999 }).volume).toBe("L");
    expect(resolveDisplayUnits("si", undefined, { largestVolume: 1 }).volume).toBe("m3");
    expect(resolveDisplayUnits("si-litres-hours", undefined, { largestVolume: 40 }).volume).toBe("m3");
  });
  it("a typed volume unit stays as typed whatever the size", () => {
    expect(resolveDisplayUnits("as-typed", { volume: "m3" }, { largestVolume: 0.001 }).volume).toBe("m3");
    expect(resolveDisplayUnits("as-typed", { volume: "gal" }, { largestVolume: 50 }).volume).toBe("gal");
  });
});

describe("resolveDisplayUnits: as typed", () => {
  it("takes each typed unit and falls back to SI with litres and hours for the rest", () => {
    const u = resolveDisplayUnits("as-typed", { molarFlow: "lbmol/h", temperature: "degF" }, { largestVolume: 0.1 });
    expect(u).toMatchObject({ molarFlow: "lbmol/h", temperature: "degF", volume: "L", time: "h", concentration: "mol/L" });
  });
  it("without typed units it is SI with litres and hours", () => {
    expect(resolveDisplayUnits("as-typed")).toEqual(resolveDisplayUnits("si-litres-hours"));
  });
  it("ignores a typed unit it does not know, rather than showing a number in no unit", () => {
    expect(resolveDisplayUnits("as-typed", { molarFlow: "furlong/fortnight" }).molarFlow).toBe("kmol/h");
  });
});

describe("the displayed numbers (exact factors)", () => {
  it("1 mol/s = 3.6 kmol/h = 7.93664 lbmol/h", () => {
    expect(fromSI("molarFlow", 1, resolveDisplayUnits("si-litres-hours").molarFlow)).toBeCloseTo(3.6, 12);
    expect(fromSI("molarFlow", 1, resolveDisplayUnits("us-customary").molarFlow)).toBeCloseTo(3600 / 453.59237, 12);
  });
  it("333.15 K = 60 degC = 140 degF", () => {
    expect(fromSI("temperature", 333.15, resolveDisplayUnits("si-litres-hours").temperature)).toBeCloseTo(60, 10);
    expect(fromSI("temperature", 333.15, resolveDisplayUnits("us-customary").temperature)).toBeCloseTo(140, 10);
  });
  it("0.2 m3 = 52.834 US gal (1 US gal = 3.785411784 L)", () => {
    expect(fromSI("volume", 0.2, resolveDisplayUnits("us-customary", undefined, { largestVolume: 0.2 }).volume)).toBeCloseTo(200 / 3.785411784, 10);
  });
});

describe("isDisplayPreference", () => {
  it("accepts the four choices and nothing else", () => {
    for (const p of DISPLAY_PREFERENCES) expect(isDisplayPreference(p)).toBe(true);
    expect(isDisplayPreference("metric")).toBe(false);
    expect(isDisplayPreference(undefined)).toBe(false);
  });
});
