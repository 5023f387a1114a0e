import { useId } from "react";

/**
 * Fills of the chart's stages: each stage its own colour and its own pattern (hatch direction,
 * dots, grid), so that stages stay apart in grey print and for readers who do not tell the colours apart.
 */
export const STAGE_STYLES = [
  { fill: "#cfe9e5", stroke: "#136f67", kind: "diagonal" },
  { fill: "#fde4c8", stroke: "#b45309", kind: "dots" },
  { fill: "#dde3fb", stroke: "#3f51b5", kind: "antidiagonal" },
  { fill: "#f9d8e4", stroke: "#a21caf", kind: "grid" },
  { fill: "#e4f1cf", stroke: "#4d7c0f", kind: "horizontal" },
  { fill: "#fbe9a8", stroke: "#854d0e", kind: "vertical" },
  { fill: "#dcecf8", stroke: "#0369a1", kind: "cross" },
  { fill: "#ece2f7", stroke: "#6d28d9", kind: "rings" },
] as const;

export function StagePattern({ id, index }: { id: string; index: number }) {
  const { fill, stroke, kind } = STAGE_STYLES[index % STAGE_STYLES.length];
  const line = { stroke, strokeWidth: 1.2, strokeOpacity: 0.75 };
  return (
    <pattern id={id} width={8} height={8} patternUnits="userSpaceOnUse">
      <rect width={8} height={8} fill={fill} />
      {kind === "diagonal" ? <path d="M-2,2 l4,-4 M0,8 l8,-8 M6,10 l4,-4" {...line} /> : null}
      {kind === "antidiagonal" ? <path d="M-2,6 l4,4 M0,0 l8,8 M6,-2 l4,4" {...line} /> : null}
      {kind === "dots" ? <circle cx={4} cy={4} r={1.4} fill={stroke} fillOpacity={0.75} /> : null}
      {kind === "grid" ? <path d="M0,4 h8 M4,0 v8" {...line} /> : null}
      {kind === "horizontal" ? <path d="M0,2 h8 M0,6 h8" {...line} /> : null}
      {kind === "vertical" ? <path d="M2,0 v8 M6,0 v8" {...line} /> : null}
      {kind === "cross" ? <path d="M0,0 l8,8 M8,0 l-8,8" {...line} /> : null}
      {kind === "rings" ? <circle cx={4} cy={4} r={2.2} fill="none" {...line} /> : null}
    </pattern>
  );
}

/** A small swatch of a stage's fill, for legends and stage tables. */
export function StageSwatch({ index, label }: { index: number; label?: string }) {
  const id = `sw${useId().replace(/:/g, "")}`;
  return (
    <svg width={14} height={14} aria-hidden={label ? undefined : true} role={label ? "img" : undefined} aria-label={label} className="inline-block shrink-0 align-[-2px]">
      <defs>
        <StagePattern id={id} index={index} />
      </defs>
      <rect x={0.5} y={0.5} width={13} height={13} fill={`url(#${id})`} stroke={STAGE_STYLES[index % STAGE_STYLES.length].stroke} />
    </svg>
  );
}
