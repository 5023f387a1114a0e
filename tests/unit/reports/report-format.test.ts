import { describe, expect, it } from "vitest";
import { describeFeed, describeRate, rateConstantUnit } from "@/lib/reports/kinetics-words";
import { fmtResidence, reportFileName } from "@/lib/reports/report-format";

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
