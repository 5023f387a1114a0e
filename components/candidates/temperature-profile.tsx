"use client";

import { ResponsiveLine } from "@nivo/line";
import type { StoredStage } from "@/lib/sweeps/stored-json";
import { axisTicks } from "@/components/charts/axis-ticks";
import { useDisplayUnits } from "@/components/layout/display-units-context";
import { fromSI, unitLabel } from "@/lib/units/display";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { stageTypeName } from "@/lib/stage-types";

/** Temperature against conversion through the train (adiabatic stages are straight lines in X). */
export function TemperatureProfile({ stages }: { stages: StoredStage[] }) {
  // Plotted in the user's temperature unit; the stored values are kelvin.
  const tUnit = useDisplayUnits().temperature;
  const t = (k: number) => fromSI("temperature", k, tUnit);
  const tLabel = unitLabel("temperature", tUnit);
  const data = stages.map((s, i) => ({
    id: `Stage ${i + 1} ${stageTypeName(s.type)}`,
    data: [
      { x: s.conversionIn, y: t(s.temperatureIn) },
      { x: s.conversionOut, y: t(s.temperatureOut) },
    ],
  }));
  const temps = stages.flatMap((s) => [t(s.temperatureIn), t(s.temperatureOut)]);
  const lo = Math.min(...temps);
  const hi = Math.max(...temps);
  const yMin = Math.floor(lo - 2);
  const yMax = Math.ceil(hi + 2);
  const xMax = Math.max(...stages.map((s) => s.conversionOut), 0) || 1;
  // Ticks fixed here so each axis shares one notation (components/charts/axis-ticks.ts).
  const xAxis = axisTicks(0, xMax, 5);
  const yAxis = axisTicks(yMin, yMax, 4);
  const label = `Temperature profile: ${stages.map((s, i) => `stage ${i + 1} ${formatNumber(t(s.temperatureIn), 5, TABLE_NUMBERS)} to ${formatNumber(t(s.temperatureOut), 5, TABLE_NUMBERS)} ${tLabel}`).join("; ")}`;
  return (
    <div role="img" aria-label={label} style={{ height: 200 }} data-testid="temperature-profile">
      <ResponsiveLine
        data={data}
        margin={{ top: 10, right: 16, bottom: 40, left: 56 }}
        xScale={{ type: "linear", min: 0, max: xMax }}
        yScale={{ type: "linear", min: yMin, max: yMax }}
        axisBottom={{ legend: "Conversion X", legendOffset: 32, legendPosition: "middle", ...xAxis }}
        axisLeft={{ legend: `T, ${tLabel}`, legendOffset: -46, legendPosition: "middle", ...yAxis }}
        colors={["#136f67", "#b45309", "#3f51b5", "#a21caf", "#4d7c0f", "#854d0e", "#0369a1", "#6d28d9"]}
        pointSize={6}
        enableGridX={false}
        useMesh
        animate={false}
      />
    </div>
  );
}
