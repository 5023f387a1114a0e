import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { designTrains, type DesignSpec } from "@/lib/engine";
import { conversionTemperatureSeries, conversionTemperatureSummary, temperatureAxisRange } from "@/lib/charts/conversion-temperature";

// The fixture's reversible exothermic reaction, adiabatic stages with the stream cooled back to 330 K
// before each later stage (invented numbers).
const SPEC = JSON.parse(readFileSync("tests/fixtures/specs/adiabatic-reversible-cooling.json", "utf8")) as DesignSpec;
const RISE = 100;

describe("conversion–temperature chart", () => {
  const result = designTrains(SPEC);
  const train = result.candidates.find((c) => c.feasible && c.stages.length === 3)!;

  it("draws each adiabatic stage on its energy balance line, T_out - T_in = ΔT_ad (X_out - X_in) (common practice)", () => {
    const series = conversionTemperatureSeries({ stages: train.stages });
    const stages = series.filter((s) => typeof s.tone === "object");
    expect(stages).toHaveLength(3);
    for (const s of stages) {
      const [a, b] = s.points;
      expect(b!.y - a!.y).toBeCloseTo(RISE * (b!.x - a!.x), 9);
    }
  });

  it("draws each cooling between stages at constant conversion, from one stage's outlet to the next one's inlet", () => {
    const series = conversionTemperatureSeries({ stages: train.stages });
    const steps = series.find((s) => s.id === "between-stages")!;
    const pairs = steps.points.filter((p) => Number.isFinite(p.x));
    // Two later stages, each fed at the interstage temperature after cooling: two steps, split by a break.
    expect(pairs).toHaveLength(4);
    expect(steps.points.filter((p) => Number.isNaN(p.x))).toHaveLength(1);
    for (let k = 0; k < 2; k++) {
      const [from, to] = [pairs[2 * k]!, pairs[2 * k + 1]!];
      expect(to.x).toBe(from.x);
      expect(from.y).toBe(train.stages[k]!.temperatureOut);
      expect(to.y).toBe(330);
    }
  });

  it("adds the equilibrium line only where there is an equilibrium temperature, the path and the limit, in the reader's unit", () => {
    const toCelsius = (k: number) => k - 273.15;
    const series = conversionTemperatureSeries(
      {
        stages: train.stages,
        bestPath: { points: [{ conversion: 0, temperature: 420 }, { conversion: 0.5, temperature: 400, equilibriumTemperature: 600 }, { conversion: 0.9, temperature: 350, equilibriumTemperature: 370 }] },
        maxTemperature: 420,
      },
      toCelsius,
    );
    expect(series.find((s) => s.id === "equilibrium")!.points).toEqual([{ x: 0.5, y: 600 - 273.15 }, { x: 0.9, y: 370 - 273.15 }]);
    expect(series.find((s) => s.id === "best-path")!.points.map((p) => p.y)).toEqual([420, 400, 350].map(toCelsius));
    const limit = series.find((s) => s.id === "max-temperature")!;
    expect(limit.points.map((p) => p.y)).toEqual([420 - 273.15, 420 - 273.15]);
    expect(limit.points[0]!.x).toBe(0);
    const [lo, hi] = temperatureAxisRange(series);
    expect(lo).toBeLessThan(330 - 273.15);
    // The equilibrium line (up to 600 K here) does not widen the axis; the limit and the stages do.
    expect(hi).toBeGreaterThan(420 - 273.15);
    expect(hi).toBeLessThan(450 - 273.15);
    expect(lo).toBeGreaterThan(0);
  });

  it("leaves out steps where a stage starts where the last one ended, and says what it shows in words", () => {
    const stages = [
      { type: "PFR", conversionIn: 0, conversionOut: 0.4, temperatureIn: 350, temperatureOut: 390 },
      { type: "CSTR", conversionIn: 0.4, conversionOut: 0.6, temperatureIn: 390, temperatureOut: 410 },
    ];
    expect(conversionTemperatureSeries({ stages }).some((s) => s.id === "between-stages")).toBe(false);
    expect(conversionTemperatureSummary({ stages }, (k) => `${k} K`)).toBe(
      "Conversion against temperature: stage 1 from 350 K at conversion 0.000 to 390 K at 0.400; stage 2 from 390 K at conversion 0.400 to 410 K at 0.600.",
    );
  });
});
