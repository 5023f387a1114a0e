"use client";

import type { StoredStage } from "@/lib/sweeps/stored-json";
import { LineChart } from "@/components/charts/line-chart";
import { useDisplayUnits } from "@/components/layout/display-units-context";
import { fromSI, unitLabel } from "@/lib/units/display";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { stageTypeName } from "@/lib/stage-types";
import { conversionTemperatureSeries, conversionTemperatureSummary, temperatureAxisRange, type TemperatureChartInput } from "@/lib/charts/conversion-temperature";

/**
 * Temperature against conversion through the train: each stage's own path (adiabatic stages are
 * straight lines, a stage held at one temperature a level line), the cooling or heating between
 * stages, and, for a reversible exothermic reaction, the equilibrium line and the best temperature
 * path the train is measured against, with the highest temperature allowed.
 */
export function TemperatureProfile({ stages, bestPath, maxTemperature }: { stages: StoredStage[]; bestPath?: TemperatureChartInput["bestPath"]; maxTemperature?: number | null }) {
  // Plotted in the user's temperature unit; the stored values are kelvin.
  const tUnit = useDisplayUnits().temperature;
  const t = (k: number) => fromSI("temperature", k, tUnit);
  const tLabel = unitLabel("temperature", tUnit);
  const input: TemperatureChartInput = { stages, bestPath, maxTemperature, typeLabel: stageTypeName };
  const series = conversionTemperatureSeries(input, t);
  const xMax = Math.max(...series.flatMap((s) => s.points.map((p) => p.x)).filter(Number.isFinite), 0) || 1;
  return (
    <LineChart
      series={series}
      xLabel="Conversion X"
      yLabel={`Temperature, ${tLabel}`}
      summary={conversionTemperatureSummary(input, (k) => `${formatNumber(t(k), 5, TABLE_NUMBERS)} ${tLabel}`)}
      height={bestPath ? 300 : 220}
      testId="temperature-profile"
      xRange={[0, Math.min(1, xMax * 1.04)]}
      yRange={temperatureAxisRange(series)}
    />
  );
}
