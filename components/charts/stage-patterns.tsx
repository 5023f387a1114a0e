import { useId } from "react";
import { stageStyle } from "@/lib/charts/stage-styles";

/** The SVG pattern of a stage's fill (styles in lib/charts/stage-styles.ts, shared with the PDF). */
export function StagePattern({ id, index }: { id: string; index: number }) {
  const { fill, stroke, kind } = stageStyle(index);
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
      <rect x={0.5} y={0.5} width={13} height={13} fill={`url(#${id})`} stroke={stageStyle(index).stroke} />
    </svg>
  );
}
