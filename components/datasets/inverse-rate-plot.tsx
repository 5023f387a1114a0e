"use client";

import { ResponsiveScatterPlot } from "@nivo/scatterplot";
import { axisTicks } from "@/components/charts/axis-ticks";
import { formatNumber } from "@/lib/format/numbers";

export interface RatePoint {
  conversion: number;
  rate: number;
  temperature?: number;
}

/**
 * The model-free view of measured data: 1/(−rA) against conversion, one series per
 * temperature (m³·s/mol). Its area times F_A0 is a PFR volume, a rectangle a CSTR's.
 */
export function InverseRatePlot({ points }: { points: RatePoint[] }) {
  const groups = new Map<string, { x: number; y: number }[]>();
  for (const p of points) {
    const key = p.temperature === undefined ? "measured" : `${formatNumber(p.temperature - 273.15, 4)} °C`;
    const list = groups.get(key) ?? [];
    list.push({ x: p.conversion, y: 1 / p.rate });
    groups.set(key, list);
  }
  const data = [...groups].map(([id, d]) => ({ id, data: d.sort((a, b) => a.x - b.x) }));
  const ys = points.map((p) => 1 / p.rate);
  const xMax = Math.max(...points.map((p) => p.conversion), 0) || 1;
  const yMax = Math.max(...ys, 0) || 1;
  // Ticks fixed here so each axis shares one notation (components/charts/axis-ticks.ts).
  const xAxis = axisTicks(0, xMax, 5);
  const yAxis = axisTicks(0, yMax, 5);
  const summary = `Scatter plot of 1/(−rA) against conversion: ${points.length} points${groups.size > 1 ? ` at ${groups.size} temperatures` : ""}, 1/(−rA) from ${formatNumber(Math.min(...ys))} to ${formatNumber(Math.max(...ys))} m³·s/mol.`;
  return (
    <figure className="space-y-1">
      <div className="h-80" data-testid="inverse-rate-plot">
        <ResponsiveScatterPlot
          data={data}
          role="img"
          ariaLabel={summary}
          margin={{ top: 16, right: 120, bottom: 48, left: 72 }}
          xScale={{ type: "linear", min: 0, max: xMax }}
          yScale={{ type: "linear", min: 0, max: yMax }}
          axisBottom={{ legend: "Conversion X", legendPosition: "middle", legendOffset: 38, ...xAxis }}
          axisLeft={{ legend: "1/(−rA), m³·s/mol", legendPosition: "middle", legendOffset: -60, ...yAxis }}
          nodeSize={9}
          colors={{ scheme: "category10" }}
          useMesh
          tooltip={({ node }) => (
            <div className="rounded border border-line bg-white px-2 py-1 text-xs shadow">
              {String(node.serieId)}: X = {formatNumber(Number(node.data.x))}, 1/(−rA) = {formatNumber(Number(node.data.y))} m³·s/mol
            </div>
          )}
          legends={groups.size > 1 ? [{ anchor: "right", direction: "column", translateX: 110, itemWidth: 100, itemHeight: 18, symbolSize: 10, symbolShape: "circle" }] : []}
        />
      </div>
      <figcaption className="text-xs text-ink-soft">{summary}</figcaption>
    </figure>
  );
}
