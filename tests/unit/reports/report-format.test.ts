import { describe, expect, it } from "vitest";
import { describeFeed, describeRate, rateConstantUnit } from "@/lib/reports/kinetics-words";
import { fmtKelvin, fmtResidence, fmtVolume, reportFileName, reportUnits, stageColumns } from "@/lib/reports/report-format";

describe("kinetics in words", () => {
  it("gives a power-law rate constant the unit (mol/m3)^(1-n)/s", () => {
    // Common practice: first order 1/s; second order m3/(mol s); zeroth order mol/(m3 s).
    expect(rateConstantUnit(1)).toBe("1/s");
    expect(rateConstantUnit(2)).toBe("(mol/m³)^-1/s");
    expect(rateConstantUnit(0)).toBe("mol/(m³·s)");
    expect(rateConstantUnit(1.5)).toBe("(mol/m³)^-0.5/s");
  });

  it("writes the rate law and each parameter with its unit; quantity strings stay as typed", () => {
    const r = describeRate({ law: "power", k: 1e-4, orders: { A: 1, B: 1 }, activationEnergy: 55000, reverse: { k: 2e-5, orders: { R: 1, S: 1 } } });
    expect(r.law).toBe("power law, reversible");
    expect(r.formula).toBe("−rA = k·C_A·C_B − k_rev·C_R·C_S");
    expect(r.parameters).toContainEqual({ label: "k", value: "1.000e-4 (mol/m³)^-1/s" });
    expect(r.parameters).toContainEqual({ label: "Activation energy", value: "55000 J/mol" });
    expect(describeFeed({ flowA: 0.02, concA: "1 mol/L" })).toEqual([
      { label: "Feed rate of A (FA0)", value: "0.02 mol/s" },
      { label: "Feed concentration of A (CA0)", value: "1 mol/L" },
      { label: "Feed temperature (T0)", value: "298.15 K (default)" },
    ]);
  });

  it("shows long residence times in minutes too, and names files without spaces or punctuation", () => {
    expect(fmtResidence(30)).toBe("30 s");
    expect(fmtResidence(900)).toBe("900 s (15 min)");
    const name = reportFileName({ project: { id: "p", name: "Ester line 3 — revamp (Q2)", description: "" }, train: { sequence: ["CSTR", "PFR"], label: "", totalVolume: 1, totalCost: null, ratioToPfr: null }, pin: { id: "1a2b3c4d-0000" } as never }, "pdf");
    expect(name).toBe("ester-line-3-revamp-q2-cstr-pfr-1a2b3c4d.pdf");
  });
});

describe("report numbers in the reader's units", () => {
  // Exact by definition: 1 L = 1e-3 m3, T[degC] = T[K] - 273.15, 1 US gal = 3.785411784 L.
  const report = { train: { totalVolume: 9.163e-4 }, references: { singleCSTR: 2.4e-3, singlePFR: 8.1e-4 } } as Parameters<typeof reportUnits>[0];
  it("a laboratory-size train reads in litres, never as a fraction of a cubic metre", () => {
    const units = reportUnits(report, "si");
    expect(units.volume).toBe("L");
    expect(fmtVolume(9.163e-4, units)).toBe("0.9163 L");
    expect(fmtVolume(9.163e-4)).toBe("9.163e-4 m³"); // without units: as stored, the reading the issue complained of
  });
  it("temperatures in degC and degF", () => {
    expect(fmtKelvin(353.15, reportUnits(report, "si-litres-hours"))).toBe("80.0 °C");
    expect(fmtKelvin(353.15, reportUnits(report, "us-customary"))).toBe("176.0 °F");
    expect(fmtKelvin(300)).toBe("300.0 K");
  });
  it("the stage table shows the chosen units while the CSV columns stay SI", () => {
    const columns = stageColumns(reportUnits(report, "us-customary"));
    const stage = { volume: 3.785411784e-3, temperatureIn: 300, temperatureOut: 310, vesselCount: 1, vesselSize: 3.785411784e-3 } as Parameters<(typeof columns)[number]["shown"]>[0];
    expect(columns.find((c) => c.heading === "Volume")!.shown(stage)).toBe("1 US gal");
    expect(columns.find((c) => c.heading === "Volume")!.csv).toBe("volume (m3)");
    expect(columns.find((c) => c.heading === "Volume")!.raw(stage)).toBe(3.785411784e-3);
  });
});
