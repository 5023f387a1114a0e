"use client";

import { ResponsiveLine } from "@nivo/line";
import { axisTicks } from "@/components/charts/axis-ticks";
import type { RobustnessRunResult } from "@/lib/schemas/robustness";

const pct = (x: number, digits = 1) => `${(100 * x).toFixed(digits)} %`;

/** One sentence a screen reader gets in place of the chart, and everyone gets beside it. */
export function resultSummary(r: RobustnessRunResult): string {
  return (
    `Over ${r.samples.toLocaleString("en")} samples (random seed ${r.seed}) the outlet conversion was ${pct(r.p5)} or more in 95 % of them, ` +
    `${pct(r.p50)} at the median and at most ${pct(r.p95)} in 95 %. The train missed the target of ${pct(r.target)} ` +
    `in ${pct(r.probabilityOfMissingTarget)} of the samples (± ${pct(r.probabilityStandardError, 2)} standard error)` +
    (r.refusedSamples ? `; ${r.refusedSamples} samples could not be rated and count as misses.` : ".")
  );
}

/** P5/P50/P95, the probability of missing the target and the cumulative distribution of the outlet conversion. */
export function RobustnessResult({ result: r }: { result: RobustnessRunResult }) {
  const n = r.distribution.length;
  const points = r.distribution.map((x, i) => ({ x, y: n > 1 ? i / (n - 1) : 1 }));
  const lo = Math.min(r.target, r.distribution[0] ?? r.target);
  const hi = Math.max(r.target, r.distribution[n - 1] ?? r.target);
  const pad = Math.max(1e-4, (hi - lo) * 0.05);
  // Ticks fixed here so each axis shares one notation (components/charts/axis-ticks.ts).
  const xAxis = axisTicks(lo - pad, hi + pad, 5);
  const yAxis = axisTicks(0, 1, 5);
  return (
    <div className="space-y-3" data-testid="robustness-result">
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        {[
          ["P5 conversion", pct(r.p5, 2)],
          ["P50 conversion", pct(r.p50, 2)],
          ["P95 conversion", pct(r.p95, 2)],
          ["P(miss target)", `${pct(r.probabilityOfMissingTarget)} ± ${pct(r.probabilityStandardError, 2)}`],
        ].map(([k, v]) => (
          <div key={k} className="rounded border border-line px-2 py-1">
            <dt className="text-xs uppercase tracking-wide text-ink-soft">{k}</dt>
            <dd className="num text-sm">{v}</dd>
          </div>
        ))}
      </dl>
      <p className="text-xs text-ink-soft">
        Target {pct(r.target)} · nominal outlet {r.nominal === null ? "—" : pct(r.nominal, 2)} · samples that could not be rated {r.refusedSamples}
      </p>
      <div className="grid gap-3 md:grid-cols-[3fr_2fr]">
        <figure className="m-0">
          <div style={{ height: 220 }} data-testid="robustness-chart">
            <ResponsiveLine
              role="img"
              ariaLabel={`Cumulative distribution of the outlet conversion. ${resultSummary(r)}`}
              data={[{ id: "Share of samples at or below", data: points }]}
              margin={{ top: 10, right: 16, bottom: 42, left: 56 }}
              xScale={{ type: "linear", min: lo - pad, max: hi + pad }}
              yScale={{ type: "linear", min: 0, max: 1 }}
              axisBottom={{ legend: "Outlet conversion X", legendOffset: 34, legendPosition: "middle", ...xAxis }}
              axisLeft={{ legend: "Share of samples ≤ X", legendOffset: -46, legendPosition: "middle", ...yAxis }}
              colors={["#136f67"]}
              enablePoints={false}
              lineWidth={2}
              markers={[
                {
                  axis: "x",
                  value: r.target,
                  lineStyle: { stroke: "#b45309", strokeWidth: 2, strokeDasharray: "6 4" },
                  legend: `target ${pct(r.target)}`,
                  legendPosition: "top-left",
                  textStyle: { fill: "#92400e", fontSize: 11 },
                },
              ]}
              enableGridX={false}
              animate={false}
              isInteractive={false}
            />
          </div>
          <figcaption className="text-xs text-ink-soft">Dashed line: the target. The curve&apos;s height at the target is the share of samples that miss it.</figcaption>
        </figure>
        <p className="text-sm" data-testid="robustness-summary">
          {resultSummary(r)}
        </p>
      </div>
    </div>
  );
}
