"use client";

import { useId, useMemo, useState, type KeyboardEvent, type PointerEvent } from "react";
import { useWidth } from "./use-width";
import { chartGeometry, interpolate, ticks, type ChartStage, type Point } from "@/lib/charts/levenspiel-geometry";
import { tickFormatter } from "./tick-format";
import { fromCubicMetres, VOLUME_LABEL, type VolumeUnit } from "@/lib/charts/volume-units";
import { stageStyle } from "@/lib/charts/stage-styles";
import { StagePattern } from "./stage-patterns";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import { stageTypeName, stageTypeShort } from "@/lib/stage-types";

export interface LevenspielChartProps {
  curve: [number, number][];
  stages: ChartStage[];
  target?: number;
  equilibrium?: number | null;
  height?: number;
  compact?: boolean;
  yMax?: number;
  volumeUnit?: VolumeUnit;
  /** The stages are alternatives drawn over each other (single-vessel references), not one train in series. */
  alternatives?: boolean;
}

const MARGIN = { top: 14, right: 16, bottom: 40, left: 64 };
const COMPACT_MARGIN = { top: 2, right: 2, bottom: 2, left: 2 };

/**
 * Levenspiel area chart: FA0/(-rA) against conversion, each CSTR a filled rectangle, each PFR a
 * filled area under the curve, each tube with recycle its rectangle at the mean height with the area
 * under the curve over its tube (from X_1, ticked on the axis) drawn dashed over it, each stage in its own colour and pattern and labelled with its
 * volume. Inputs in m3; `volumeUnit` is the unit shown. `compact` draws a thumbnail without axes.
 */
export function LevenspielChart({ curve, stages, target, equilibrium, height, compact = false, yMax, volumeUnit = "m3", alternatives = false }: LevenspielChartProps) {
  const uid = useId().replace(/:/g, "");
  const [wrapRef, width] = useWidth(compact ? 120 : 640);
  const [cursor, setCursor] = useState<number | null>(null);
  const h = height ?? (compact ? 48 : 320);
  const m = compact ? COMPACT_MARGIN : MARGIN;
  const geo = useMemo(() => chartGeometry({ curve, stages, target, equilibrium, yMax }), [curve, stages, target, equilibrium, yMax]);
  const unit = VOLUME_LABEL[volumeUnit];
  const innerW = Math.max(10, width - m.left - m.right);
  const innerH = Math.max(10, h - m.top - m.bottom);
  const sx = (x: number) => m.left + (x / geo.xMax) * innerW;
  const sy = (y: number) => m.top + innerH - (Math.min(y, geo.yMax) / geo.yMax) * innerH;
  const path = (pts: Point[]) => pts.map(([x, y], i) => `${i ? "L" : "M"}${sx(x).toFixed(2)},${sy(y).toFixed(2)}`).join("");
  const show = (m3: number) => formatNumber(fromCubicMetres(m3, volumeUnit), 3, TABLE_NUMBERS);

  const summary = stages.length
    ? `Levenspiel chart, ${stages.length} stage${stages.length === 1 ? "" : "s"}: ` +
      geo.stages.map((s) => `${alternatives ? `single ${stageTypeName(s.type)}` : `stage ${s.index + 1} ${stageTypeName(s.type)}`} from X ${formatNumber(s.conversionIn, 3, TABLE_NUMBERS)} to ${formatNumber(s.conversionOut, 3, TABLE_NUMBERS)}, ${show(s.volume)} ${unit}${recycleWords(s.underCurve)}`).join("; ")
    : "Levenspiel curve, no stages";
  // Numbering alternatives "1 CSTR", "2 PFR" would read as a two-stage train.
  const stageName = (s: { index: number; type: string }) => (alternatives ? `Single ${stageTypeShort(s.type)}` : `${s.index + 1} ${stageTypeShort(s.type)}`);

  if (compact) {
    return (
      <div ref={wrapRef} className="w-full" style={{ height: h }}>
        <svg width={width} height={h} role="img" aria-label={summary} className="block">
          <defs>
            {geo.stages.map((s) => (
              <StagePattern key={s.index} id={`${uid}-p${s.index}`} index={s.index} />
            ))}
          </defs>
          <rect x={0} y={0} width={width} height={h} fill="#fff" />
          {geo.stages.map((s) => (
            <path key={s.index} d={path(s.polygon) + "Z"} fill={`url(#${uid}-p${s.index})`} stroke={stageStyle(s.index).stroke} strokeWidth={1} />
          ))}
          {geo.stages.map((s) => (s.underCurve ? <path key={`u${s.index}`} d={path(s.underCurve.polygon) + "Z"} fill={stageStyle(s.index).stroke} fillOpacity={0.2} stroke={stageStyle(s.index).stroke} strokeWidth={1} strokeDasharray="3 2" /> : null))}
          {geo.curve.length > 1 ? <path d={path(geo.curve)} fill="none" stroke="#1c2430" strokeWidth={1} /> : null}
        </svg>
      </div>
    );
  }

  const xTicks = ticks(geo.xMax, 5).filter((t) => t <= geo.xMax);
  const yTicks = ticks(geo.yMax, 4).filter((t) => t <= geo.yMax);
  // One notation per axis (components/charts/tick-format.ts).
  const yTick = tickFormatter(yTicks.map((t) => fromCubicMetres(t, volumeUnit)));
  const xTick = tickFormatter(xTicks);
  const cursorStage = cursor === null ? undefined : geo.stages.find((s) => cursor >= s.conversionIn && cursor <= s.conversionOut);
  const cursorY = cursor === null ? null : interpolate(geo.curve, cursor);

  const onMove = (e: PointerEvent<SVGRectElement>) => {
    const box = e.currentTarget.getBoundingClientRect();
    const x = ((e.clientX - box.left) / box.width) * geo.xMax;
    setCursor(Math.min(geo.xMax, Math.max(0, x)));
  };
  const onKey = (e: KeyboardEvent<SVGSVGElement>) => {
    const step = geo.xMax / 50;
    if (e.key === "ArrowRight" || e.key === "ArrowLeft") {
      e.preventDefault();
      setCursor((c) => Math.min(geo.xMax, Math.max(0, (c ?? 0) + (e.key === "ArrowRight" ? step : -step))));
    } else if (e.key === "Escape") setCursor(null);
  };
  const readout =
    cursor === null
      ? ""
      : `X ${formatNumber(cursor, 3, TABLE_NUMBERS)}, FA0/(−rA) ${show(cursorY ?? 0)} ${unit}` +
        (cursorStage ? `, stage ${cursorStage.index + 1} ${stageTypeName(cursorStage.type)}, ${show(cursorStage.volume)} ${unit}${recycleWords(cursorStage.underCurve)}` : "");

  return (
    <figure className="m-0">
      <div ref={wrapRef} className="w-full" style={{ height: h }}>
        <svg
          width={width}
          height={h}
          role="img"
          aria-label={`${summary}. Use the arrow keys to read values along the curve.`}
          tabIndex={0}
          onKeyDown={onKey}
          onBlur={() => setCursor(null)}
          className="block rounded focus-visible:outline-2 focus-visible:outline-accent-500"
          data-testid="levenspiel-chart"
        >
          <defs>
            {geo.stages.map((s) => (
              <StagePattern key={s.index} id={`${uid}-p${s.index}`} index={s.index} />
            ))}
            <clipPath id={`${uid}-clip`}>
              <rect x={m.left} y={m.top} width={innerW} height={innerH} />
            </clipPath>
          </defs>
          {/* grid and axes */}
          {yTicks.map((t) => (
            <g key={`y${t}`}>
              <line x1={m.left} x2={m.left + innerW} y1={sy(t)} y2={sy(t)} stroke="#eef0f3" />
              <text x={m.left - 6} y={sy(t)} dy="0.32em" textAnchor="end" fontSize={11} fill="#4a5565" className="num">
                {yTick(fromCubicMetres(t, volumeUnit))}
              </text>
            </g>
          ))}
          {xTicks.map((t) => (
            <g key={`x${t}`}>
              <line x1={sx(t)} x2={sx(t)} y1={m.top + innerH} y2={m.top + innerH + 4} stroke="#8a94a3" />
              <text x={sx(t)} y={m.top + innerH + 16} textAnchor="middle" fontSize={11} fill="#4a5565" className="num">
                {xTick(t)}
              </text>
            </g>
          ))}
          <line x1={m.left} x2={m.left + innerW} y1={m.top + innerH} y2={m.top + innerH} stroke="#4a5565" />
          <line x1={m.left} x2={m.left} y1={m.top} y2={m.top + innerH} stroke="#4a5565" />
          <text x={m.left + innerW / 2} y={h - 6} textAnchor="middle" fontSize={12} fill="#1c2430">
            Conversion X
          </text>
          <text transform={`translate(14 ${m.top + innerH / 2}) rotate(-90)`} textAnchor="middle" fontSize={12} fill="#1c2430">
            FA0/(−rA), {unit}
          </text>

          <g clipPath={`url(#${uid}-clip)`}>
            {geo.stages.map((s) => {
              const style = stageStyle(s.index);
              return (
                <g key={s.index} data-testid={`chart-stage-${s.index + 1}`} data-stage-type={s.type}>
                  <path d={path(s.polygon) + "Z"} fill={`url(#${uid}-p${s.index})`} stroke={style.stroke} strokeWidth={1.5} />
                  {s.underCurve ? (
                    // The tube's own area under the curve, from its mixed inlet X_1: (R + 1) times it is the rectangle.
                    <g data-testid={`chart-under-curve-${s.index + 1}`}>
                      <path d={path(s.underCurve.polygon) + "Z"} fill={style.stroke} fillOpacity={0.2} stroke={style.stroke} strokeWidth={1.25} strokeDasharray="5 3" />
                      <line x1={sx(s.underCurve.inletConversion)} x2={sx(s.underCurve.inletConversion)} y1={m.top + innerH} y2={m.top + innerH + 6} stroke={style.stroke} strokeWidth={1.5} />
                    </g>
                  ) : null}
                </g>
              );
            })}
            {geo.curve.length > 1 ? <path d={path(geo.curve)} fill="none" stroke="#1c2430" strokeWidth={1.75} /> : null}
            {target !== undefined ? <Marker x={sx(target)} y1={m.top} y2={m.top + innerH} colour="#115a54" dash="6 3" label={`target ${formatNumber(target, 3, TABLE_NUMBERS)}`} /> : null}
            {equilibrium ? <Marker x={sx(equilibrium)} y1={m.top + 14} y2={m.top + innerH} colour="#9a3412" dash="2 3" label={`equilibrium ${formatNumber(equilibrium, 3, TABLE_NUMBERS)}`} /> : null}
          </g>

          {/* labels above each stage: number, type and volume */}
          {geo.stages.map((s) => {
            const cx = sx((s.conversionIn + s.conversionOut) / 2);
            const tops = s.polygon.map(([, y]) => y).filter((y) => y > 0);
            const low = sy(Math.min(...tops));
            const base = sy(0);
            // Inside the area when it is tall enough, else just above it; narrow neighbours alternate height.
            const inside = base - low > 34;
            const narrow = sx(s.conversionOut) - sx(s.conversionIn) < 48;
            const y = inside ? (base + low) / 2 + 6 : Math.max(m.top + 24, sy(Math.max(...tops)) - 4 - (narrow ? (s.index % 2) * 24 : 0));
            return (
              <text
                key={s.index}
                x={cx}
                y={y}
                textAnchor="middle"
                fontSize={11}
                fill="#1c2430"
                stroke="#ffffff"
                strokeWidth={3}
                paintOrder="stroke"
                className="pointer-events-none"
                data-testid={`chart-label-${s.index + 1}`}
              >
                <tspan x={cx} dy="-1.1em" fontWeight={600}>
                  {stageName(s)}
                </tspan>
                <tspan x={cx} dy="1.2em">
                  {show(s.volume)} {unit}
                </tspan>
              </text>
            );
          })}

          {cursor !== null ? (
            <g className="pointer-events-none">
              <line x1={sx(cursor)} x2={sx(cursor)} y1={m.top} y2={m.top + innerH} stroke="#1c2430" strokeWidth={1} />
              {cursorY !== null ? <circle cx={sx(cursor)} cy={sy(cursorY)} r={3.5} fill="#1c2430" /> : null}
            </g>
          ) : null}
          <rect
            x={m.left}
            y={m.top}
            width={innerW}
            height={innerH}
            fill="transparent"
            onPointerMove={onMove}
            onPointerLeave={() => setCursor(null)}
          />
        </svg>
      </div>
      <figcaption className="mt-1 flex min-h-5 flex-wrap items-center gap-x-4 gap-y-1 text-xs text-ink-soft">
        <span aria-live="polite" className="num text-ink" data-testid="chart-readout">
          {readout || <span className="interaction-hint">Hover or focus the chart and use ← → to read values.</span>}
        </span>
      </figcaption>
    </figure>
  );
}

/** ", R = 0.43, tube from X 0.61" for a tube with recycle; nothing for other stages. */
function recycleWords(u: { recycleRatio: number; inletConversion: number } | undefined): string {
  return u ? `, recycle ratio R = ${formatNumber(u.recycleRatio, 3, TABLE_NUMBERS)}, tube inlet X ${formatNumber(u.inletConversion, 3, TABLE_NUMBERS)}` : "";
}

/** A vertical line across the plot with its label (target, equilibrium). */
function Marker({ x, y1, y2, colour, dash, label }: { x: number; y1: number; y2: number; colour: string; dash: string; label: string }) {
  return (
    <g>
      <line x1={x} x2={x} y1={y1} y2={y2} stroke={colour} strokeWidth={1.5} strokeDasharray={dash} />
      <text x={x - 4} y={y1 + 10} textAnchor="end" fontSize={11} fill={colour}>
        {label}
      </text>
    </g>
  );
}
