"use client";

import { useWidth } from "./use-width";
import { axisTicks } from "./axis-ticks";
import { stageStyle } from "@/lib/charts/stage-styles";

/**
 * A chart of lines in x-y: the concentration paths, the selectivity curve and the concentration
 * profiles of a train of several reactions. Each series is drawn in its own colour and dash so that
 * lines stay apart in grey print; a series may mark its points (a stirred tank's outlet is a point,
 * not a path). Hand-drawn SVG, like the Levenspiel chart, so both read alike on screen and in print.
 */
export interface LineSeries {
  id: string;
  /** What the legend and the reader say, e.g. "Single tube", "Stage 2 CSTR", "B". */
  label: string;
  points: { x: number; y: number }[];
  /**
   * Colour and dash: a stage's own style (0-based index), a neutral reference line, a limit (the highest
   * temperature allowed) or the equilibrium line. A point that is not a number breaks the line there.
   */
  tone: { stage: number } | "reference" | "muted" | "limit" | "equilibrium";
  /** Draw each point as a dot as well (or only, with `line: false`). */
  markers?: boolean;
  line?: boolean;
}

export interface LineChartProps {
  series: LineSeries[];
  xLabel: string;
  yLabel: string;
  /** Read by assistive technology in place of the picture; the numbers themselves are in a table beside it. */
  summary: string;
  height?: number;
  testId?: string;
  /** Axis ranges; taken from the data when left out. */
  xRange?: [number, number];
  yRange?: [number, number];
  /** Spans of x shaded in turn and labelled at the top, e.g. the stages of a train along its residence time. */
  bands?: { from: number; to: number; label: string }[];
}

const MARGIN = { top: 14, right: 16, bottom: 44, left: 68 };
const DASHES = ["", "6 3", "2 3", "8 3 2 3", "1 2"];

function colourOf(tone: LineSeries["tone"]): { stroke: string; dash: string; width: number } {
  if (tone === "reference") return { stroke: "#1c2430", dash: "4 3", width: 1.5 };
  if (tone === "muted") return { stroke: "#8a94a3", dash: "2 3", width: 1.25 };
  if (tone === "limit") return { stroke: "#991b1b", dash: "3 3", width: 1.25 };
  if (tone === "equilibrium") return { stroke: "#b45309", dash: "", width: 1.5 };
  return { stroke: stageStyle(tone.stage).stroke, dash: DASHES[tone.stage % DASHES.length]!, width: 2 };
}

function rangeOf(values: number[], given?: [number, number]): [number, number] {
  if (given) return given;
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [0, 1];
  const lo = Math.min(0, ...finite);
  let hi = Math.max(...finite);
  if (!(hi > lo)) hi = lo + (Math.abs(lo) || 1);
  return [lo, hi * 1.04 - lo * 0.04];
}

export function LineChart({ series, xLabel, yLabel, summary, height = 300, testId, xRange, yRange, bands = [] }: LineChartProps) {
  const [wrapRef, width] = useWidth(560);
  const xs = rangeOf(series.flatMap((s) => s.points.map((p) => p.x)), xRange);
  const ys = rangeOf(series.flatMap((s) => s.points.map((p) => p.y)), yRange);
  const innerW = Math.max(10, width - MARGIN.left - MARGIN.right);
  const innerH = Math.max(10, height - MARGIN.top - MARGIN.bottom);
  const sx = (x: number) => MARGIN.left + ((x - xs[0]) / (xs[1] - xs[0])) * innerW;
  const sy = (y: number) => MARGIN.top + innerH - ((y - ys[0]) / (ys[1] - ys[0])) * innerH;
  const xTicks = axisTicks(xs[0], xs[1]);
  const yTicks = axisTicks(ys[0], ys[1], 4);
  const inside = (p: { x: number; y: number }) => Number.isFinite(p.x) && Number.isFinite(p.y);
  const pathOf = (pts: { x: number; y: number }[]) => {
    let d = "";
    let pen = false;
    for (const p of pts) {
      if (!inside(p)) {
        pen = false;
        continue;
      }
      d += `${pen ? "L" : "M"}${sx(p.x).toFixed(2)},${sy(p.y).toFixed(2)}`;
      pen = true;
    }
    return d;
  };

  return (
    <figure className="m-0" data-testid={testId}>
      <div ref={wrapRef} className="w-full" style={{ height }}>
        <svg width={width} height={height} role="img" aria-label={summary} className="block">
          <defs>
            <clipPath id={`${testId ?? "line"}-clip`}>
              <rect x={MARGIN.left} y={MARGIN.top - 2} width={innerW + 2} height={innerH + 4} />
            </clipPath>
          </defs>
          {bands.map((b, i) => (
            <g key={`band${i}`} data-band={b.label}>
              <rect x={sx(b.from)} y={MARGIN.top} width={Math.max(0, sx(b.to) - sx(b.from))} height={innerH} fill={i % 2 ? "#ffffff" : "#f4f6f8"} />
              <line x1={sx(b.to)} x2={sx(b.to)} y1={MARGIN.top} y2={MARGIN.top + innerH} stroke="#c9cfd8" strokeDasharray="3 3" />
              <text x={(sx(b.from) + sx(b.to)) / 2} y={MARGIN.top + 10} textAnchor="middle" fontSize={10} fill="#4a5565">
                {b.label}
              </text>
            </g>
          ))}
          {yTicks.tickValues.map((t) => (
            <g key={`y${t}`}>
              <line x1={MARGIN.left} x2={MARGIN.left + innerW} y1={sy(t)} y2={sy(t)} stroke="#eef0f3" />
              <text x={MARGIN.left - 6} y={sy(t)} dy="0.32em" textAnchor="end" fontSize={11} fill="#4a5565" className="num">
                {yTicks.format(t)}
              </text>
            </g>
          ))}
          {xTicks.tickValues.map((t) => (
            <g key={`x${t}`}>
              <line x1={sx(t)} x2={sx(t)} y1={MARGIN.top + innerH} y2={MARGIN.top + innerH + 4} stroke="#8a94a3" />
              <text x={sx(t)} y={MARGIN.top + innerH + 16} textAnchor="middle" fontSize={11} fill="#4a5565" className="num">
                {xTicks.format(t)}
              </text>
            </g>
          ))}
          <line x1={MARGIN.left} x2={MARGIN.left + innerW} y1={MARGIN.top + innerH} y2={MARGIN.top + innerH} stroke="#8a94a3" />
          <line x1={MARGIN.left} x2={MARGIN.left} y1={MARGIN.top} y2={MARGIN.top + innerH} stroke="#8a94a3" />
          <text x={MARGIN.left + innerW / 2} y={height - 6} textAnchor="middle" fontSize={12} fill="#1c2430">
            {xLabel}
          </text>
          <text transform={`translate(14 ${MARGIN.top + innerH / 2}) rotate(-90)`} textAnchor="middle" fontSize={12} fill="#1c2430">
            {yLabel}
          </text>
          <g clipPath={`url(#${testId ?? "line"}-clip)`}>
            {series.map((s) => {
              const c = colourOf(s.tone);
              return (
                <g key={s.id} data-series={s.label}>
                  {s.line !== false && s.points.length > 1 ? <path d={pathOf(s.points)} fill="none" stroke={c.stroke} strokeWidth={c.width} strokeDasharray={c.dash || undefined} /> : null}
                  {s.markers || s.line === false || s.points.length === 1
                    ? s.points.filter(inside).map((p, i) => <circle key={i} cx={sx(p.x)} cy={sy(p.y)} r={3} fill="#fff" stroke={c.stroke} strokeWidth={1.5} />)
                    : null}
                </g>
              );
            })}
          </g>
        </svg>
      </div>
      <figcaption className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
        {series.map((s) => {
          const c = colourOf(s.tone);
          return (
            <span key={s.id} className="inline-flex items-center gap-1.5">
              <svg width={22} height={8} aria-hidden="true">
                <line x1={1} x2={21} y1={4} y2={4} stroke={c.stroke} strokeWidth={c.width} strokeDasharray={c.dash || undefined} />
              </svg>
              {s.label}
            </span>
          );
        })}
      </figcaption>
    </figure>
  );
}
