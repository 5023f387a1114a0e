"use client";

import { ResponsiveScatterPlot, type ScatterPlotLayerProps } from "@nivo/scatterplot";
import { useId } from "react";
import { FIT_LAW_INFO, type LawFitOut } from "@/lib/schemas/fits";
import { axisTicks } from "@/components/charts/axis-ticks";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";

type Ok = Extract<LawFitOut, { ok: true }>;
type P = { x: number; y: number };

const RATE = "mol/(m³·s)";
const THEME = { text: { fontSize: 11, fill: "#1c2430" }, axis: { legend: { text: { fontSize: 12, fill: "#1c2430" } } } };

/** The y = x line of a parity plot, over the shared range of both axes. */
function diagonal(lo: number, hi: number) {
  return function Diagonal({ xScale, yScale }: ScatterPlotLayerProps<P>) {
    const sx = xScale as unknown as (v: number) => number;
    const sy = yScale as unknown as (v: number) => number;
    return <line x1={sx(lo)} y1={sy(lo)} x2={sx(hi)} y2={sy(hi)} stroke="#1c2430" strokeDasharray="6 4" strokeWidth={1.25} />;
  };
}

function Figure({ title, summary, testId, children }: { title: string; summary: string; testId: string; children: (labelledBy: string, describedBy: string) => React.ReactNode }) {
  const id = useId().replace(/:/g, "");
  return (
    <figure className="card m-0 p-3" data-testid={testId}>
      <figcaption id={`${id}-t`} className="font-semibold">
        {title}
      </figcaption>
      <div className="h-[300px]">{children(`${id}-t`, `${id}-d`)}</div>
      <p id={`${id}-d`} className="mt-1 text-xs text-ink-soft">
        {summary}
      </p>
    </figure>
  );
}

/** Parity (fitted against measured, with y = x) and residuals against measured rate, for one fit. */
export function FitPlots({ fit }: { fit: Ok }) {
  const parity: P[] = fit.parity.map(([m, f]) => ({ x: m, y: f }));
  const residuals: P[] = fit.parity.map(([m], i) => ({ x: m, y: fit.residuals[i] }));
  const all = fit.parity.flat();
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  const pad = (hi - lo) * 0.05 || Math.abs(hi) * 0.05 || 1;
  const maxRes = Math.max(...fit.residuals.map(Math.abs));
  const worst = fit.residuals.reduce((w, r, i) => (Math.abs(r) > Math.abs(fit.residuals[w]) ? i : w), 0);
  const positive = fit.residuals.filter((r) => r > 0).length;
  const label = FIT_LAW_INFO[fit.law].label;
  // Ticks fixed per axis so each shares one notation (components/charts/axis-ticks.ts); the left
  // title sits clear of the widest tick ("-1.25e-3") in the 80 px margin.
  const rateTicks = axisTicks(lo - pad, hi + pad, 5);
  const residualTicks = axisTicks(-(maxRes * 1.1 || 1), maxRes * 1.1 || 1, 4);
  const axis = (legend: string, ticks = rateTicks) => ({ legend, legendPosition: "middle" as const, legendOffset: 42, ...ticks });
  const axisLeft = (legend: string, ticks = rateTicks) => ({ ...axis(legend, ticks), legendOffset: -70 });
  const common = {
    margin: { top: 12, right: 18, bottom: 52, left: 80 },
    animate: false,
    nodeSize: 7,
    colors: ["#1d5fa8"],
    theme: THEME,
    useMesh: true,
    role: "img",
  };

  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <Figure
        testId="parity-plot"
        title={`Parity plot: ${label}`}
        summary={`${fit.points} points; fitted against measured rate, both in ${RATE}, from ${formatNumber(lo, 4, RECORD_NUMBERS)} to ${formatNumber(hi, 4, RECORD_NUMBERS)}. The dashed line is y = x, where a perfect fit lies. R² = ${fit.rSquared.toFixed(5)}.`}
      >
        {(labelledBy, describedBy) => (
          <ResponsiveScatterPlot<P>
            {...common}
            data={[{ id: "points", data: parity }]}
            xScale={{ type: "linear", min: lo - pad, max: hi + pad }}
            yScale={{ type: "linear", min: lo - pad, max: hi + pad }}
            axisBottom={axis(`Measured −rA, ${RATE}`)}
            axisLeft={axisLeft(`Fitted −rA, ${RATE}`)}
            layers={["grid", "axes", diagonal(lo - pad, hi + pad), "nodes", "mesh"]}
            ariaLabelledBy={labelledBy}
            ariaDescribedBy={describedBy}
          />
        )}
      </Figure>
      <Figure
        testId="residual-plot"
        title={`Residuals: ${label}`}
        summary={`Residual (measured − fitted) against measured rate, ${RATE}. Largest |residual| ${formatNumber(maxRes, 3, RECORD_NUMBERS)} at measured ${formatNumber(fit.parity[worst][0], 4, RECORD_NUMBERS)}; ${positive} of ${fit.points} residuals are positive. A pattern rather than scatter about zero suggests the law misses something.`}
      >
        {(labelledBy, describedBy) => (
          <ResponsiveScatterPlot<P>
            {...common}
            data={[{ id: "residuals", data: residuals }]}
            xScale={{ type: "linear", min: lo - pad, max: hi + pad }}
            yScale={{ type: "linear", min: -(maxRes * 1.1 || 1), max: maxRes * 1.1 || 1 }}
            axisBottom={axis(`Measured −rA, ${RATE}`)}
            axisLeft={axisLeft(`Residual, ${RATE}`, residualTicks)}
            markers={[{ axis: "y", value: 0, lineStyle: { stroke: "#1c2430", strokeDasharray: "6 4", strokeWidth: 1.25 } }]}
            ariaLabelledBy={labelledBy}
            ariaDescribedBy={describedBy}
          />
        )}
      </Figure>
    </div>
  );
}
