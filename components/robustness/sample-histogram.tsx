"use client";

import { axisTicks } from "@/components/charts/axis-ticks";
import type { SampledDistribution } from "@/lib/schemas/robustness";

const W = 520;
const H = 220;
const M = { top: 14, right: 14, bottom: 42, left: 52 };

/**
 * A histogram of sampled values (as fractions, shown in percent) with one limit marked as a dashed
 * line: bars left of it are the samples that miss. Hand-drawn SVG, scaled to its box.
 */
export function SampleHistogram({ bins, limit, limitLabel, xLabel, summary, testId }: { bins: SampledDistribution["histogram"]; limit: number | null; limitLabel: string; xLabel: string; summary: string; testId?: string }) {
  const lo = Math.min(bins[0]?.from ?? 0, limit ?? Infinity);
  const hi = Math.max(bins[bins.length - 1]?.to ?? 1, limit ?? -Infinity);
  const pad = Math.max(1e-4, (hi - lo) * 0.04);
  const [x0, x1] = [lo - pad, hi + pad];
  const top = Math.max(1, ...bins.map((b) => b.count));
  const innerW = W - M.left - M.right;
  const innerH = H - M.top - M.bottom;
  const sx = (x: number) => M.left + ((x - x0) / (x1 - x0)) * innerW;
  const sy = (n: number) => M.top + innerH - (n / top) * innerH;
  const xt = axisTicks(x0 * 100, x1 * 100, 5);
  const yt = axisTicks(0, top, 4);
  return (
    <figure className="m-0" data-testid={testId}>
      <svg viewBox={`0 0 ${W} ${H}`} className="block h-auto w-full" role="img" aria-label={summary}>
        {yt.tickValues.map((t) => (
          <g key={`y${t}`}>
            <line x1={M.left} x2={M.left + innerW} y1={sy(t)} y2={sy(t)} stroke="#eef0f3" />
            <text x={M.left - 6} y={sy(t)} dy="0.32em" textAnchor="end" fontSize={11} fill="#4a5565">
              {yt.format(t)}
            </text>
          </g>
        ))}
        {bins.map((b, i) => (
          <rect key={i} x={sx(b.from) + 0.5} y={sy(b.count)} width={Math.max(1, sx(b.to) - sx(b.from) - 1)} height={M.top + innerH - sy(b.count)} fill={limit !== null && b.to <= limit ? "#f2c9a0" : "#9fd3cc"} stroke="#136f67" strokeWidth={0.6} />
        ))}
        {xt.tickValues.map((t) => (
          <g key={`x${t}`}>
            <line x1={sx(t / 100)} x2={sx(t / 100)} y1={M.top + innerH} y2={M.top + innerH + 4} stroke="#8a94a3" />
            <text x={sx(t / 100)} y={M.top + innerH + 16} textAnchor="middle" fontSize={11} fill="#4a5565">
              {xt.format(t)}
            </text>
          </g>
        ))}
        <line x1={M.left} x2={M.left + innerW} y1={M.top + innerH} y2={M.top + innerH} stroke="#8a94a3" />
        <text x={M.left + innerW / 2} y={H - 6} textAnchor="middle" fontSize={12} fill="#1c2430">
          {xLabel}
        </text>
        <text transform={`translate(14 ${M.top + innerH / 2}) rotate(-90)`} textAnchor="middle" fontSize={12} fill="#1c2430">
          Samples
        </text>
        {limit !== null ? (
          <g data-testid={testId ? `${testId}-limit` : undefined}>
            <line x1={sx(limit)} x2={sx(limit)} y1={M.top} y2={M.top + innerH} stroke="#b45309" strokeWidth={2} strokeDasharray="6 4" />
            <text x={sx(limit) + 4} y={M.top + 10} fontSize={11} fill="#92400e">
              {limitLabel}
            </text>
          </g>
        ) : null}
      </svg>
    </figure>
  );
}
